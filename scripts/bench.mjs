// `npm run bench`: the checker's speed and memory (bench/run.ts, no server needed), then the
// editor in headless Chromium against a served build on the test database (bench/editor.ts).
// Prints figures; asserts nothing. Starts what it needs and stops what it started.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { ensureBuild, ensureDebianPackages, ensureDependencies, pidFileAlive, ROOT, run, say, startServer } from './lib.mjs';

const port = Number(process.env.BONDMAP_BENCH_PORT ?? 4393);
let server = null;
const startedDb = !pidFileAlive(join(ROOT, '.data', 'test', 'mariadbd.pid'));
let code = 0;
try {
  ensureDependencies();
  run('npx', ['tsx', 'bench/run.ts']);
  ensureDebianPackages([['/usr/sbin/mariadbd', 'mariadb-server'], ['/usr/bin/chromium', 'chromium']]);
  const envFile = join(ROOT, '.data', 'test-app-env.json');
  run('npx', ['tsx', 'db/cli.ts', 'up', '--profile', 'test', '--env-out', envFile]);
  const dbEnv = JSON.parse(readFileSync(envFile, 'utf8'));
  ensureBuild();
  ({ child: server } = await startServer({ port, env: dbEnv, stdio: ['ignore', 'ignore', 'inherit'] }));
  console.log('\nEditor in headless Chromium (software rendering, no GPU):');
  run('npx', ['tsx', 'bench/editor.ts'], { env: { BONDMAP_TEST_URL: `http://127.0.0.1:${port}` } });
} catch (error) {
  say(error instanceof Error ? error.message : String(error));
  code = 1;
} finally {
  if (server && server.exitCode === null) server.kill('SIGTERM');
  if (startedDb) run('npx', ['tsx', 'db/cli.ts', 'stop', '--profile', 'test']);
}
process.exit(code);

// `npm run bench`: the checker's speed and growth (bench/run.ts, no server needed), then the API
// against a bare baseline (bench/api.ts) and the editor in headless Chromium (bench/editor.ts),
// both against a served build on the test database. Prints figures with their goals; asserts
// nothing. Starts what it needs and stops what it started.
// `npm run bench -- --json`: the last line is one JSON object with every figure (null where one
// could not be measured, with the reason on stderr).
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { ensureBuild, ensureDebianPackages, ensureDependencies, freePort, pidFileAlive, ROOT, run, say, startObjectStore, startServer, stopObjectStore, testPorts } from './lib.mjs';

const KEYS = ['apiPlansRps', 'baselinePlansRps', 'apiPlansRatio', 'apiPlansP99Ms', 'planPageP99Ms', 'check1kMs', 'check10kMs', 'checkGrowth', 'dragP95Ms', 'tabletFirstInteractiveMs', 'tabletCheckRoundTripMs', 'tabletDragP95Ms', 'pngExportMs', 'pdfExportMs', 'editorJsKb'];
const wantJson = process.argv.includes('--json');
// Ports given in the environment win; the rest are free ones (the database's stays while it runs).
const { s3Port, dbPort, taken } = await testPorts(process.env, freePort);
const port = process.env.BONDMAP_BENCH_PORT ? Number(process.env.BONDMAP_BENCH_PORT) : await freePort(taken);
Object.assign(process.env, { BONDMAP_TEST_DB_PORT: String(dbPort), BONDMAP_TEST_S3_PORT: String(s3Port) });
const outDir = join(ROOT, '.data', 'bench');
rmSync(outDir, { recursive: true, force: true });
mkdirSync(outDir, { recursive: true });
const out = (name) => join(outDir, `${name}.json`);
const reasons = {};
// BONDMAP_BENCH_ONLY=api,editor runs only those parts (checker, api, editor).
const only = process.env.BONDMAP_BENCH_ONLY ? process.env.BONDMAP_BENCH_ONLY.split(',').map((s) => s.trim()) : null;
let server = null;
const startedDb = !pidFileAlive(join(ROOT, '.data', 'test', 'mariadbd.pid'));
let code = 0;
let startedStore = false;

/** Runs one part; a part that fails leaves its figures null with the reason, and the rest go on. */
function part(name, keys, args, env = {}) {
  if (only && !only.includes(name)) {
    for (const k of keys) reasons[k] ??= `left out by BONDMAP_BENCH_ONLY=${only.join(',')}`;
    return;
  }
  try {
    run('npx', ['tsx', ...args], { env: { ...env, BONDMAP_BENCH_OUT: out(name) } });
  } catch (error) {
    for (const k of keys) reasons[k] ??= `${name} bench failed: ${error instanceof Error ? error.message : error}`;
    code = 1;
  }
}

try {
  ensureDependencies();
  part('checker', ['check1kMs', 'check10kMs', 'checkGrowth'], ['bench/run.ts']);
  ensureDebianPackages([['/usr/sbin/mariadbd', 'mariadb-server'], ['/usr/bin/chromium', 'chromium']]);
  const envFile = join(ROOT, '.data', 'test-app-env.json');
  // The app refuses to start without its object store (photos); the test profile's local one serves.
  const s3Env = await startObjectStore({ profile: 'test', port: s3Port });
  startedStore = true;
  run('npx', ['tsx', 'db/cli.ts', 'up', '--profile', 'test', '--env-out', envFile], { env: s3Env });
  const dbEnv = JSON.parse(readFileSync(envFile, 'utf8'));
  ensureBuild();
  ({ child: server } = await startServer({ port, env: { ...dbEnv, ...s3Env }, stdio: ['ignore', 'ignore', 'inherit'] }));
  const url = `http://127.0.0.1:${port}`;
  console.log('');
  part('api', ['apiPlansRps', 'baselinePlansRps', 'apiPlansRatio', 'apiPlansP99Ms', 'planPageP99Ms'], ['bench/api.ts'], { ...dbEnv, BONDMAP_TEST_URL: url });
  console.log('\nEditor in headless Chromium (software rendering, no GPU):');
  part('editor', ['dragP95Ms', 'editorJsKb', 'tabletFirstInteractiveMs', 'tabletCheckRoundTripMs', 'tabletDragP95Ms', 'pngExportMs', 'pdfExportMs'], ['bench/browser.ts'], { BONDMAP_TEST_URL: url });
} catch (error) {
  say(error instanceof Error ? error.message : String(error));
  code = 1;
} finally {
  if (server && server.exitCode === null) server.kill('SIGTERM');
  if (startedDb) run('npx', ['tsx', 'db/cli.ts', 'stop', '--profile', 'test']);
  if (startedStore) await stopObjectStore('test').catch((error) => say(`could not stop the object store: ${error.message}`));
}

if (wantJson) {
  const figures = {};
  for (const name of ['checker', 'api', 'editor']) if (existsSync(out(name))) Object.assign(figures, JSON.parse(readFileSync(out(name), 'utf8')));
  const line = {};
  for (const k of KEYS) {
    const v = figures[k];
    line[k] = typeof v === 'number' && Number.isFinite(v) ? v : null;
    if (line[k] === null) console.error(`${k}: null — ${figures.reasons?.[k] ?? reasons[k] ?? 'not measured by this run'}`);
  }
  console.log(JSON.stringify(line));
}
process.exit(code);

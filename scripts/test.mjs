// `npm test`: sets up everything the suite needs on a fresh machine (npm packages; Debian's
// mariadb-server, chromium, ngspice and poppler-utils), starts its own MariaDB with a separate
// database, runs the linter and the type check, unit and component tests, builds and serves the app against the test database,
// runs the API and browser tests, and stops what it started.
import { spawn } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { ensureBuild, ensureDebianPackages, ensureDependencies, freePort, pidFileAlive, ROOT, run, say, startMailCatcher, startObjectStore, startServer, stopMailCatcher, stopObjectStore, testPorts } from './lib.mjs';

// Ports given in the environment win (parallel runs give each its own); the rest are free ones.
const { port, smtpPort, s3Port, dbPort, picked } = await testPorts(process.env, freePort);
if (picked.length) say(`free ports for this run: ${picked.join(', ')}`);
const results = join(ROOT, 'artifacts', 'test-results');
let server = null;
let startedDb = false;

// `npm test -- tests/api/plans tests/e2e/review` runs only the files whose paths contain one of the
// filters (with the same database, build and server) and skips the linter and the type check.
const filters = process.argv.slice(2);

function vitest(projects, env, outFile) {
  const args = ['vitest', 'run', ...projects.flatMap((p) => ['--project', p]), '--reporter=default', '--reporter=json', `--outputFile.json=${outFile}`, ...(filters.length ? ['--passWithNoTests', ...filters] : [])];
  return new Promise((done) => {
    const child = spawn('npx', args, { cwd: ROOT, stdio: 'inherit', env: { ...process.env, ...env } });
    child.on('exit', (code) => done(code ?? 1));
  });
}

function tally(files) {
  let passed = 0;
  let failed = 0;
  let skipped = 0;
  for (const file of files) {
    if (!existsSync(file)) continue;
    const report = JSON.parse(readFileSync(file, 'utf8'));
    passed += report.numPassedTests ?? 0;
    failed += report.numFailedTests ?? 0;
    skipped += (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0);
  }
  return { passed, failed, skipped };
}

async function main() {
  ensureDependencies();
  ensureDebianPackages([
    ['/usr/sbin/mariadbd', 'mariadb-server'],
    ['/usr/bin/chromium', 'chromium'],
    ['/usr/bin/ngspice', 'ngspice'],
    ['/usr/bin/pdftotext', 'poppler-utils'],
  ]);
  rmSync(results, { recursive: true, force: true });
  mkdirSync(results, { recursive: true });

  startedDb = !pidFileAlive(join(ROOT, '.data', 'test', 'mariadbd.pid'));
  // Every child (the database script, the catcher, the tests) reads the same ports.
  Object.assign(process.env, { BONDMAP_TEST_DB_PORT: String(dbPort), BONDMAP_TEST_SMTP_PORT: String(smtpPort), BONDMAP_TEST_S3_PORT: String(s3Port), BONDMAP_TEST_PORT: String(port) });
  // A catcher left from an earlier run may sit on another port; ours, by its pid file.
  if (picked.includes(smtpPort)) await stopMailCatcher('test');
  const envFile = join(ROOT, '.data', 'test-app-env.json');
  // The project's own object store, emptied, before the seed (the demo stores drawn photos in it).
  const s3Env = await startObjectStore({ profile: 'test', port: s3Port, fresh: true });
  // A fresh schema every run, with the invented demo seeded (the browser tests sign in as its people).
  run('npx', ['tsx', 'db/cli.ts', 'reset', '--profile', 'test', '--env-out', envFile], { env: s3Env });
  const dbEnv = JSON.parse(readFileSync(envFile, 'utf8'));

  // Static checks first: the domain fence and the types (astro check covers .astro and .ts alike).
  if (filters.length === 0) {
    run('npx', ['eslint', '.']);
    run('npx', ['astro', 'check', '--minimumSeverity', 'warning']);
  }

  const unitCode = await vitest(['unit', 'components'], {}, join(results, 'unit.json'));

  ensureBuild();
  await startMailCatcher({ profile: 'test', port: smtpPort, env: dbEnv });
  const mailEnv = { BONDMAP_SMTP_URL: `smtp://127.0.0.1:${smtpPort}`, BONDMAP_MAIL_CATCHER: '1', BONDMAP_MAIL_POLL_MS: '300' };
  ({ child: server } = await startServer({ port, env: { ...dbEnv, ...mailEnv, ...s3Env, BONDMAP_PUBLIC_URL: `http://127.0.0.1:${port}`, BONDMAP_TRUST_PROXY: '1', BONDMAP_SERVER_TIMING: '1', BONDMAP_LOG_LEVEL: 'warn' }, stdio: ['ignore', 'ignore', 'inherit'] }));
  const serverEnv = { ...dbEnv, ...s3Env, BONDMAP_TEST_URL: `http://127.0.0.1:${port}`, BONDMAP_TEST_PROFILE: 'test', BONDMAP_TEST_SMTP_PORT: String(smtpPort) };
  const apiCode = await vitest(['api', 'e2e'], serverEnv, join(results, 'server.json'));

  const { passed, failed, skipped } = tally([join(results, 'unit.json'), join(results, 'server.json')]);
  console.log(`\nSuite: ${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
  return unitCode === 0 && apiCode === 0 ? 0 : 1;
}

async function cleanUp() {
  if (server && server.exitCode === null) server.kill('SIGTERM');
  await stopMailCatcher('test').catch((error) => say(`could not stop the mail catcher: ${error.message}`));
  await stopObjectStore('test').catch((error) => say(`could not stop the object store: ${error.message}`));
  if (startedDb) {
    try {
      run('npx', ['tsx', 'db/cli.ts', 'stop', '--profile', 'test']);
    } catch (error) {
      say(`could not stop the test database: ${error.message}`);
    }
  }
}

let code = 1;
try {
  code = await main();
} catch (error) {
  say(error instanceof Error ? error.message : String(error));
} finally {
  await cleanUp();
}
process.exit(code);

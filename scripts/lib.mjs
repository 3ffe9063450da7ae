// Plain-Node helpers shared by scripts/start.mjs and scripts/test.mjs. No dependencies: these run
// before `npm install` has happened.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { createConnection } from 'node:net';
import { join, resolve } from 'node:path';

export const ROOT = resolve(import.meta.dirname, '..');

// The machine's network is closed; Astro's anonymous usage report would only time out.
process.env.ASTRO_TELEMETRY_DISABLED ??= '1';

export function say(message) {
  process.stderr.write(`[bondmap] ${message}\n`);
}

export function run(cmd, args, options = {}) {
  const result = spawnSync(cmd, args, { stdio: 'inherit', cwd: ROOT, ...options, env: { ...process.env, ...options.env } });
  if (result.status !== 0) {
    throw new Error(`${cmd} ${args.join(' ')} exited with ${result.status ?? result.signal}`);
  }
}

/** Installs npm dependencies when node_modules is missing or older than the lock file. */
export function ensureDependencies() {
  const marker = join(ROOT, 'node_modules', '.package-lock.json');
  const lock = join(ROOT, 'package-lock.json');
  if (existsSync(marker) && (!existsSync(lock) || statSync(marker).mtimeMs >= statSync(lock).mtimeMs)) return;
  say('installing npm dependencies…');
  run('npm', [existsSync(lock) ? 'ci' : 'install', '--no-audit', '--no-fund']);
}

function hasCommand(path) {
  return existsSync(path);
}

/** Installs Debian packages for missing commands (as root); otherwise says what to install. */
export function ensureDebianPackages(wanted) {
  const missing = wanted.filter(([path]) => !hasCommand(path)).map(([, pkg]) => pkg);
  if (missing.length === 0) return;
  if (process.getuid?.() !== 0) {
    throw new Error(`missing Debian packages: ${missing.join(' ')}. Install them with: sudo apt-get install -y ${missing.join(' ')}`);
  }
  say(`installing Debian packages: ${missing.join(' ')}…`);
  run('apt-get', ['update', '-qq']);
  run('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...missing], { env: { DEBIAN_FRONTEND: 'noninteractive' } });
}

function newestMtime(dir) {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    if (entry.name === 'node_modules' || entry.name.startsWith('.')) continue;
    const full = join(dir, entry.name);
    newest = Math.max(newest, entry.isDirectory() ? newestMtime(full) : statSync(full).mtimeMs);
  }
  return newest;
}

/** Builds the app unless dist/ is newer than every source file. */
export function ensureBuild() {
  const entry = join(ROOT, 'dist', 'server', 'serve.mjs');
  const sources = ['src', 'public', 'db', 'astro.config.mjs', 'tailwind.config.cjs', 'package-lock.json']
    .map((p) => join(ROOT, p))
    .filter(existsSync)
    .map((p) => (statSync(p).isDirectory() ? newestMtime(p) : statSync(p).mtimeMs));
  if (existsSync(entry) && statSync(entry).mtimeMs > Math.max(...sources)) {
    say('the build is up to date');
    return;
  }
  say('building the app…');
  run('npx', ['astro', 'build']);
  run(process.execPath, [join(ROOT, 'scripts', 'build-worker.mjs')]);
}

/** Starts the built server; resolves once /api/health answers 200. */
export async function startServer({ port, env, stdio = 'inherit' }) {
  // Another server on the port would answer the health check in this one's place.
  if (await portOpen(port)) throw new Error(`port ${port} is already in use; stop what runs there or choose another port`);
  // The health answer must carry this start's token: proof that the server answering is this child.
  const { randomBytes } = await import('node:crypto');
  const instance = randomBytes(12).toString('hex');
  const child = spawn(process.execPath, [join(ROOT, 'dist', 'server', 'serve.mjs')], {
    cwd: ROOT,
    env: { ...process.env, ...env, HOST: '127.0.0.1', PORT: String(port), BONDMAP_INSTANCE: instance },
    stdio,
  });
  const url = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`the app server exited with ${child.exitCode}`);
    const response = await fetch(`${url}/api/health`).catch(() => null); // null: not listening yet
    const answeredBy = response?.headers.get('x-bondmap-instance');
    if (response && answeredBy !== instance) {
      child.kill();
      throw new Error(`port ${port} answers, but not as the server just started (instance ${answeredBy ?? 'none'}); stop what runs there or choose another port`);
    }
    if (response?.ok) return { child, url };
    await new Promise((r) => setTimeout(r, 200));
  }
  child.kill();
  throw new Error('the app server did not become healthy within 60 s');
}

export function pidAlive(pid) {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

/** True when something accepts TCP connections on 127.0.0.1:port. */
export function portOpen(port) {
  return new Promise((done) => {
    const socket = createConnection({ host: '127.0.0.1', port });
    socket.once('connect', () => {
      socket.destroy();
      done(true);
    });
    socket.once('error', () => done(false));
  });
}

/**
 * A port nothing listens on now, for a part started without a port given in the environment. It is
 * drawn at random from 20000–31999, below the range Linux hands out to outgoing connections
 * (32768+), so a connection made meanwhile cannot take it; it must bind on 127.0.0.1 and refuse a
 * connection. `taken` holds the ports this run has drawn already.
 */
export async function freePort(taken = new Set()) {
  const { createServer } = await import('node:net');
  const binds = (port) =>
    new Promise((done) => {
      const probe = createServer();
      probe.once('error', () => done(false));
      probe.listen({ port, host: '127.0.0.1', exclusive: true }, () => probe.close(() => done(true)));
    });
  for (let tries = 0; tries < 200; tries += 1) {
    const port = 20000 + Math.floor(Math.random() * 12000);
    if (taken.has(port)) continue;
    if ((await binds(port)) && !(await portOpen(port))) {
      taken.add(port);
      return port;
    }
  }
  throw new Error('found no free port in 20000–31999');
}

/**
 * The test run's ports: each from its environment variable when given, else a free one — except
 * the database's while this checkout's test MariaDB still runs (it keeps the port it was started
 * on, recorded with its credentials). `picked` lists the ports drawn here, `taken` every port named.
 */
export async function testPorts(env, pick) {
  const credentials = join(ROOT, '.data', 'test', 'credentials.json');
  const runningDb = pidFileAlive(join(ROOT, '.data', 'test', 'mariadbd.pid')) && existsSync(credentials) ? String(JSON.parse(readFileSync(credentials, 'utf8')).port) : undefined;
  const names = { port: env.BONDMAP_TEST_PORT, smtpPort: env.BONDMAP_TEST_SMTP_PORT, s3Port: env.BONDMAP_TEST_S3_PORT, dbPort: env.BONDMAP_TEST_DB_PORT || runningDb };
  // Every given port is named before any is drawn, so a drawn one never lands on a given one.
  const taken = new Set(Object.values(names).filter(Boolean).map(Number));
  const picked = [];
  const choose = async (given) => {
    if (given) return Number(given);
    const port = await pick(taken);
    picked.push(port);
    return port;
  };
  return { port: await choose(names.port), smtpPort: await choose(names.smtpPort), s3Port: await choose(names.s3Port), dbPort: await choose(names.dbPort), picked, taken };
}

const helperPidFile = (profile, name) => join(ROOT, '.data', profile, `${name}.pid`);

/** Starts a detached helper process with a pid file and a log under .data/<profile>/. */
async function spawnHelper({ profile, name, args, env }) {
  const { openSync, writeFileSync, mkdirSync } = await import('node:fs');
  mkdirSync(join(ROOT, '.data', profile), { recursive: true });
  const out = openSync(join(ROOT, '.data', profile, `${name}.log`), 'a');
  const child = spawn(process.execPath, args, { cwd: ROOT, env: { ...process.env, ...env }, detached: true, stdio: ['ignore', out, out] });
  child.unref();
  writeFileSync(helperPidFile(profile, name), String(child.pid));
}

async function waitFor(check, what) {
  const deadline = Date.now() + 30_000;
  while (Date.now() < deadline) {
    if (await check()) return;
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error(what);
}

/** Stops a helper this project started, by its pid file; false when none of ours was running. */
async function stopHelper(profile, name) {
  const { readFileSync: read, rmSync } = await import('node:fs');
  const pidFile = helperPidFile(profile, name);
  if (!existsSync(pidFile)) return false;
  const pid = Number(read(pidFile, 'utf8'));
  rmSync(pidFile, { force: true });
  if (!pidAlive(pid)) return false;
  process.kill(pid, 'SIGTERM');
  const deadline = Date.now() + 10_000;
  while (pidAlive(pid) && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
  if (pidAlive(pid)) process.kill(pid, 'SIGKILL');
  return true;
}

/** The first line an SMTP server on 127.0.0.1:port sends ('' when nothing answers within 2 s). */
export function smtpGreeting(port) {
  return new Promise((done) => {
    const socket = createConnection({ host: '127.0.0.1', port });
    let text = '';
    const finish = () => {
      socket.destroy();
      done(text.split('\r\n')[0]);
    };
    socket.setTimeout(2000, finish);
    socket.on('data', (chunk) => {
      text += chunk.toString('utf8');
      if (text.includes('\r\n')) finish();
    });
    socket.once('error', () => done(''));
  });
}

/**
 * Starts (or reuses) the local SMTP catcher for a profile; resolves once it answers. A catcher is
 * reused only when its pid file names a live process AND the greeting on the port carries the
 * token this checkout gave it at start; anything else on the port is refused, saying so.
 */
export async function startMailCatcher({ profile, port, env }) {
  const { readFileSync: read, writeFileSync, mkdirSync } = await import('node:fs');
  const { randomBytes } = await import('node:crypto');
  const tokenFile = join(ROOT, '.data', profile, 'mail-catcher.token');
  const ours = (greeting) => existsSync(tokenFile) && greeting.includes(read(tokenFile, 'utf8').trim());
  const greeting = await smtpGreeting(port);
  if (pidFileAlive(helperPidFile(profile, 'mail-catcher')) && greeting && ours(greeting)) return;
  if (greeting || (await portOpen(port))) {
    throw new Error(`port ${port} answers (${greeting ? `"${greeting}"` : 'no SMTP greeting'}), but not as this checkout's mail catcher; stop what runs there or set ${profile === 'dev' ? 'BONDMAP_SMTP_PORT' : 'BONDMAP_TEST_SMTP_PORT'} to a free port`);
  }
  mkdirSync(join(ROOT, '.data', profile), { recursive: true });
  const token = randomBytes(12).toString('hex');
  writeFileSync(tokenFile, token, { mode: 0o600 });
  await spawnHelper({ profile, name: 'mail-catcher', args: ['--import', 'tsx', join(ROOT, 'scripts', 'mail-catcher.ts')], env: { ...env, BONDMAP_SMTP_PORT: String(port), BONDMAP_CATCHER_TOKEN: token } });
  await waitFor(async () => ours(await smtpGreeting(port)), `the local mail catcher did not answer with its token on port ${port}; see .data/${profile}/mail-catcher.log`);
}

/** Stops the catcher this project started for the profile, by its pid file. */
export function stopMailCatcher(profile) {
  return stopHelper(profile, 'mail-catcher');
}

const FAKE_KEYS = { BONDMAP_S3_ACCESS_KEY_ID: 'S3RVER', BONDMAP_S3_SECRET_ACCESS_KEY: 'S3RVER', BONDMAP_S3_REGION: 'us-east-1' };

/**
 * True when the store on the port lists the handshake bucket named from our token. Plain
 * node:http, not fetch: fetch refuses some ports outright (5061, for one).
 */
async function objectStoreAnswers(port, token) {
  const { get } = await import('node:http');
  return new Promise((done) => {
    const request = get({ host: '127.0.0.1', port, path: '/', timeout: 2000 }, (response) => {
      let body = '';
      response.setEncoding('utf8');
      response.on('data', (chunk) => (body += chunk));
      response.on('end', () => done(response.statusCode === 200 && body.includes(`<Name>bondmap-handshake-${token}</Name>`)));
    });
    request.on('timeout', () => request.destroy());
    request.on('error', () => done(false));
  });
}

/**
 * Starts (or reuses) the local S3-compatible store (s3rver) for a profile and returns the app's
 * settings for it. A process on the port that does not answer our handshake is refused.
 */
export async function startObjectStore({ profile, port, bucket = 'bondmap-photos', fresh = false }) {
  const { readFileSync: read, writeFileSync, rmSync, mkdirSync } = await import('node:fs');
  const { randomBytes } = await import('node:crypto');
  const env = { ...FAKE_KEYS, BONDMAP_S3_ENDPOINT: `http://127.0.0.1:${port}`, BONDMAP_S3_BUCKET: bucket };
  const tokenFile = join(ROOT, '.data', profile, 'object-store.token');
  const running = pidFileAlive(helperPidFile(profile, 'object-store'));
  if (running && existsSync(tokenFile) && (await objectStoreAnswers(port, read(tokenFile, 'utf8').trim()))) {
    if (!fresh) return env;
    await stopHelper(profile, 'object-store');
  } else if (running) {
    await stopHelper(profile, 'object-store');
  }
  if (await portOpen(port)) throw new Error(`port ${port} is taken by something that is not this project's object store; stop it or set another port`);
  const directory = join(ROOT, '.data', profile, 'objects');
  if (fresh) rmSync(directory, { recursive: true, force: true });
  mkdirSync(directory, { recursive: true });
  const token = randomBytes(8).toString('hex');
  writeFileSync(tokenFile, token);
  await spawnHelper({
    profile,
    name: 'object-store',
    args: [join(ROOT, 'scripts', 'object-store-fake.mjs')],
    env: { BONDMAP_S3_FAKE_PORT: String(port), BONDMAP_S3_FAKE_DIR: directory, BONDMAP_S3_BUCKET: bucket, BONDMAP_S3_FAKE_TOKEN: token },
  });
  await waitFor(() => objectStoreAnswers(port, token), `the local object store did not start on port ${port}; see .data/${profile}/object-store.log`);
  return env;
}

export function stopObjectStore(profile) {
  return stopHelper(profile, 'object-store');
}

/** True when the pid file names a live process (a stale file after a reboot does not count). */
export function pidFileAlive(file) {
  if (!existsSync(file)) return false;
  const pid = Number(readFileSync(file, 'utf8').trim());
  return Number.isInteger(pid) && pid > 0 && pidAlive(pid);
}

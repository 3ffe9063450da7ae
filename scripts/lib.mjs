// Plain-Node helpers shared by scripts/start.mjs and scripts/test.mjs. No dependencies: these run
// before `npm install` has happened.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';

export const ROOT = resolve(import.meta.dirname, '..');

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
  const entry = join(ROOT, 'dist', 'server', 'entry.mjs');
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
}

/** Starts the built server; resolves once /api/health answers 200. */
export async function startServer({ port, env, stdio = 'inherit' }) {
  const child = spawn(process.execPath, [join(ROOT, 'dist', 'server', 'entry.mjs')], {
    cwd: ROOT,
    env: { ...process.env, ...env, HOST: '127.0.0.1', PORT: String(port) },
    stdio,
  });
  const url = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`the app server exited with ${child.exitCode}`);
    try {
      const response = await fetch(`${url}/api/health`);
      if (response.ok) return { child, url };
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  child.kill();
  throw new Error('the app server did not become healthy within 60 s');
}

/**
 * The project's own MariaDB: installed from Debian when missing, a data directory under
 * .data/<profile>/, one mariadbd on 127.0.0.1 on its own port, tracked by its pid file.
 * Never touches a MariaDB it did not start (no kill by name, never port 3306 by default).
 */
import { spawn, spawnSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, openSync, readFileSync, writeFileSync, rmSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { portOpen } from '../scripts/lib.mjs';

export type Profile = 'dev' | 'test';

export interface DbCredentials {
  host: string;
  port: number;
  database: string;
  user: string;
  password: string;
}

interface ProfileConfig {
  dir: string;
  port: number;
  database: string;
}

const ROOT = resolve(import.meta.dirname, '..');

export function profileConfig(profile: Profile): ProfileConfig {
  const dir = join(ROOT, '.data', profile);
  if (profile === 'dev') {
    return { dir, port: Number(process.env.BONDMAP_DB_PORT ?? 3307), database: process.env.BONDMAP_DB_NAME ?? 'bondmap' };
  }
  return { dir, port: Number(process.env.BONDMAP_TEST_DB_PORT ?? 3308), database: 'bondmap_test' };
}

const paths = (dir: string) => ({
  data: join(dir, 'mysql'),
  socket: join(dir, 'mariadbd.sock'),
  pid: join(dir, 'mariadbd.pid'),
  log: join(dir, 'mariadbd.log'),
  credentials: join(dir, 'credentials.json'),
});

function log(message: string): void {
  process.stderr.write(`[db] ${message}\n`);
}

function findBinary(name: string): string | null {
  for (const dir of [...(process.env.PATH ?? '').split(':'), '/usr/sbin', '/usr/bin', '/sbin']) {
    if (dir && existsSync(join(dir, name))) return join(dir, name);
  }
  return null;
}

/** Installs Debian's mariadb-server when mariadbd is missing (as root), or explains what to install. */
export function ensureMariadbInstalled(): void {
  if (findBinary('mariadbd') && findBinary('mariadb-install-db')) return;
  if (process.getuid?.() !== 0) {
    throw new Error('mariadbd is not installed. Install Debian\'s MariaDB server first: sudo apt-get install -y mariadb-server');
  }
  log('mariadbd not found; installing mariadb-server with apt-get (once)…');
  run('apt-get', ['update', '-qq']);
  run('apt-get', ['install', '-y', '-qq', 'mariadb-server'], { DEBIAN_FRONTEND: 'noninteractive' });
  if (!findBinary('mariadbd')) throw new Error('apt-get finished but mariadbd is still missing');
}

function run(cmd: string, args: string[], env: Record<string, string> = {}): string {
  const result = spawnSync(cmd, args, { encoding: 'utf8', env: { ...process.env, ...env } });
  if (result.status !== 0) {
    throw new Error(`${cmd} ${args.join(' ')} failed (${result.status}): ${result.stderr || result.stdout}`);
  }
  return result.stdout;
}

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

/** A pid file can outlive its process and the pid be reused: only a mariadbd on our data directory counts. */
function isOurServer(pid: number, dataDir: string): boolean {
  if (!isAlive(pid)) return false;
  try {
    const cmdline = readFileSync(`/proc/${pid}/cmdline`, 'utf8');
    return cmdline.includes('mariadbd') && cmdline.includes(dataDir);
  } catch {
    return true; // no /proc: trust the pid file
  }
}

function readPid(file: string): number | null {
  if (!existsSync(file)) return null;
  const pid = Number(readFileSync(file, 'utf8').trim());
  return Number.isInteger(pid) && pid > 0 ? pid : null;
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

function sql(socket: string, statements: string): void {
  run(findBinary('mariadb') ?? 'mariadb', ['--no-defaults', `--socket=${socket}`, '-uroot', '-e', statements]);
}

/** True when our mariadbd for this profile is running (pid file names a live process). */
export function isRunning(profile: Profile): boolean {
  const p = paths(profileConfig(profile).dir);
  const pid = readPid(p.pid);
  return pid !== null && isOurServer(pid, p.data);
}

/**
 * Starts (or reuses) the profile's mariadbd, makes sure the database and the application user
 * exist, and returns the application's credentials. Idempotent.
 */
export async function startDatabase(profile: Profile): Promise<DbCredentials> {
  const config = profileConfig(profile);
  const p = paths(config.dir);
  ensureMariadbInstalled();
  mkdirSync(config.dir, { recursive: true });

  if (!existsSync(join(p.data, 'mysql'))) {
    log(`initialising a data directory in ${p.data}`);
    rmSync(p.data, { recursive: true, force: true });
    run(findBinary('mariadb-install-db')!, ['--no-defaults', `--datadir=${p.data}`, '--user=root', '--skip-test-db', '--auth-root-authentication-method=socket']);
  }

  const pid = readPid(p.pid);
  if (pid !== null && isOurServer(pid, p.data)) {
    log(`reusing mariadbd (pid ${pid}) on 127.0.0.1:${config.port}`);
  } else {
    if (await portOpen(config.port)) {
      throw new Error(`port ${config.port} is taken by another program; set ${profile === 'dev' ? 'BONDMAP_DB_PORT' : 'BONDMAP_TEST_DB_PORT'} to a free port`);
    }
    log(`starting mariadbd on 127.0.0.1:${config.port}`);
    const out = openSync(p.log, 'a');
    const child = spawn(
      findBinary('mariadbd')!,
      [
        '--no-defaults',
        '--user=root',
        `--datadir=${p.data}`,
        `--port=${config.port}`,
        '--bind-address=127.0.0.1',
        `--socket=${p.socket}`,
        `--pid-file=${p.pid}`,
        '--skip-name-resolve',
        '--innodb-buffer-pool-size=128M',
        '--max-connections=200',
        '--character-set-server=utf8mb4',
        '--collation-server=utf8mb4_unicode_ci',
      ],
      { detached: true, stdio: ['ignore', out, out] },
    );
    child.unref();
    writeFileSync(p.pid, String(child.pid));
  }
  await waitUntilAnswering(config.port, p.socket);
  const credentials = ensureAppUser(config, p.socket, p.credentials);
  verifyOwnServer(credentials, p.data, profile);
  return credentials;
}

/**
 * The handshake: the pid file says our mariadbd runs, but only an answer on the TCP port the app
 * will use, accepting this checkout's generated credentials and naming this checkout's data
 * directory, proves that the port is ours (and not another checkout's or the system's MariaDB).
 */
function verifyOwnServer(c: DbCredentials, dataDir: string, profile: Profile): void {
  const answer = spawnSync(findBinary('mariadb') ?? 'mariadb', ['--no-defaults', '-h', c.host, '-P', String(c.port), '-u', c.user, '-N', '-B', '-e', 'SELECT @@datadir'], {
    encoding: 'utf8',
    env: { ...process.env, MYSQL_PWD: c.password },
  });
  const answered = answer.stdout.trim().replace(/\/+$/, '');
  if (answer.status !== 0 || resolve(answered) !== resolve(dataDir)) {
    const why = answer.status !== 0 ? `it refused this checkout's credentials (${answer.stderr.trim()})` : `it serves ${answered}, not ${dataDir}`;
    throw new Error(
      `port ${c.port} answers, but not as this checkout's MariaDB: ${why}. Stop whatever listens there, or set ${profile === 'dev' ? 'BONDMAP_DB_PORT' : 'BONDMAP_TEST_DB_PORT'} to a free port.`,
    );
  }
}

async function waitUntilAnswering(port: number, socket: string): Promise<void> {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if ((await portOpen(port)) && existsSync(socket)) {
      const ping = spawnSync(findBinary('mariadb-admin') ?? 'mariadb-admin', ['--no-defaults', `--socket=${socket}`, '-uroot', 'ping'], { encoding: 'utf8' });
      if (ping.status === 0) return;
    }
    await sleep(250);
  }
  throw new Error(`mariadbd did not answer on port ${port} within 60 s; see its log under .data/`);
}

function ensureAppUser(config: ProfileConfig, socket: string, file: string): DbCredentials {
  let credentials: DbCredentials;
  if (existsSync(file)) {
    credentials = { ...JSON.parse(readFileSync(file, 'utf8')), port: config.port, database: config.database };
  } else {
    credentials = {
      host: '127.0.0.1',
      port: config.port,
      database: config.database,
      user: 'bondmap_app',
      password: randomBytes(18).toString('base64url'),
    };
  }
  writeFileSync(file, JSON.stringify(credentials, null, 2), { mode: 0o600 });
  const db = `\`${config.database.replace(/`/g, '')}\``;
  const pw = credentials.password.replace(/'/g, "''");
  sql(
    socket,
    [
      `CREATE DATABASE IF NOT EXISTS ${db} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
      `CREATE USER IF NOT EXISTS '${credentials.user}'@'127.0.0.1' IDENTIFIED BY '${pw}'`,
      `ALTER USER '${credentials.user}'@'127.0.0.1' IDENTIFIED BY '${pw}'`,
      `GRANT ALL PRIVILEGES ON ${db}.* TO '${credentials.user}'@'127.0.0.1'`,
      'FLUSH PRIVILEGES',
    ].join(';'),
  );
  return credentials;
}

/** Drops and recreates the profile's database (tests start from an empty schema). */
export function resetDatabase(profile: Profile): void {
  const config = profileConfig(profile);
  const db = `\`${config.database.replace(/`/g, '')}\``;
  sql(paths(config.dir).socket, `DROP DATABASE IF EXISTS ${db}; CREATE DATABASE ${db} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
}

/** Stops the mariadbd this project started for the profile, by its pid file; a no-op when none runs. */
export async function stopDatabase(profile: Profile): Promise<boolean> {
  const p = paths(profileConfig(profile).dir);
  const pid = readPid(p.pid);
  if (pid === null || !isOurServer(pid, p.data)) return false;
  process.kill(pid, 'SIGTERM');
  const deadline = Date.now() + 30_000;
  while (isAlive(pid) && Date.now() < deadline) await sleep(100);
  if (isAlive(pid)) process.kill(pid, 'SIGKILL');
  return true;
}

/** The environment the app reads its database settings from (src/lib/server/settings.ts). */
export function credentialsEnv(c: DbCredentials): Record<string, string> {
  return {
    BONDMAP_DB_HOST: c.host,
    BONDMAP_DB_PORT: String(c.port),
    BONDMAP_DB_NAME: c.database,
    BONDMAP_DB_USER: c.user,
    BONDMAP_DB_PASSWORD: c.password,
  };
}

/**
 * Database settings from the environment, parsed once. `npm start` and `npm test` set them
 * from the credentials their MariaDB lifecycle wrote; `astro dev` falls back to that file.
 */
import { existsSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { z } from 'zod';

const schema = z.object({
  BONDMAP_DB_HOST: z.string().min(1).default('127.0.0.1'),
  BONDMAP_DB_PORT: z.coerce.number().int().min(1).max(65535).default(3307),
  BONDMAP_DB_NAME: z.string().min(1).default('bondmap'),
  BONDMAP_DB_USER: z.string().min(1),
  BONDMAP_DB_PASSWORD: z.string(),
  BONDMAP_DB_POOL_MAX: z.coerce.number().int().min(1).max(200).default(10),
});

export interface DbConfig {
  host: string;
  port: number;
  database: string;
  user: string;
  password: string;
  poolMax: number;
}

function fromCredentialsFile(): Record<string, string> {
  const file = join(resolve(process.cwd()), '.data', 'dev', 'credentials.json');
  if (!existsSync(file)) return {};
  const c = JSON.parse(readFileSync(file, 'utf8'));
  return { BONDMAP_DB_USER: c.user, BONDMAP_DB_PASSWORD: c.password, BONDMAP_DB_PORT: String(c.port), BONDMAP_DB_NAME: c.database };
}

/** Reads and validates the database settings; throws naming each bad variable. */
export function readDbConfig(env: NodeJS.ProcessEnv = process.env): DbConfig {
  const source = env.BONDMAP_DB_USER ? env : { ...fromCredentialsFile(), ...env };
  const parsed = schema.safeParse(source);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ');
    throw new Error(`Database settings are incomplete (${problems}). Start the app with npm start, which sets them.`);
  }
  const e = parsed.data;
  return { host: e.BONDMAP_DB_HOST, port: e.BONDMAP_DB_PORT, database: e.BONDMAP_DB_NAME, user: e.BONDMAP_DB_USER, password: e.BONDMAP_DB_PASSWORD, poolMax: e.BONDMAP_DB_POOL_MAX };
}

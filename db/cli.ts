/**
 * Database commands: `up` (start or reuse MariaDB, migrate, seed), `start`, `stop`, `migrate`,
 * `seed`, `reset`. `--profile dev|test` picks the data directory; `--env-out FILE` writes the
 * app's connection settings as JSON for the scripts that start the server.
 */
import { writeFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { createDb } from './connection';
import { credentialsEnv, resetDatabase, startDatabase, stopDatabase, type DbCredentials, type Profile } from './lifecycle';
import { migrateUp } from './migrator';
import { seedDemo } from './seeders/demo';

const { values, positionals } = parseArgs({
  allowPositionals: true,
  options: { profile: { type: 'string', default: process.env.BONDMAP_PROFILE ?? 'dev' }, 'env-out': { type: 'string' }, 'no-seed': { type: 'boolean', default: false } },
});
const profile = values.profile as Profile;
if (profile !== 'dev' && profile !== 'test') {
  console.error(`--profile must be dev or test, not "${values.profile}"`);
  process.exit(2);
}

async function migrateAndSeed(credentials: DbCredentials, seed: boolean): Promise<void> {
  const db = createDb({ ...credentials, poolMax: 2 });
  try {
    const applied = await migrateUp(db.sequelize);
    if (applied.length) console.error(`[db] applied migrations: ${applied.join(', ')}`);
    if (seed) {
      const added = await seedDemo(db);
      console.error(`[db] demo data: ${added.people} people and ${added.plans} plans added`);
    }
  } finally {
    await db.sequelize.close();
  }
}

async function main(command: string | undefined): Promise<void> {
  const seed = !values['no-seed'] && process.env.BONDMAP_DEMO !== '0';
  switch (command) {
    case 'up': {
      const credentials = await startDatabase(profile);
      await migrateAndSeed(credentials, seed);
      if (values['env-out']) writeFileSync(values['env-out'], JSON.stringify(credentialsEnv(credentials)), { mode: 0o600 });
      return;
    }
    case 'start':
      await startDatabase(profile);
      return;
    case 'stop':
      console.error((await stopDatabase(profile)) ? `[db] stopped the ${profile} MariaDB` : `[db] no ${profile} MariaDB of ours was running`);
      return;
    case 'migrate':
      await migrateAndSeed(await startDatabase(profile), false);
      return;
    case 'seed':
      await migrateAndSeed(await startDatabase(profile), true);
      return;
    case 'reset': {
      await startDatabase(profile);
      resetDatabase(profile);
      const credentials = await startDatabase(profile);
      await migrateAndSeed(credentials, seed);
      if (values['env-out']) writeFileSync(values['env-out'], JSON.stringify(credentialsEnv(credentials)), { mode: 0o600 });
      return;
    }
    default:
      console.error('usage: tsx db/cli.ts up|start|stop|migrate|seed|reset [--profile dev|test] [--env-out FILE] [--no-seed]');
      process.exit(2);
  }
}

main(positionals[0]).catch((error) => {
  console.error(`[db] ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});

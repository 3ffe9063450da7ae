/** Schema migrations with umzug over Sequelize's query interface; the app never calls sync(). */
import { join } from 'node:path';
import { SequelizeStorage, Umzug } from 'umzug';
import type { Sequelize } from 'sequelize';

export function createMigrator(sequelize: Sequelize) {
  return new Umzug({
    migrations: { glob: ['migrations/*.ts', { cwd: join(import.meta.dirname) }] },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

/** Applies every pending migration; returns the names applied. */
export async function migrateUp(sequelize: Sequelize): Promise<string[]> {
  const applied = await createMigrator(sequelize).up();
  return applied.map((m) => m.name);
}

/** One Sequelize instance per process, created on first use, with short time-outs so an
 * unreachable database turns into a fast 503 rather than a hung request. */
import { Sequelize } from 'sequelize';
import { readDbConfig, type DbConfig } from './config';
import { defineModels, type Models } from './models';

export interface Db {
  sequelize: Sequelize;
  models: Models;
}

let current: Db | null = null;

export function createDb(config: DbConfig): Db {
  const sequelize = new Sequelize(config.database, config.user, config.password, {
    host: config.host,
    port: config.port,
    dialect: 'mariadb',
    logging: false,
    timezone: '+00:00',
    pool: { max: config.poolMax, min: Math.min(2, config.poolMax), acquire: 4000, idle: 60000, evict: 5000 },
    dialectOptions: { connectTimeout: 2000 },
    define: { underscored: true, timestamps: true },
    retry: { max: 0 },
  });
  return { sequelize, models: defineModels(sequelize) };
}

/** The process-wide database handle (settings from the environment). */
export function getDb(): Db {
  current ??= createDb(readDbConfig());
  return current;
}

export async function closeDb(): Promise<void> {
  if (current) await current.sequelize.close();
  current = null;
}

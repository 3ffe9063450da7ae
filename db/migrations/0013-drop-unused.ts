/**
 * Dead schema out: `login_attempts` (sign-in throttling moved to `throttle_buckets` in 0004; nothing
 * reads or writes the old table) and `plans.lock_version` (written by the first saves, never read;
 * the plan's row lock and revision numbers guard concurrent saves). `down` puts both back empty
 * (the old rows are not kept: nothing used them).
 */
import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

// Plain DDL: Sequelize's removeColumn first reads foreign keys on its raw-query path, which breaks
// on the mariadb connector's result arrays (DEVELOPERS.md, "Raw SQL goes through typed queries").
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE IF EXISTS login_attempts');
  await qi.sequelize.query('ALTER TABLE plans DROP COLUMN lock_version');
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn('plans', 'lock_version', { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 });
  await qi.createTable('login_attempts', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false },
    at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('login_attempts', ['email', 'at']);
};

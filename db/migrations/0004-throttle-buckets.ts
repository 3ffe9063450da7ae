/** Counters for throttling sign-in, reset requests and set-password, one row per bucket. */
import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable('throttle_buckets', {
    // "<action>:<kind>:" + SHA-256 of the e-mail or client address, so the key length is bounded.
    bucket: { type: DataTypes.STRING(120), primaryKey: true },
    hits: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    window_started: { type: DataTypes.DATE(3), allowNull: false },
    last_hit_at: { type: DataTypes.DATE(3), allowNull: true },
  });
  await qi.addIndex('throttle_buckets', ['window_started']);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.dropTable('throttle_buckets');
};

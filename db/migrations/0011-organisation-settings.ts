/**
 * General organisation settings beside the equipment ones: the time zone pages show times in, the
 * paper size prints default to and the units the crew reads by default. The test interval becomes
 * nullable so saving only these does not count as choosing an interval (null = not chosen yet).
 */
import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.changeColumn('organization_settings', 'test_interval_months', { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, defaultValue: null });
  // Null: not chosen; the server's own zone is shown until an admin picks one.
  await qi.addColumn('organization_settings', 'time_zone', { type: DataTypes.STRING(64), allowNull: true });
  await qi.addColumn('organization_settings', 'paper_size', { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'letter' });
  await qi.addColumn('organization_settings', 'units', { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'imperial' });
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.removeColumn('organization_settings', 'units');
  await qi.removeColumn('organization_settings', 'paper_size');
  await qi.removeColumn('organization_settings', 'time_zone');
  await qi.sequelize.query('UPDATE organization_settings SET test_interval_months = 12 WHERE test_interval_months IS NULL');
  await qi.changeColumn('organization_settings', 'test_interval_months', { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 12 });
};

/**
 * The library reads what it shows from the approval: the approved document's title, its tags, the structure's material and the
 * findings fixed along the way are stored on the approving decision (JSON lists; null until
 * filled — rows approved before this migration are filled the first time the library reads
 * them). `plans.lock_version` goes: it was written on every save and never read.
 */
import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn('plan_decisions', 'title', { type: DataTypes.STRING(200), allowNull: true });
  await qi.addColumn('plan_decisions', 'library_tags', { type: DataTypes.TEXT, allowNull: true });
  await qi.addColumn('plan_decisions', 'material', { type: DataTypes.STRING(40), allowNull: true });
  await qi.addColumn('plan_decisions', 'fixed_rules', { type: DataTypes.TEXT, allowNull: true });
  await qi.removeColumn('plans', 'lock_version');
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn('plans', 'lock_version', { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 });
  await qi.removeColumn('plan_decisions', 'fixed_rules');
  await qi.removeColumn('plan_decisions', 'material');
  await qi.removeColumn('plan_decisions', 'library_tags');
  await qi.removeColumn('plan_decisions', 'title');
};

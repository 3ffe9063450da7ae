/**
 * The library reads what it shows from the approval: the approved document's title, its tags, the structure's material and the
 * findings fixed along the way are stored on the approving decision (JSON lists; null until
 * filled — rows approved before this migration are filled the first time the library reads
 * them).
 */
import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn('plan_decisions', 'title', { type: DataTypes.STRING(200), allowNull: true });
  await qi.addColumn('plan_decisions', 'library_tags', { type: DataTypes.TEXT, allowNull: true });
  await qi.addColumn('plan_decisions', 'material', { type: DataTypes.STRING(40), allowNull: true });
  await qi.addColumn('plan_decisions', 'fixed_rules', { type: DataTypes.TEXT, allowNull: true });
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.removeColumn('plan_decisions', 'fixed_rules');
  await qi.removeColumn('plan_decisions', 'material');
  await qi.removeColumn('plan_decisions', 'library_tags');
  await qi.removeColumn('plan_decisions', 'title');
};

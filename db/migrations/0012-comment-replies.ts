/**
 * A comment can answer another comment of the same plan (one level: the crew lead answers a
 * reviewer). `reply_to` names the comment answered, null for a comment that starts a thread. The
 * key is (reply_to, plan_id) against (id, plan_id), so the database itself refuses a reply to a
 * comment of another plan, and so of another organisation.
 */
import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn('plan_comments', 'reply_to', { type: DataTypes.INTEGER.UNSIGNED, allowNull: true });
  // The target of the two-column key (id alone is already unique).
  await qi.addIndex('plan_comments', ['id', 'plan_id'], { unique: true, name: 'plan_comments_id_plan' });
  await qi.addIndex('plan_comments', ['reply_to', 'plan_id'], { name: 'plan_comments_reply_to' });
  // Sequelize's addConstraint takes one referenced column only; the two-column key is plain DDL.
  await qi.sequelize.query('ALTER TABLE plan_comments ADD CONSTRAINT plan_comments_reply_to_same_plan FOREIGN KEY (reply_to, plan_id) REFERENCES plan_comments (id, plan_id) ON DELETE CASCADE');
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.removeConstraint('plan_comments', 'plan_comments_reply_to_same_plan');
  await qi.removeIndex('plan_comments', 'plan_comments_reply_to');
  await qi.removeIndex('plan_comments', 'plan_comments_id_plan');
  await qi.removeColumn('plan_comments', 'reply_to');
};

/** Practice: exercises made from approved revisions, and the apprentices' attempts at them. */
import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

const now = { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW };

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable('practice_exercises', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    organization_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'organizations', key: 'id' }, onDelete: 'CASCADE' },
    plan_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'plans', key: 'id' }, onDelete: 'CASCADE' },
    revision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    kind: { type: DataTypes.ENUM('find', 'fix', 'numbers'), allowNull: false },
    gap: { type: DataTypes.STRING(40), allowNull: false },
    modifications: { type: DataTypes.TEXT, allowNull: false },
    document: { type: DataTypes.TEXT('long'), allowNull: false },
    answer_key: { type: DataTypes.TEXT('long'), allowNull: false },
    prompt: { type: DataTypes.TEXT, allowNull: false },
    teaching_note: { type: DataTypes.TEXT, allowNull: true },
    published: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    created_by: { type: DataTypes.STRING(32), allowNull: false, references: { model: 'users', key: 'id' } },
    created_at: now,
  });
  await qi.addIndex('practice_exercises', ['organization_id', 'published']);

  await qi.createTable('practice_attempts', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    organization_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'organizations', key: 'id' }, onDelete: 'CASCADE' },
    exercise_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'practice_exercises', key: 'id' }, onDelete: 'CASCADE' },
    apprentice_id: { type: DataTypes.STRING(32), allowNull: false, references: { model: 'users', key: 'id' } },
    answer: { type: DataTypes.TEXT('long'), allowNull: false },
    score: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    details: { type: DataTypes.TEXT('long'), allowNull: false },
    created_at: now,
  });
  await qi.addIndex('practice_attempts', ['organization_id', 'exercise_id', 'apprentice_id']);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.dropTable('practice_attempts');
  await qi.dropTable('practice_exercises');
};

/** Practice exercises and attempts (migration 0007). JSON columns are text, parsed on the way out. */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { EXERCISE_KINDS, type ExerciseKind } from '@/lib/domain/practice/types';

/** An exercise: a gap put into a copy of one approved revision. The revision itself is never touched. */
export class PracticeExercise extends Model<InferAttributes<PracticeExercise>, InferCreationAttributes<PracticeExercise>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare planId: number;
  declare revision: number;
  declare kind: ExerciseKind;
  declare gap: string;
  /** The reviewer's modifications in the original's link ids (JSON). */
  declare modifications: string;
  /** The modified plan as the apprentice sees it (JSON). */
  declare document: string;
  /** Planted findings, answer elements, link id map, numbers question (JSON; never sent to apprentices). */
  declare answerKey: string;
  declare prompt: string;
  declare teachingNote: string | null;
  declare published: boolean;
  declare createdBy: string;
  declare createdAt: CreationOptional<Date>;
}

/** One graded answer. Rows are only inserted: every attempt is kept. */
export class PracticeAttempt extends Model<InferAttributes<PracticeAttempt>, InferCreationAttributes<PracticeAttempt>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare exerciseId: number;
  declare apprenticeId: string;
  declare answer: string;
  declare score: number;
  declare details: string;
  declare createdAt: CreationOptional<Date>;
}

export function initPractice(sequelize: Sequelize) {
  PracticeExercise.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      planId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      revision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      kind: { type: DataTypes.ENUM(...EXERCISE_KINDS), allowNull: false },
      gap: { type: DataTypes.STRING(40), allowNull: false },
      modifications: { type: DataTypes.TEXT, allowNull: false },
      document: { type: DataTypes.TEXT('long'), allowNull: false },
      answerKey: { type: DataTypes.TEXT('long'), allowNull: false },
      prompt: { type: DataTypes.TEXT, allowNull: false },
      teachingNote: { type: DataTypes.TEXT, allowNull: true },
      published: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      createdBy: { type: DataTypes.STRING(32), allowNull: false },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'practice_exercises', updatedAt: false },
  );
  PracticeAttempt.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      exerciseId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      apprenticeId: { type: DataTypes.STRING(32), allowNull: false },
      answer: { type: DataTypes.TEXT('long'), allowNull: false },
      score: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      details: { type: DataTypes.TEXT('long'), allowNull: false },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'practice_attempts', updatedAt: false },
  );
  return { PracticeExercise, PracticeAttempt };
}

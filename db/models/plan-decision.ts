import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A reviewer's decision on one submitted revision; unique per (plan, revision), never changed. */
export class PlanDecision extends Model<InferAttributes<PlanDecision>, InferCreationAttributes<PlanDecision>> {
  declare id: CreationOptional<number>;
  declare planId: number;
  declare revision: number;
  declare decision: 'approve' | 'return';
  declare reviewerId: string;
  declare comment: string | null;
  declare teachingNote: string | null;
  /** SHA-256 of the canonical JSON of the approved document and of its report. */
  declare documentHash: string | null;
  declare reportHash: string | null;
  /** For approvals (migration 0009): what the library shows, stored once; JSON lists. */
  declare title: CreationOptional<string | null>;
  declare libraryTags: CreationOptional<string | null>;
  declare material: CreationOptional<string | null>;
  declare fixedRules: CreationOptional<string | null>;
  declare decidedAt: CreationOptional<Date>;
}

export function initPlanDecision(sequelize: Sequelize): typeof PlanDecision {
  return PlanDecision.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      planId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      revision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      decision: { type: DataTypes.ENUM('approve', 'return'), allowNull: false },
      reviewerId: { type: DataTypes.STRING(32), allowNull: false },
      comment: { type: DataTypes.TEXT, allowNull: true },
      teachingNote: { type: DataTypes.TEXT, allowNull: true },
      documentHash: { type: DataTypes.STRING(64), allowNull: true },
      reportHash: { type: DataTypes.STRING(64), allowNull: true },
      title: { type: DataTypes.STRING(200), allowNull: true },
      libraryTags: { type: DataTypes.TEXT, allowNull: true },
      material: { type: DataTypes.STRING(40), allowNull: true },
      fixedRules: { type: DataTypes.TEXT, allowNull: true },
      decidedAt: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'plan_decisions', timestamps: false },
  );
}

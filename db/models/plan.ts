import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { PLAN_STATUSES, type PlanStatus } from '@/lib/domain/plan-status';

export class Plan extends Model<InferAttributes<Plan>, InferCreationAttributes<Plan>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare title: string;
  declare structure: string;
  declare status: CreationOptional<PlanStatus>;
  declare authorId: string;
  declare currentRevision: CreationOptional<number>;
  /** Counts from the current revision's check report, kept here so lists can sort and filter. */
  declare blockers: number | null;
  declare warnings: number | null;
  /** When the current submission was made; null unless submitted. */
  declare submittedAt: CreationOptional<Date | null>;
  /** The revision the last approval covers, if any. */
  declare approvedRevision: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initPlan(sequelize: Sequelize): typeof Plan {
  return Plan.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      title: { type: DataTypes.STRING(200), allowNull: false },
      structure: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
      status: { type: DataTypes.ENUM(...PLAN_STATUSES), allowNull: false, defaultValue: 'draft' },
      authorId: { type: DataTypes.STRING(32), allowNull: false },
      currentRevision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
      blockers: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      warnings: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      submittedAt: { type: DataTypes.DATE(3), allowNull: true },
      approvedRevision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'plans' },
  );
}

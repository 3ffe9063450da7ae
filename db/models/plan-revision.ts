import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One saved state of a plan. Rows are only ever inserted: a revision never changes once written. */
export class PlanRevision extends Model<InferAttributes<PlanRevision>, InferCreationAttributes<PlanRevision>> {
  declare id: CreationOptional<number>;
  declare planId: number;
  declare number: number;
  /** The plan document as JSON text; parsed with the plan schema on the way out. */
  declare document: string;
  declare report: string | null;
  declare createdBy: string;
  declare createdAt: CreationOptional<Date>;
}

export function initPlanRevision(sequelize: Sequelize): typeof PlanRevision {
  return PlanRevision.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      planId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      document: { type: DataTypes.TEXT('long'), allowNull: false },
      report: { type: DataTypes.TEXT('long'), allowNull: true },
      createdBy: { type: DataTypes.STRING(32), allowNull: false },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'plan_revisions', updatedAt: false },
  );
}

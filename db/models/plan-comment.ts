import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/**
 * A review comment, optionally pinned to one node or link of the revision it was made on, or a
 * reply to another comment of the same plan (`replyTo`, one level deep).
 */
export class PlanComment extends Model<InferAttributes<PlanComment>, InferCreationAttributes<PlanComment>> {
  declare id: CreationOptional<number>;
  declare planId: number;
  declare revision: number;
  declare elementId: string | null;
  declare authorId: string;
  declare body: string;
  declare resolvedAt: Date | null;
  declare resolvedBy: string | null;
  declare replyTo: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
}

export function initPlanComment(sequelize: Sequelize): typeof PlanComment {
  return PlanComment.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      planId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      revision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      elementId: { type: DataTypes.STRING(64), allowNull: true },
      authorId: { type: DataTypes.STRING(32), allowNull: false },
      body: { type: DataTypes.TEXT, allowNull: false },
      resolvedAt: { type: DataTypes.DATE(3), allowNull: true },
      resolvedBy: { type: DataTypes.STRING(32), allowNull: true },
      replyTo: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, defaultValue: null },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'plan_comments', updatedAt: false },
  );
}

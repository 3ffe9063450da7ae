import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Who did what, when: appended, never updated. */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare actorId: string | null;
  declare action: string;
  declare subjectType: string;
  declare subjectId: string;
  declare details: string | null;
  declare at: CreationOptional<Date>;
}

export function initAuditEvent(sequelize: Sequelize): typeof AuditEvent {
  return AuditEvent.init(
    {
      id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      actorId: { type: DataTypes.STRING(32), allowNull: true },
      action: { type: DataTypes.STRING(64), allowNull: false },
      subjectType: { type: DataTypes.STRING(32), allowNull: false },
      subjectId: { type: DataTypes.STRING(64), allowNull: false },
      details: { type: DataTypes.TEXT, allowNull: true },
      at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'audit_events', timestamps: false },
  );
}

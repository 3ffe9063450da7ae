import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { ROLES, type Role } from '@/lib/domain/roles';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: string;
  declare organizationId: number;
  declare email: string;
  declare name: string;
  declare role: Role;
  /** Null until the person has set a password through their invitation link. */
  declare passwordHash: string | null;
  declare disabled: CreationOptional<boolean>;
  /** The admin who invited this person (null for people made by seeders or tests). */
  declare invitedBy: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initUser(sequelize: Sequelize): typeof User {
  return User.init(
    {
      id: { type: DataTypes.STRING(32), primaryKey: true },
      organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(200), allowNull: false },
      role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
      passwordHash: { type: DataTypes.STRING(255), allowNull: true },
      disabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      invitedBy: { type: DataTypes.STRING(32), allowNull: true, defaultValue: null },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'users' },
  );
}

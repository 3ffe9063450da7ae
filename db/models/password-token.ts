import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A one-time set-password link. Only the SHA-256 of the token is stored. */
export class PasswordToken extends Model<InferAttributes<PasswordToken>, InferCreationAttributes<PasswordToken>> {
  declare tokenHash: string;
  declare userId: string;
  declare purpose: 'invite' | 'reset';
  declare expiresAt: Date;
  declare usedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
}

export function initPasswordToken(sequelize: Sequelize): typeof PasswordToken {
  return PasswordToken.init(
    {
      tokenHash: { type: DataTypes.STRING(64), primaryKey: true },
      userId: { type: DataTypes.STRING(32), allowNull: false },
      purpose: { type: DataTypes.ENUM('invite', 'reset'), allowNull: false },
      expiresAt: { type: DataTypes.DATE(3), allowNull: false },
      usedAt: { type: DataTypes.DATE(3), allowNull: true },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'password_tokens', updatedAt: false },
  );
}

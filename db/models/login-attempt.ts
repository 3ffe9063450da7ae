import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Failed sign-ins by e-mail, kept in the database so throttling holds across restarts and instances. */
export class LoginAttempt extends Model<InferAttributes<LoginAttempt>, InferCreationAttributes<LoginAttempt>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare at: Date;
}

export function initLoginAttempt(sequelize: Sequelize): typeof LoginAttempt {
  return LoginAttempt.init(
    {
      id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
      email: { type: DataTypes.STRING(254), allowNull: false },
      at: { type: DataTypes.DATE(3), allowNull: false },
    },
    { sequelize, tableName: 'login_attempts', timestamps: false },
  );
}

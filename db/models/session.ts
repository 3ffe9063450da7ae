import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A sign-in session; the id is the cookie's secret, so rows live only in the database. */
export class Session extends Model<InferAttributes<Session>, InferCreationAttributes<Session>> {
  declare id: string;
  declare userId: string;
  declare expiresAt: Date;
}

export function initSession(sequelize: Sequelize): typeof Session {
  return Session.init(
    {
      id: { type: DataTypes.STRING(255), primaryKey: true },
      userId: { type: DataTypes.STRING(32), allowNull: false },
      expiresAt: { type: DataTypes.DATE(3), allowNull: false },
    },
    { sequelize, tableName: 'sessions', timestamps: false },
  );
}

import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A sign-in session; the id is the SHA-256 (hex) of the cookie's token, so a read of the table hands out no session. */
export class Session extends Model<InferAttributes<Session>, InferCreationAttributes<Session>> {
  declare id: string;
  declare userId: string;
  declare expiresAt: Date;
}

export function initSession(sequelize: Sequelize): typeof Session {
  return Session.init(
    {
      id: { type: DataTypes.CHAR(64), primaryKey: true },
      userId: { type: DataTypes.STRING(32), allowNull: false },
      expiresAt: { type: DataTypes.DATE(3), allowNull: false },
    },
    { sequelize, tableName: 'sessions', timestamps: false },
  );
}

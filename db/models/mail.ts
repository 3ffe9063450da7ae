import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A message waiting to leave (or sent); a failing mail server never fails the request that queued it. */
export class MailOutbox extends Model<InferAttributes<MailOutbox>, InferCreationAttributes<MailOutbox>> {
  declare id: CreationOptional<number>;
  declare organizationId: number | null;
  declare toAddress: string;
  declare subject: string;
  declare textBody: string;
  declare htmlBody: string;
  declare kind: string;
  declare status: CreationOptional<'pending' | 'sent' | 'failed'>;
  declare attempts: CreationOptional<number>;
  declare nextAttemptAt: CreationOptional<Date>;
  /** Set by the instance that is sending the message, so two instances never send it twice. */
  declare claimToken: string | null;
  declare claimedUntil: Date | null;
  declare lastError: string | null;
  declare sentAt: Date | null;
  declare createdAt: CreationOptional<Date>;
}

/** A message the local SMTP catcher received (development and tests only). */
export class CaughtMail extends Model<InferAttributes<CaughtMail>, InferCreationAttributes<CaughtMail>> {
  declare id: CreationOptional<number>;
  declare mailFrom: string;
  declare recipients: string;
  declare subject: string;
  declare textBody: string;
  declare htmlBody: string | null;
  declare raw: string;
  declare receivedAt: CreationOptional<Date>;
}

export function initMail(sequelize: Sequelize) {
  MailOutbox.init(
    {
      id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      toAddress: { type: DataTypes.STRING(254), allowNull: false },
      subject: { type: DataTypes.STRING(300), allowNull: false },
      textBody: { type: DataTypes.TEXT('medium'), allowNull: false },
      htmlBody: { type: DataTypes.TEXT('medium'), allowNull: false },
      kind: { type: DataTypes.STRING(40), allowNull: false },
      status: { type: DataTypes.ENUM('pending', 'sent', 'failed'), allowNull: false, defaultValue: 'pending' },
      attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      nextAttemptAt: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
      claimToken: { type: DataTypes.STRING(32), allowNull: true },
      claimedUntil: { type: DataTypes.DATE(3), allowNull: true },
      lastError: { type: DataTypes.TEXT, allowNull: true },
      sentAt: { type: DataTypes.DATE(3), allowNull: true },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'mail_outbox', updatedAt: false },
  );
  CaughtMail.init(
    {
      id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
      mailFrom: { type: DataTypes.STRING(254), allowNull: false },
      recipients: { type: DataTypes.TEXT, allowNull: false },
      subject: { type: DataTypes.STRING(300), allowNull: false },
      textBody: { type: DataTypes.TEXT('long'), allowNull: false },
      htmlBody: { type: DataTypes.TEXT('long'), allowNull: true },
      raw: { type: DataTypes.TEXT('long'), allowNull: false },
      receivedAt: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'caught_mail', timestamps: false },
  );
  return { MailOutbox, CaughtMail };
}

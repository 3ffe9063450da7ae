import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A field record: fixed to one approved revision of a plan; closed once, then never changed. */
export class FieldRecord extends Model<InferAttributes<FieldRecord>, InferCreationAttributes<FieldRecord>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare planId: number;
  declare revision: number;
  declare status: CreationOptional<'open' | 'closed'>;
  declare workDate: string;
  declare structure: string;
  declare location: string;
  declare clearanceRef: string;
  declare detector: string;
  declare leadId: string;
  declare setsOn: CreationOptional<number>;
  declare closedAt: CreationOptional<Date | null>;
  declare closedBy: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** One entry, as the device sent it; (record, clientId) is unique. Rows are only inserted. */
export class FieldRecordEntry extends Model<InferAttributes<FieldRecordEntry>, InferCreationAttributes<FieldRecordEntry>> {
  declare id: CreationOptional<number>;
  declare recordId: number;
  declare clientId: string;
  declare type: string;
  /** The entry body as JSON text (without clientId and at). */
  declare body: string;
  /** Flags raised when it was recorded, as JSON text. */
  declare flags: string;
  declare at: Date;
  declare actorId: string;
  declare recordedAt: CreationOptional<Date>;
}

/** A photo's objects and facts; (record, clientId) is unique, null for photos from before clientIds. */
export class FieldRecordPhoto extends Model<InferAttributes<FieldRecordPhoto>, InferCreationAttributes<FieldRecordPhoto>> {
  declare id: CreationOptional<number>;
  declare recordId: number;
  declare clientId: CreationOptional<string | null>;
  declare objectKey: string;
  declare mime: string;
  declare bytes: number;
  declare width: number;
  declare height: number;
  declare caption: string;
  declare createdBy: string;
  declare createdAt: CreationOptional<Date>;
}

export function initFieldRecords(sequelize: Sequelize) {
  FieldRecord.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      planId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      revision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      status: { type: DataTypes.ENUM('open', 'closed'), allowNull: false, defaultValue: 'open' },
      workDate: { type: DataTypes.DATEONLY, allowNull: false },
      structure: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
      location: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
      clearanceRef: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
      detector: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
      leadId: { type: DataTypes.STRING(32), allowNull: false },
      setsOn: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      closedAt: { type: DataTypes.DATE(3), allowNull: true },
      closedBy: { type: DataTypes.STRING(32), allowNull: true },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'field_records' },
  );
  FieldRecordEntry.init(
    {
      id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
      recordId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      clientId: { type: DataTypes.CHAR(36), allowNull: false },
      type: { type: DataTypes.STRING(20), allowNull: false },
      body: { type: DataTypes.TEXT, allowNull: false },
      flags: { type: DataTypes.TEXT, allowNull: false },
      at: { type: DataTypes.DATE(3), allowNull: false },
      actorId: { type: DataTypes.STRING(32), allowNull: false },
      recordedAt: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'field_record_entries', timestamps: false },
  );
  FieldRecordPhoto.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      recordId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      clientId: { type: DataTypes.CHAR(36), allowNull: true },
      objectKey: { type: DataTypes.STRING(120), allowNull: false },
      mime: { type: DataTypes.STRING(40), allowNull: false },
      bytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      width: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      height: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      caption: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
      createdBy: { type: DataTypes.STRING(32), allowNull: false },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'field_record_photos', updatedAt: false },
  );
  return { FieldRecord, FieldRecordEntry, FieldRecordPhoto };
}

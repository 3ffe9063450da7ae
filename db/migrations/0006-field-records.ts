/** Field records: what the crew did on the day against an approved plan, its entries and photos. */
import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

const now = { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW };

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable('field_records', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    organization_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'organizations', key: 'id' } },
    plan_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'plans', key: 'id' } },
    revision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    status: { type: DataTypes.ENUM('open', 'closed'), allowNull: false, defaultValue: 'open' },
    work_date: { type: DataTypes.DATEONLY, allowNull: false },
    structure: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
    location: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
    clearance_ref: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
    detector: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
    lead_id: { type: DataTypes.STRING(32), allowNull: false, references: { model: 'users', key: 'id' } },
    /** Kept on the row so lists sort by "sets on now" without replaying entries. */
    sets_on: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    closed_at: { type: DataTypes.DATE(3), allowNull: true },
    closed_by: { type: DataTypes.STRING(32), allowNull: true },
    created_at: now,
    updated_at: now,
  });
  await qi.addIndex('field_records', ['organization_id', 'status', 'sets_on']);
  await qi.addIndex('field_records', ['plan_id']);

  await qi.createTable('field_record_entries', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    record_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'field_records', key: 'id' }, onDelete: 'CASCADE' },
    client_id: { type: DataTypes.CHAR(36), allowNull: false },
    type: { type: DataTypes.STRING(20), allowNull: false },
    body: { type: DataTypes.TEXT, allowNull: false },
    flags: { type: DataTypes.TEXT, allowNull: false },
    at: { type: DataTypes.DATE(3), allowNull: false },
    actor_id: { type: DataTypes.STRING(32), allowNull: false, references: { model: 'users', key: 'id' } },
    recorded_at: now,
  });
  // A repeat of one entry from the device (same clientId) can never be recorded twice.
  await qi.addIndex('field_record_entries', ['record_id', 'client_id'], { unique: true });

  await qi.createTable('field_record_photos', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    record_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'field_records', key: 'id' }, onDelete: 'CASCADE' },
    /** Random prefix of the three stored objects (original, display, thumb); never the file name. */
    object_key: { type: DataTypes.STRING(120), allowNull: false, unique: true },
    mime: { type: DataTypes.STRING(40), allowNull: false },
    bytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    width: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    height: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    caption: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
    created_by: { type: DataTypes.STRING(32), allowNull: false, references: { model: 'users', key: 'id' } },
    created_at: now,
  });
  await qi.addIndex('field_record_photos', ['record_id']);

  // Whether a photo's original keeps its location metadata; off unless an admin allows it.
  await qi.addColumn('organizations', 'keep_photo_location', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.removeColumn('organizations', 'keep_photo_location');
  await qi.dropTable('field_record_photos');
  await qi.dropTable('field_record_entries');
  await qi.dropTable('field_records');
};

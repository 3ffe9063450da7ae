/**
 * A photo carries the id the device gave it, so an upload sent again after a dropped answer finds
 * the photo already stored instead of storing it twice. Null for photos stored before this.
 */
import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn('field_record_photos', 'client_id', { type: DataTypes.CHAR(36), allowNull: true });
  await qi.addIndex('field_record_photos', ['record_id', 'client_id'], { unique: true, name: 'field_record_photos_record_client' });
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.removeIndex('field_record_photos', 'field_record_photos_record_client');
  await qi.removeColumn('field_record_photos', 'client_id');
};

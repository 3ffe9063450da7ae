/**
 * Grounding sets: the organisation's inventory, its in-service tests and events, the organisation's
 * own test interval and resistance limits, and the once-a-day claim for the due-sets mail.
 */
import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

const now = { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW };
const orgRef = { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'organizations', key: 'id' }, onDelete: 'CASCADE' } as const;
const setRef = { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'grounding_sets', key: 'id' }, onDelete: 'CASCADE' } as const;

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable('grounding_sets', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    organization_id: orgRef,
    tag: { type: DataTypes.STRING(64), allowNull: false },
    description: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
    cable: { type: DataTypes.STRING(8), allowNull: false },
    length_m: { type: DataTypes.DOUBLE, allowNull: false },
    clamp_kind: { type: DataTypes.ENUM('grounding', 'live-line'), allowNull: false },
    clamp_ka: { type: DataTypes.DOUBLE, allowNull: false },
    clamp_cycles: { type: DataTypes.DOUBLE, allowNull: false },
    connection: { type: DataTypes.ENUM('ferrule', 'bare-strands'), allowNull: false },
    in_service_on: { type: DataTypes.DATEONLY, allowNull: false },
    status: { type: DataTypes.ENUM('in-service', 'out-of-service', 'retired'), allowNull: false, defaultValue: 'in-service' },
    status_reason: { type: DataTypes.STRING(500), allowNull: true },
    // True while the set is out of service after carrying fault current or failing a test: a passing test ends it.
    needs_passing_test: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    last_tested_on: { type: DataTypes.DATEONLY, allowNull: true },
    // Derived (last test, or in-service date, plus the organisation's interval); kept so lists filter in SQL.
    test_due_on: { type: DataTypes.DATEONLY, allowNull: false },
    notes: { type: DataTypes.TEXT, allowNull: true },
    created_at: now,
    updated_at: now,
  });
  await qi.addIndex('grounding_sets', ['organization_id', 'tag'], { unique: true, name: 'grounding_sets_org_tag' });
  await qi.addIndex('grounding_sets', ['organization_id', 'test_due_on']);

  await qi.createTable('set_tests', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    organization_id: orgRef,
    set_id: setRef,
    tested_on: { type: DataTypes.DATEONLY, allowNull: false },
    tested_by: { type: DataTypes.STRING(32), allowNull: true, references: { model: 'users', key: 'id' } },
    resistance_milliohms: { type: DataTypes.DOUBLE, allowNull: false },
    limit_milliohms: { type: DataTypes.DOUBLE, allowNull: true },
    passed: { type: DataTypes.BOOLEAN, allowNull: false },
    notes: { type: DataTypes.TEXT, allowNull: true },
    created_at: now,
  });
  await qi.addIndex('set_tests', ['set_id', 'tested_on']);

  await qi.createTable('set_events', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    organization_id: orgRef,
    set_id: setRef,
    kind: { type: DataTypes.STRING(32), allowNull: false },
    from_status: { type: DataTypes.STRING(20), allowNull: true },
    to_status: { type: DataTypes.STRING(20), allowNull: true },
    reason: { type: DataTypes.STRING(500), allowNull: true },
    actor_id: { type: DataTypes.STRING(32), allowNull: true },
    occurred_on: { type: DataTypes.DATEONLY, allowNull: true },
    created_at: now,
  });
  await qi.addIndex('set_events', ['set_id', 'created_at']);

  await qi.createTable('organization_settings', {
    organization_id: { ...orgRef, primaryKey: true },
    test_interval_months: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 12 },
    // JSON list of {cable, maxLengthM, limitMilliohms}, entered by the organisation; empty by default.
    resistance_limits: { type: DataTypes.TEXT, allowNull: false },
    updated_by: { type: DataTypes.STRING(32), allowNull: true },
    updated_at: now,
  });

  await qi.createTable('equipment_mail_claims', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    organization_id: orgRef,
    day: { type: DataTypes.DATEONLY, allowNull: false },
    // The due dates the message listed, so the next one names only sets that changed since.
    listed: { type: DataTypes.TEXT, allowNull: false },
    created_at: now,
  });
  // One claim per organisation per day: the second app instance to try hits this key and stops.
  await qi.addIndex('equipment_mail_claims', ['organization_id', 'day'], { unique: true, name: 'equipment_mail_claims_org_day' });
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.dropTable('equipment_mail_claims');
  await qi.dropTable('organization_settings');
  await qi.dropTable('set_events');
  await qi.dropTable('set_tests');
  await qi.dropTable('grounding_sets');
};

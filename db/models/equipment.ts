/** Grounding sets, their tests and events, organisation settings, and the daily mail claim. */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { CLAMP_KINDS, CONNECTIONS, SET_STATUSES, type ClampKind, type Connection, type SetStatus } from '@/lib/domain/equipment';
import type { CableSize } from '@/lib/schemas/plan';

export class GroundingSet extends Model<InferAttributes<GroundingSet>, InferCreationAttributes<GroundingSet>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare tag: string;
  declare description: string;
  declare cable: CableSize;
  declare lengthM: number;
  declare clampKind: ClampKind;
  declare clampKa: number;
  declare clampCycles: number;
  declare connection: Connection;
  declare inServiceOn: string;
  declare status: SetStatus;
  declare statusReason: string | null;
  declare needsPassingTest: CreationOptional<boolean>;
  declare lastTestedOn: string | null;
  declare testDueOn: string;
  declare notes: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class SetTest extends Model<InferAttributes<SetTest>, InferCreationAttributes<SetTest>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare setId: number;
  declare testedOn: string;
  declare testedBy: string | null;
  declare resistanceMilliohms: number;
  declare limitMilliohms: number | null;
  declare passed: boolean;
  declare notes: string | null;
  declare createdAt: CreationOptional<Date>;
}

export class SetEvent extends Model<InferAttributes<SetEvent>, InferCreationAttributes<SetEvent>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare setId: number;
  /** created, edited, imported, status, fault, test */
  declare kind: string;
  declare fromStatus: string | null;
  declare toStatus: string | null;
  declare reason: string | null;
  declare actorId: string | null;
  declare occurredOn: string | null;
  declare createdAt: CreationOptional<Date>;
}

export class OrganizationSetting extends Model<InferAttributes<OrganizationSetting>, InferCreationAttributes<OrganizationSetting>> {
  declare organizationId: number;
  /** Null until the organisation chooses an interval (migration 0011). */
  declare testIntervalMonths: number | null;
  declare resistanceLimits: string;
  declare timeZone: string | null;
  declare paperSize: CreationOptional<string>;
  declare units: CreationOptional<string>;
  declare updatedBy: string | null;
  declare updatedAt: CreationOptional<Date>;
}

export class EquipmentMailClaim extends Model<InferAttributes<EquipmentMailClaim>, InferCreationAttributes<EquipmentMailClaim>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare day: string;
  declare listed: string;
  declare createdAt: CreationOptional<Date>;
}

const uint = (allowNull = false) => ({ type: DataTypes.INTEGER.UNSIGNED, allowNull });

export function initEquipment(sequelize: Sequelize) {
  GroundingSet.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      organizationId: uint(),
      tag: { type: DataTypes.STRING(64), allowNull: false },
      description: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
      cable: { type: DataTypes.STRING(8), allowNull: false },
      lengthM: { type: DataTypes.DOUBLE, allowNull: false },
      clampKind: { type: DataTypes.ENUM(...CLAMP_KINDS), allowNull: false },
      clampKa: { type: DataTypes.DOUBLE, allowNull: false },
      clampCycles: { type: DataTypes.DOUBLE, allowNull: false },
      connection: { type: DataTypes.ENUM(...CONNECTIONS), allowNull: false },
      inServiceOn: { type: DataTypes.DATEONLY, allowNull: false },
      status: { type: DataTypes.ENUM(...SET_STATUSES), allowNull: false, defaultValue: 'in-service' },
      statusReason: { type: DataTypes.STRING(500), allowNull: true },
      needsPassingTest: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      lastTestedOn: { type: DataTypes.DATEONLY, allowNull: true },
      testDueOn: { type: DataTypes.DATEONLY, allowNull: false },
      notes: { type: DataTypes.TEXT, allowNull: true },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'grounding_sets' },
  );
  SetTest.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      organizationId: uint(),
      setId: uint(),
      testedOn: { type: DataTypes.DATEONLY, allowNull: false },
      testedBy: { type: DataTypes.STRING(32), allowNull: true },
      resistanceMilliohms: { type: DataTypes.DOUBLE, allowNull: false },
      limitMilliohms: { type: DataTypes.DOUBLE, allowNull: true },
      passed: { type: DataTypes.BOOLEAN, allowNull: false },
      notes: { type: DataTypes.TEXT, allowNull: true },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'set_tests', updatedAt: false },
  );
  SetEvent.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      organizationId: uint(),
      setId: uint(),
      kind: { type: DataTypes.STRING(32), allowNull: false },
      fromStatus: { type: DataTypes.STRING(20), allowNull: true },
      toStatus: { type: DataTypes.STRING(20), allowNull: true },
      reason: { type: DataTypes.STRING(500), allowNull: true },
      actorId: { type: DataTypes.STRING(32), allowNull: true },
      occurredOn: { type: DataTypes.DATEONLY, allowNull: true },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'set_events', updatedAt: false },
  );
  OrganizationSetting.init(
    {
      organizationId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
      testIntervalMonths: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      resistanceLimits: { type: DataTypes.TEXT, allowNull: false },
      timeZone: { type: DataTypes.STRING(64), allowNull: true },
      paperSize: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'letter' },
      units: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'imperial' },
      updatedBy: { type: DataTypes.STRING(32), allowNull: true },
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'organization_settings', createdAt: false },
  );
  EquipmentMailClaim.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      organizationId: uint(),
      day: { type: DataTypes.DATEONLY, allowNull: false },
      listed: { type: DataTypes.TEXT, allowNull: false },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'equipment_mail_claims', updatedAt: false },
  );
  return { GroundingSet, SetTest, SetEvent, OrganizationSetting, EquipmentMailClaim };
}

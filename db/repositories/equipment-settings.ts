/** The organisation's own equipment settings: test interval and resistance limits. */
import type { Transaction } from 'sequelize';
import { DEFAULT_TEST_INTERVAL_MONTHS, testDueOn, type ResistanceLimit } from '@/lib/domain/equipment';
import type { SettingsBody } from '@/lib/schemas/equipment';
import type { Db } from '@db/connection';
import { lockOrganization } from './people';

export interface EquipmentSettings {
  testIntervalMonths: number;
  /** True while the organisation has not chosen an interval (the default is shown as a choice to make). */
  intervalIsDefault: boolean;
  resistanceLimits: ResistanceLimit[];
}

export async function getSettings(db: Db, organizationId: number, transaction?: Transaction, options: { forUpdate?: boolean } = {}): Promise<EquipmentSettings> {
  const row = await db.models.OrganizationSetting.findByPk(organizationId, { transaction, ...(options.forUpdate && transaction ? { lock: transaction.LOCK.UPDATE } : {}) });
  if (!row) return { testIntervalMonths: DEFAULT_TEST_INTERVAL_MONTHS, intervalIsDefault: true, resistanceLimits: [] };
  // A row saved from the organisation settings alone has no interval yet (migration 0011).
  const chosen = row.testIntervalMonths !== null;
  return { testIntervalMonths: row.testIntervalMonths ?? DEFAULT_TEST_INTERVAL_MONTHS, intervalIsDefault: !chosen, resistanceLimits: JSON.parse(row.resistanceLimits) as ResistanceLimit[] };
}

/**
 * Saves the settings and recomputes every set's due date when the interval changed. A save may
 * name one field only, so the others are read first: under the organisation's row lock, with a
 * locking read, or a save racing it would write back the value it read before the other landed.
 */
export async function saveSettings(db: Db, organizationId: number, actorId: string, body: SettingsBody): Promise<EquipmentSettings> {
  return db.sequelize.transaction(async (transaction) => {
    await lockOrganization(db, organizationId, transaction);
    const current = await getSettings(db, organizationId, transaction, { forUpdate: true });
    const next = {
      testIntervalMonths: body.testIntervalMonths ?? current.testIntervalMonths,
      resistanceLimits: body.resistanceLimits ?? current.resistanceLimits,
    };
    await db.models.OrganizationSetting.upsert(
      { organizationId, testIntervalMonths: next.testIntervalMonths, resistanceLimits: JSON.stringify(next.resistanceLimits), updatedBy: actorId },
      { transaction },
    );
    if (next.testIntervalMonths !== current.testIntervalMonths || current.intervalIsDefault) {
      const sets = await db.models.GroundingSet.findAll({ where: { organizationId }, transaction, lock: transaction.LOCK.UPDATE });
      for (const set of sets) {
        const due = testDueOn(set.lastTestedOn, set.inServiceOn, next.testIntervalMonths);
        if (due !== set.testDueOn) await set.update({ testDueOn: due }, { transaction });
      }
    }
    return { ...next, intervalIsDefault: false };
  });
}

/** The organisation's general settings: time zone, paper size and default units (migration 0011). */
import type { UnitSystem } from '@/lib/domain/units';
import type { OrganisationSettingsBody, PaperSize } from '@/lib/schemas/organisation';
import { runtimeTimeZone } from '@/lib/time-format';
import type { Db } from '@db/connection';

export interface OrganisationSettings {
  timeZone: string;
  /** True while no admin has chosen a zone: the server's own zone is shown. */
  timeZoneIsDefault: boolean;
  paperSize: PaperSize;
  units: UnitSystem;
}

/** The zone the server runs in; the default until the organisation picks its own. */
export const serverTimeZone = runtimeTimeZone;

export async function getOrganisationSettings(db: Db, organizationId: number): Promise<OrganisationSettings> {
  const row = await db.models.OrganizationSetting.findByPk(organizationId);
  return {
    timeZone: row?.timeZone ?? serverTimeZone(),
    timeZoneIsDefault: !row?.timeZone,
    paperSize: row?.paperSize === 'a4' ? 'a4' : 'letter',
    units: row?.units === 'metric' ? 'metric' : 'imperial',
  };
}

/**
 * Saves the general settings; the equipment settings in the same row are left as they are. One
 * INSERT … ON DUPLICATE KEY UPDATE of this save's columns, so saves racing for a new
 * organisation's first row all land (a read-then-insert lost to the other insert).
 */
export async function saveOrganisationSettings(db: Db, organizationId: number, actorId: string, body: OrganisationSettingsBody): Promise<OrganisationSettings> {
  await db.models.OrganizationSetting.upsert(
    { organizationId, timeZone: body.timeZone, paperSize: body.paperSize, units: body.units, updatedBy: actorId, testIntervalMonths: null, resistanceLimits: '[]' },
    { fields: ['timeZone', 'paperSize', 'units', 'updatedBy'] },
  );
  return { ...body, timeZoneIsDefault: false };
}

/** The organisation's general settings: time zone, paper size and default units (migration 0011). */
import type { UnitSystem } from '@/lib/domain/units';
import type { OrganisationSettingsBody, PaperSize } from '@/lib/schemas/organisation';
import type { Db } from '@db/connection';

export interface OrganisationSettings {
  timeZone: string;
  /** True while no admin has chosen a zone: the server's own zone is shown. */
  timeZoneIsDefault: boolean;
  paperSize: PaperSize;
  units: UnitSystem;
}

/** The zone the server runs in; the default until the organisation picks its own. */
export const serverTimeZone = (): string => Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';

export async function getOrganisationSettings(db: Db, organizationId: number): Promise<OrganisationSettings> {
  const row = await db.models.OrganizationSetting.findByPk(organizationId);
  return {
    timeZone: row?.timeZone ?? serverTimeZone(),
    timeZoneIsDefault: !row?.timeZone,
    paperSize: row?.paperSize === 'a4' ? 'a4' : 'letter',
    units: row?.units === 'metric' ? 'metric' : 'imperial',
  };
}

/** Saves the general settings; the equipment settings in the same row are left as they are. */
export async function saveOrganisationSettings(db: Db, organizationId: number, actorId: string, body: OrganisationSettingsBody): Promise<OrganisationSettings> {
  const values = { organizationId, timeZone: body.timeZone, paperSize: body.paperSize, units: body.units, updatedBy: actorId };
  const row = await db.models.OrganizationSetting.findByPk(organizationId);
  if (row) await row.update(values);
  else await db.models.OrganizationSetting.create({ ...values, testIntervalMonths: null, resistanceLimits: '[]' });
  return { ...body, timeZoneIsDefault: false };
}

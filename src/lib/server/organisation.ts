/** The signed-in person's organisation settings for a page, read once per request, and the organisation's day. */
import type { AstroGlobal } from 'astro';
import { getDb, type Db } from '@db/connection';
import { formatDate } from '@/lib/time-format';
import { getOrganisationSettings, serverTimeZone, type OrganisationSettings } from '@db/repositories/organisation-settings';

const cache = new WeakMap<Request, Promise<OrganisationSettings>>();

export function pageOrganisation(Astro: Pick<AstroGlobal, 'locals' | 'request'>): Promise<OrganisationSettings> {
  const person = Astro.locals.person;
  if (!person) return Promise.resolve({ timeZone: serverTimeZone(), timeZoneIsDefault: true, paperSize: 'letter', units: 'imperial' });
  let found = cache.get(Astro.request);
  if (!found) {
    found = getOrganisationSettings(getDb(), person.organizationId);
    cache.set(Astro.request, found);
  }
  return found;
}

/**
 * Today's date where the organisation works (its time zone): test due dates, "not in the future"
 * and the day a record judges sets on. A UTC day would pass a set on the morning after its due
 * date east of Greenwich.
 */
export async function organisationToday(organizationId: number, now = new Date(), db: Db = getDb()): Promise<string> {
  return formatDate(now, (await getOrganisationSettings(db, organizationId)).timeZone);
}

/** The same day for a page, from the settings the page has already read. */
export async function pageToday(Astro: Pick<AstroGlobal, 'locals' | 'request'>, now = new Date()): Promise<string> {
  return formatDate(now, (await pageOrganisation(Astro)).timeZone);
}

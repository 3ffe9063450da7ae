/** The signed-in person's organisation settings for a page, read once per request. */
import type { AstroGlobal } from 'astro';
import { getDb } from '@db/connection';
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

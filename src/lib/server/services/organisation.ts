/** The organisation's general settings, for PUT /api/organisation/settings and the /settings page. */
import { getDb } from '@db/connection';
import { saveOrganisationSettings, type OrganisationSettings } from '@db/repositories/organisation-settings';
import type { Person } from '@/lib/domain/people';
import type { OrganisationSettingsBody } from '@/lib/schemas/organisation';
import { assertCan } from '@/lib/server/guards';

/** Time zone for every time shown, paper size and default units; an admin's choice. */
export async function changeOrganisationSettings(person: Person, input: OrganisationSettingsBody): Promise<OrganisationSettings> {
  assertCan(person, 'settings.edit');
  return saveOrganisationSettings(getDb(), person.organizationId, person.id, input);
}

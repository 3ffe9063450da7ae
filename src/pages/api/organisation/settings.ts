import { getDb } from '@db/connection';
import { getOrganisationSettings } from '@db/repositories/organisation-settings';
import { organisationSettingsBody } from '@/lib/schemas/organisation';
import { requireCan, requireUser } from '@/lib/server/guards';
import { endpoint, json, readJson } from '@/lib/server/http';
import { changeOrganisationSettings } from '@/lib/server/services/organisation';

/** The organisation's time zone, paper size and default units; anyone signed in reads, an admin saves. */
export const GET = endpoint(async (ctx) => {
  const person = requireUser(ctx);
  return json({ settings: await getOrganisationSettings(getDb(), person.organizationId) });
});

export const PUT = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'settings.edit');
  const body = await readJson(ctx, organisationSettingsBody);
  return json({ settings: await changeOrganisationSettings(person, body) });
});

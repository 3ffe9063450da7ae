import { getDb } from '@db/connection';
import { getSettings } from '@db/repositories/equipment-settings';
import { settingsBody } from '@/lib/schemas/equipment';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, readJson } from '@/lib/server/http';
import { saveTestSettings } from '@/lib/server/services/equipment';

/** The organisation's test interval and resistance limits (its own choices; none ship as facts). */
export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'sets.view');
  return json({ settings: await getSettings(getDb(), person.organizationId) });
});

export const PUT = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'settings.edit');
  const body = await readJson(ctx, settingsBody);
  return json({ settings: await saveTestSettings(person, body) });
});

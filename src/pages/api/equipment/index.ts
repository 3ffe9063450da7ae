import { getDb } from '@db/connection';
import { listSets } from '@db/repositories/equipment';
import { createSetBody, listSetsQuery } from '@/lib/schemas/equipment';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, readJson, readQuery } from '@/lib/server/http';
import { organisationToday } from '@/lib/server/organisation';
import { addSet } from '@/lib/server/services/equipment';

/** The organisation's grounding sets: ?status=&due=overdue|soon&dueWithinDays=&q=&sort=&dir=&page=&pageSize= */
export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'sets.view');
  const query = readQuery(ctx.url, listSetsQuery);
  return json(await listSets(getDb(), person.organizationId, query, await organisationToday(person.organizationId)));
});

/** Adds a set (admin); a tag the organisation already uses is 409 naming it. */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'sets.manage');
  const body = await readJson(ctx, createSetBody);
  const set = await addSet(person, body);
  return json({ set }, 201, { location: `/api/equipment/${set.id}` });
});

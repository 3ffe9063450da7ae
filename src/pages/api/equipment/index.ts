import { getDb } from '@db/connection';
import { listSets, saveSets } from '@db/repositories/equipment';
import { createSetBody, listSetsQuery } from '@/lib/schemas/equipment';
import { AppError } from '@/lib/server/errors';
import { today, unwrap } from '@/lib/server/equipment-http';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, readJson, readQuery } from '@/lib/server/http';

/** The organisation's grounding sets: ?status=&due=overdue|soon&dueWithinDays=&q=&sort=&dir=&page=&pageSize= */
export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'sets.view');
  const query = readQuery(ctx.url, listSetsQuery);
  return json(await listSets(getDb(), person.organizationId, query, today()));
});

/** Adds a set (admin); a tag the organisation already uses is 409 naming it. */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'sets.manage');
  const body = await readJson(ctx, createSetBody);
  if (body.lastTestedOn && body.lastTestedOn > today()) throw new AppError('VALIDATION', { issues: [{ path: 'lastTestedOn', message: 'must not be in the future' }] });
  const { created } = unwrap(await saveSets(getDb(), person.organizationId, person.id, [body], 'create'));
  return json({ set: created[0] }, 201, { location: `/api/equipment/${created[0].id}` });
});

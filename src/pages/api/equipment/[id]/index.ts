import { getDb } from '@db/connection';
import { getSet } from '@db/repositories/equipment';
import { idParam } from '@/lib/schemas/api';
import { patchSetBody } from '@/lib/schemas/equipment';
import { AppError } from '@/lib/server/errors';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, parseWith, readJson } from '@/lib/server/http';
import { changeSet } from '@/lib/server/services/equipment';

/** One set with its tests and events. */
export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'sets.view');
  const found = await getSet(getDb(), person.organizationId, parseWith(idParam, ctx.params.id));
  if (!found) throw new AppError('NOT_FOUND');
  return json(found);
});

/** Edits a set, changes its status (a reason is required out of service) or records a fault (admin). */
export const PATCH = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'sets.manage');
  const id = parseWith(idParam, ctx.params.id);
  const body = await readJson(ctx, patchSetBody);
  return json({ set: await changeSet(person, id, body) });
});

import { getDb } from '@db/connection';
import { getSet, updateSet } from '@db/repositories/equipment';
import { idParam } from '@/lib/schemas/api';
import { patchSetBody } from '@/lib/schemas/equipment';
import { AppError } from '@/lib/server/errors';
import { today, unwrap } from '@/lib/server/equipment-http';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, parseWith, readJson } from '@/lib/server/http';

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
  if (body.faultOn && body.faultOn > today()) throw new AppError('VALIDATION', { issues: [{ path: 'faultOn', message: 'must not be in the future' }] });
  const set = unwrap(await updateSet(getDb(), person.organizationId, id, person.id, body));
  return json({ set });
});

import { z } from 'zod';
import { getDb } from '@db/connection';
import { getRevision } from '@db/repositories/revisions';
import { diffPlans } from '@/lib/domain/plan-diff';
import { idParam } from '@/lib/schemas/api';
import { AppError } from '@/lib/server/errors';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, pathId, readQuery } from '@/lib/server/http';

const query = z.object({ from: idParam, to: idParam });

/** What changed from revision `from` to revision `to`: nodes and links added, removed, changed. */
export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'plan.view');
  const id = pathId(ctx, 'id');
  const { from, to } = readQuery(ctx.url, query);
  const db = getDb();
  const [a, b] = await Promise.all([getRevision(db, person.organizationId, id, from), getRevision(db, person.organizationId, id, to)]);
  if (!a || !b) throw new AppError('NOT_FOUND');
  return json({ from, to, diff: diffPlans(a.document, b.document) });
});

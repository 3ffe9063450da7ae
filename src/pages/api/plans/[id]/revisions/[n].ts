import { getDb } from '@db/connection';
import { getRevision } from '@db/repositories/revisions';
import { AppError } from '@/lib/server/errors';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, pathId } from '@/lib/server/http';

/** One revision: its document, report, state and decision (approval with hashes). */
export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'plan.view');
  const revision = await getRevision(getDb(), person.organizationId, pathId(ctx, 'id'), pathId(ctx, 'n', 'revision'));
  if (!revision) throw new AppError('NOT_FOUND');
  return json({ revision });
});

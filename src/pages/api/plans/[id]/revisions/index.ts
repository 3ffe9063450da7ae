import { getDb } from '@db/connection';
import { listRevisions } from '@db/repositories/revisions';
import { AppError } from '@/lib/server/errors';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, pathId } from '@/lib/server/http';

/** Every revision of the plan, newest first, with its counts and decision. */
export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'plan.view');
  const revisions = await listRevisions(getDb(), person.organizationId, pathId(ctx, 'id'));
  if (!revisions) throw new AppError('NOT_FOUND');
  return json({ revisions });
});

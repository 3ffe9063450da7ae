import { getDb } from '@db/connection';
import { listEvents } from '@db/repositories/audit';
import { getPlan } from '@db/repositories/plans';
import { AppError } from '@/lib/server/errors';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, pathId } from '@/lib/server/http';

/** Who did what when: every save, state change, comment and decision on the plan, newest first. */
export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'plan.view');
  const id = pathId(ctx, 'id');
  const db = getDb();
  if (!(await getPlan(db, person.organizationId, id))) throw new AppError('NOT_FOUND');
  return json({ events: await listEvents(db, person.organizationId, 'plan', id) });
});

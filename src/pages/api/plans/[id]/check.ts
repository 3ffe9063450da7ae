import { requireCan } from '@/lib/server/guards';
import { endpoint, json, pathId } from '@/lib/server/http';
import { recheckPlan } from '@/lib/server/services/plans';

/**
 * Checks the plan's current revision again. For a crew lead or admin (who may edit the plan) the
 * report is stored with that revision; for a reviewer or apprentice the call is read-only: the
 * report is computed and returned with `stored: false`.
 */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'plan.check');
  return json(await recheckPlan(person, pathId(ctx, 'id')));
});

import { getDb } from '@db/connection';
import { getPlan } from '@db/repositories/plans';
import { savePlanBody } from '@/lib/schemas/api';
import { AppError } from '@/lib/server/errors';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, pathId, PLAN_BODY_LIMIT, readJson } from '@/lib/server/http';
import { planJson } from '@/lib/server/plan-json';
import { savePlan } from '@/lib/server/services/plans';

export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'plan.view');
  const id = pathId(ctx, 'id');
  const plan = await getPlan(getDb(), person.organizationId, id);
  if (!plan) throw new AppError('NOT_FOUND');
  return json({ plan: planJson(plan) });
});

/**
 * Saves a new revision of a draft. The body names the revision it was edited from; when someone
 * saved since, the answer is 409 with the current revision, and nothing is overwritten.
 */
export const PUT = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'plan.edit');
  const id = pathId(ctx, 'id');
  const body = await readJson(ctx, savePlanBody, PLAN_BODY_LIMIT);
  return json({ plan: planJson(await savePlan(person, id, body)) });
});

import { requireCan } from '@/lib/server/guards';
import { endpoint, json, pathId } from '@/lib/server/http';
import { planJson } from '@/lib/server/plan-json';
import { reopen } from '@/lib/server/services/review';

/** Starts a new draft revision of an approved plan; the approved revision is kept unchanged. */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'plan.reopen');
  return json({ plan: planJson(await reopen(person, pathId(ctx, 'id'))) }, 201);
});

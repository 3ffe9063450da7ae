import { requireCan } from '@/lib/server/guards';
import { endpoint, json, pathId } from '@/lib/server/http';
import { planJson } from '@/lib/server/plan-json';
import { submitForReview } from '@/lib/server/services/review';

/** Submits the current revision for review: 409 with the blockers while the check finds any. */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'plan.submit');
  const plan = await submitForReview(person, pathId(ctx, 'id'), ctx.url);
  return json({ plan: planJson(plan) });
});

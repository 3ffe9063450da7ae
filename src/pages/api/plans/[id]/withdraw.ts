import { requireCan } from '@/lib/server/guards';
import { endpoint, json, pathId } from '@/lib/server/http';
import { planJson } from '@/lib/server/plan-json';
import { withdraw } from '@/lib/server/services/review';

/** The author (or an admin) takes a submitted plan back to a draft before a reviewer decides it. */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'plan.withdraw');
  return json({ plan: planJson(await withdraw(person, pathId(ctx, 'id'))) });
});

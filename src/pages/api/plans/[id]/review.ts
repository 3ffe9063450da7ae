import { reviewBody } from '@/lib/schemas/api';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, pathId, readJson } from '@/lib/server/http';
import { planJson } from '@/lib/server/plan-json';
import { decide } from '@/lib/server/services/review';

/** Approves or returns the submitted revision: `{decision, comment?, teachingNote?, revision?}`. */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'plan.review');
  const id = pathId(ctx, 'id');
  const body = await readJson(ctx, reviewBody, 64 * 1024);
  return json({ plan: planJson(await decide(person, id, body, ctx.url)) });
});

import { getDb } from '@db/connection';
import { listPlans } from '@db/repositories/plans';
import { createPlanBody, listPlansQuery } from '@/lib/schemas/api';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, PLAN_BODY_LIMIT, readJson, readQuery } from '@/lib/server/http';
import { planJson, summaryJson } from '@/lib/server/plan-json';
import { startPlan } from '@/lib/server/services/plans';

/** The organisation's plans, one page at a time: ?status=&q=&sort=&dir=&page=&pageSize= */
export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'plan.view');
  const query = readQuery(ctx.url, listPlansQuery);
  const page = await listPlans(getDb(), person.organizationId, query);
  return json({ ...page, items: page.items.map(summaryJson) });
});

/** Creates a draft plan from `{title, structure?, document}`; the first revision carries its check. */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'plan.create');
  const body = await readJson(ctx, createPlanBody, PLAN_BODY_LIMIT);
  const plan = await startPlan(person, body);
  return json({ plan: planJson(plan) }, 201, { location: `/api/plans/${plan.id}` });
});

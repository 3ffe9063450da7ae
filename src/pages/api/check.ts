import { z } from 'zod';
import { planDocumentSchema } from '@/lib/schemas/plan';
import { getDb } from '@db/connection';
import { checkForOrganization } from '@/lib/server/checking';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, PLAN_BODY_LIMIT, readJson } from '@/lib/server/http';

/** `?units=imperial` gives the findings' lengths in feet and inches. */
const unitsQuery = z.enum(['metric', 'imperial']).catch('metric');

/** Checks a posted plan document and returns the report (nothing is stored), against the organisation's grounding sets. Any signed-in person. */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'plan.check');
  const document = await readJson(ctx, planDocumentSchema, PLAN_BODY_LIMIT);
  const units = unitsQuery.parse(ctx.url.searchParams.get('units') ?? 'metric');
  return json(await checkForOrganization(getDb(), person.organizationId, document, 'draft', units));
});

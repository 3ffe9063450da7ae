import { planDocumentSchema } from '../../lib/schemas/plan';
import { getDb } from '../../../db/connection';
import { checkForOrganization } from '../../lib/server/checking';
import { requireUser } from '../../lib/server/guards';
import { endpoint, json, PLAN_BODY_LIMIT, readJson } from '../../lib/server/http';

/** Checks a posted plan document and returns the report (nothing is stored), against the organisation's grounding sets. Any signed-in person. */
export const POST = endpoint(async (ctx) => {
  const person = requireUser(ctx);
  const document = await readJson(ctx, planDocumentSchema, PLAN_BODY_LIMIT);
  return json(await checkForOrganization(getDb(), person.organizationId, document));
});

import { planDocumentSchema } from '../../lib/schemas/plan';
import { checkDocument } from '../../lib/server/checking';
import { requireUser } from '../../lib/server/guards';
import { endpoint, json, PLAN_BODY_LIMIT, readJson } from '../../lib/server/http';

/** Checks a posted plan document and returns the report (nothing is stored). Any signed-in person. */
export const POST = endpoint(async (ctx) => {
  requireUser(ctx);
  const document = await readJson(ctx, planDocumentSchema, PLAN_BODY_LIMIT);
  return json(await checkDocument(document));
});

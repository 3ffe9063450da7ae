import { z } from 'zod';
import { planDocumentSchema } from '../../lib/schemas/plan';
import { checkDocument } from '../../lib/server/checking';
import { requireUser } from '../../lib/server/guards';
import { endpoint, json, readJson } from '../../lib/server/http';

/** `?units=imperial` gives the findings' lengths in feet and inches. */
const unitsQuery = z.enum(['metric', 'imperial']).catch('metric');

/** Checks a posted plan document and returns the report (nothing is stored). Any signed-in person. */
export const POST = endpoint(async (ctx) => {
  requireUser(ctx);
  const document = await readJson(ctx, planDocumentSchema, 8 * 1024 * 1024);
  return json(checkDocument(document, unitsQuery.parse(ctx.url.searchParams.get('units') ?? 'metric')));
});

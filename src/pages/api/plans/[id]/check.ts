import { getDb } from '../../../../../db/connection';
import { getPlan, storeReport } from '../../../../../db/repositories/plans';
import { idParam } from '../../../../lib/schemas/api';
import { checkDocument } from '../../../../lib/server/checking';
import { AppError } from '../../../../lib/server/errors';
import { requireUser } from '../../../../lib/server/guards';
import { endpoint, json, parseWith } from '../../../../lib/server/http';

/** Checks the plan's current revision again and stores the report with that revision. */
export const POST = endpoint(async (ctx) => {
  const person = requireUser(ctx);
  const id = parseWith(idParam, ctx.params.id);
  const db = getDb();
  const plan = await getPlan(db, person.organizationId, id);
  if (!plan) throw new AppError('NOT_FOUND');
  const report = await checkDocument(plan.document);
  const stored = await storeReport(db, person.organizationId, id, plan.currentRevision, report);
  return json({ revision: plan.currentRevision, stored, report });
});

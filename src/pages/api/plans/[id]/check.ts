import { getDb } from '@db/connection';
import { getPlan, storeReport } from '@db/repositories/plans';
import { checkForOrganization } from '@/lib/server/checking';
import { AppError } from '@/lib/server/errors';
import { allows, requireCan } from '@/lib/server/guards';
import { endpoint, json, pathId } from '@/lib/server/http';

/**
 * Checks the plan's current revision again. For a crew lead or admin (who may edit the plan) the
 * report is stored with that revision; for a reviewer or apprentice the call is read-only: the
 * report is computed and returned with `stored: false`.
 */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'plan.check');
  const id = pathId(ctx, 'id');
  const db = getDb();
  const plan = await getPlan(db, person.organizationId, id);
  if (!plan) throw new AppError('NOT_FOUND');
  const report = await checkForOrganization(db, person.organizationId, plan.document);
  const stored = allows(person, 'plan.edit') && (await storeReport(db, person.organizationId, id, plan.currentRevision, report));
  return json({ revision: plan.currentRevision, stored, report });
});

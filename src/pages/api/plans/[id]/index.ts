import { getDb } from '../../../../../db/connection';
import { getPlan, saveDraft } from '../../../../../db/repositories/plans';
import { savePlanBody } from '../../../../lib/schemas/api';
import { checkForOrganization } from '../../../../lib/server/checking';
import { AppError } from '../../../../lib/server/errors';
import { requireRole, requireUser } from '../../../../lib/server/guards';
import { endpoint, json, pathId, readJson } from '../../../../lib/server/http';
import { planJson } from '../../../../lib/server/plan-json';

export const GET = endpoint(async (ctx) => {
  const person = requireUser(ctx);
  const id = pathId(ctx, 'id');
  const plan = await getPlan(getDb(), person.organizationId, id);
  if (!plan) throw new AppError('NOT_FOUND');
  return json({ plan: planJson(plan) });
});

/**
 * Saves a new revision of a draft. The body names the revision it was edited from; when someone
 * saved since, the answer is 409 with the current revision, and nothing is overwritten.
 */
export const PUT = endpoint(async (ctx) => {
  const person = requireRole(ctx, 'crew_lead', 'admin');
  const id = pathId(ctx, 'id');
  const body = await readJson(ctx, savePlanBody);
  const document = body.title ? { ...body.document, title: body.title } : body.document;
  const result = await saveDraft(getDb(), person.organizationId, id, person.id, {
    expectedRevision: body.expectedRevision,
    title: body.title,
    structure: body.structure,
    document,
    report: await checkForOrganization(getDb(), person.organizationId, document),
  });
  switch (result.kind) {
    case 'not-found':
      throw new AppError('NOT_FOUND');
    case 'stale':
      throw new AppError('STALE_REVISION', {
        extra: { currentRevision: result.current.currentRevision, yourRevision: body.expectedRevision, current: planJson(result.current) },
      });
    case 'not-editable':
      throw new AppError('NOT_EDITABLE', { extra: { status: result.current.status, currentRevision: result.current.currentRevision } });
    case 'saved':
      return json({ plan: planJson(result.plan) });
  }
});

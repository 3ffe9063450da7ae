import { getDb } from '@db/connection';
import { getPlan, saveDraft, type PlanDetail } from '@db/repositories/plans';
import { isEditable } from '@/lib/domain/plan-status';
import { savePlanBody } from '@/lib/schemas/api';
import { checkForOrganization } from '@/lib/server/checking';
import { AppError } from '@/lib/server/errors';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, pathId, PLAN_BODY_LIMIT, readJson } from '@/lib/server/http';
import { planJson } from '@/lib/server/plan-json';

export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'plan.view');
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
  const person = requireCan(ctx, 'plan.edit');
  const id = pathId(ctx, 'id');
  const body = await readJson(ctx, savePlanBody, PLAN_BODY_LIMIT);
  const document = body.title ? { ...body.document, title: body.title } : body.document;
  // Refuse a stale or locked save before spending a check on it; saveDraft tests both again under
  // the row lock, so a save racing this one is still caught.
  const before = await getPlan(getDb(), person.organizationId, id);
  if (!before) throw new AppError('NOT_FOUND');
  if (!isEditable(before.status)) refuse({ kind: 'not-editable', current: before }, body.expectedRevision);
  if (before.currentRevision !== body.expectedRevision) refuse({ kind: 'stale', current: before }, body.expectedRevision);
  const report = await checkForOrganization(getDb(), person.organizationId, document);
  const result = await saveDraft(getDb(), person.organizationId, id, person.id, {
    expectedRevision: body.expectedRevision,
    title: body.title,
    structure: body.structure,
    document,
    report,
  });
  if (result.kind === 'not-found') throw new AppError('NOT_FOUND');
  if (result.kind !== 'saved') refuse(result, body.expectedRevision);
  return json({ plan: planJson(result.plan) });
});

function refuse(result: { kind: 'stale' | 'not-editable'; current: PlanDetail }, yourRevision: number): never {
  if (result.kind === 'stale') {
    throw new AppError('STALE_REVISION', { extra: { currentRevision: result.current.currentRevision, yourRevision, current: planJson(result.current) } });
  }
  throw new AppError('NOT_EDITABLE', { extra: { status: result.current.status, currentRevision: result.current.currentRevision } });
}

/**
 * Plans as the crew lead writes them: start one, save a revision, check it again. Called by the
 * JSON endpoints and the new-plan page alike; each returns the plan or throws an AppError.
 */
import type { z } from 'zod';
import { getDb } from '@db/connection';
import { createPlan, describeStructure, getPlan, saveDraft, storeReport, type PlanDetail } from '@db/repositories/plans';
import type { Person } from '@/lib/domain/people';
import type { CheckReport } from '@/lib/domain/report';
import { judgeSave } from '@/lib/domain/review-guards';
import type { createPlanBody, savePlanBody } from '@/lib/schemas/api';
import { checkForOrganization } from '@/lib/server/checking';
import { AppError } from '@/lib/server/errors';
import { allows, assertCan } from '@/lib/server/guards';
import { planJson } from '@/lib/server/plan-json';
import { requirePlan } from './review';

/** A new draft from `{title, structure?, document}`; the first revision carries its check. */
export async function startPlan(person: Person, input: z.infer<typeof createPlanBody>): Promise<PlanDetail> {
  assertCan(person, 'plan.create');
  const db = getDb();
  const document = { ...input.document, title: input.title };
  return createPlan(db, {
    organizationId: person.organizationId,
    authorId: person.id,
    title: input.title,
    structure: input.structure ?? describeStructure(document),
    document,
    report: await checkForOrganization(db, person.organizationId, document),
  });
}

function refuse(kind: 'stale' | 'not-editable', current: PlanDetail, yourRevision: number): never {
  if (kind === 'stale') {
    throw new AppError('STALE_REVISION', { extra: { currentRevision: current.currentRevision, yourRevision, current: planJson(current) } });
  }
  throw new AppError('NOT_EDITABLE', { extra: { status: current.status, currentRevision: current.currentRevision } });
}

/**
 * Saves a new revision of a draft. The input names the revision it was edited from; when someone
 * saved since, STALE_REVISION carries the current revision, and nothing is overwritten.
 */
export async function savePlan(person: Person, planId: number, input: z.infer<typeof savePlanBody>): Promise<PlanDetail> {
  assertCan(person, 'plan.edit');
  const db = getDb();
  const document = input.title ? { ...input.document, title: input.title } : input.document;
  // Refuse a stale or locked save before spending a check on it; saveDraft judges again under
  // the row lock, so a save racing this one is still caught.
  const before = await requirePlan(person, planId);
  const verdict = judgeSave({ status: before.status, currentRevision: before.currentRevision, expectedRevision: input.expectedRevision });
  if (verdict.kind !== 'save') refuse(verdict.kind, before, input.expectedRevision);
  const report = await checkForOrganization(db, person.organizationId, document);
  const result = await saveDraft(db, person.organizationId, planId, person.id, { expectedRevision: input.expectedRevision, title: input.title, structure: input.structure, document, report });
  if (result.kind === 'not-found') throw new AppError('NOT_FOUND');
  if (result.kind !== 'saved') refuse(result.kind, result.current, input.expectedRevision);
  return result.plan;
}

/**
 * Checks the plan's current revision again. For a crew lead or admin (who may edit the plan) the
 * report is stored with that revision when it may take one; for anyone else it is only returned.
 */
export async function recheckPlan(person: Person, planId: number): Promise<{ revision: number; stored: boolean; report: CheckReport }> {
  assertCan(person, 'plan.check');
  const db = getDb();
  const plan = await getPlan(db, person.organizationId, planId);
  if (!plan) throw new AppError('NOT_FOUND');
  const report = await checkForOrganization(db, person.organizationId, plan.document);
  const stored = allows(person, 'plan.edit') && (await storeReport(db, person.organizationId, planId, plan.currentRevision, report));
  return { revision: plan.currentRevision, stored, report };
}

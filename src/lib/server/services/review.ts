/**
 * The review workflow's operations, one function each, called by the JSON endpoints and the form
 * pages alike: who may do it, a fresh server check where one is needed, the move in one
 * transaction (the guards are the domain's, src/lib/domain/review-guards.ts) and the mail queued
 * inside it. Each returns the plan as it now is or throws an AppError.
 */
import { getDb } from '@db/connection';
import { getPlan, type PlanDetail } from '@db/repositories/plans';
import { decidePlan, reopenApproved, submitPlan } from '@db/repositories/review';
import { withdrawPlan } from '@db/repositories/withdraw';
import { can, rolesFor } from '@/lib/domain/permissions';
import { decisionRecord, type DecisionRequest } from '@/lib/domain/review-guards';
import type { Person } from '@/lib/domain/people';
import { checkForOrganization } from '@/lib/server/checking';
import { AppError } from '@/lib/server/errors';
import { fingerprint } from '@/lib/server/fingerprint';
import { assertCan } from '@/lib/server/guards';
import { queueMail } from '@/lib/server/mail';
import { decidedMessage, submittedMessage } from '@/lib/server/mail-messages';
import { publicUrl } from '@/lib/server/settings';

export async function requirePlan(person: Person, planId: number): Promise<PlanDetail> {
  const plan = await getPlan(getDb(), person.organizationId, planId);
  if (!plan) throw new AppError('NOT_FOUND');
  return plan;
}

/** Submits the plan for review; refused while the server's own check finds any blocker. */
export async function submitForReview(person: Person, planId: number, requestUrl?: URL): Promise<PlanDetail> {
  assertCan(person, 'plan.submit');
  const db = getDb();
  const plan = await requirePlan(person, planId);
  const report = await checkForOrganization(db, person.organizationId, plan.document, 'submit');
  // The reviewers' mail is queued inside the transaction: the request does all of it or none.
  const outcome = await submitPlan(db, person.organizationId, planId, person.id, report, {
    checkedRevision: plan.currentRevision,
    then: async (transaction, revision) => {
      const reviewers = await db.models.User.findAll({ where: { organizationId: person.organizationId, role: [...rolesFor('notify.plan-submitted')], disabled: false }, attributes: ['email', 'id'], transaction });
      const ref = { id: plan.id, title: plan.title, revision, organizationId: person.organizationId };
      await queueMail(reviewers.filter((r) => r.id !== person.id).map((r) => submittedMessage(r.email, ref, person.name, publicUrl(requestUrl))), transaction);
    },
  });
  if (outcome.kind === 'not-found') throw new AppError('NOT_FOUND');
  if (outcome.kind === 'stale') throw new AppError('STALE_REVISION', { message: 'The plan was saved while it was being submitted, so the revision checked is not the current one; nothing was submitted. Submit again.', extra: { currentRevision: outcome.revision } });
  if (outcome.kind === 'not-submittable') throw new AppError('NOT_SUBMITTABLE', { extra: { status: outcome.status } });
  if (outcome.kind === 'blocked') {
    const blockers = report.findings.filter((f) => f.severity === 'blocker').map((f) => ({ rule: f.rule, elements: f.elements, message: f.message }));
    throw new AppError('SUBMIT_BLOCKED', { extra: { blockers } });
  }
  return (await getPlan(db, person.organizationId, planId))!;
}

/** Records a reviewer's decision; the approval carries the hashes of the document and report. */
export async function decide(person: Person, planId: number, input: DecisionRequest, requestUrl?: URL): Promise<PlanDetail> {
  assertCan(person, 'plan.review');
  const db = getDb();
  const plan = await requirePlan(person, planId);
  const record = decisionRecord(input, plan.currentRevision, () => ({ documentHash: fingerprint(plan.document), reportHash: fingerprint(plan.report) }));
  const outcome = await decidePlan(db, person.organizationId, planId, person.id, record, async (transaction, revision) => {
    // The author's mail is queued inside the decision's transaction: all of it or none.
    const author = await db.models.User.findByPk(plan.authorId, { attributes: ['email', 'disabled'], transaction });
    if (!author || author.disabled) return;
    const open = await db.models.PlanComment.findAll({ where: { planId, resolvedAt: null, replyTo: null }, order: [['id', 'ASC']], transaction });
    const ref = { id: plan.id, title: plan.title, revision, organizationId: person.organizationId };
    await queueMail([decidedMessage(author.email, ref, input.decision, person.name, open.map((c) => (c.elementId ? `${c.elementId}: ${c.body}` : c.body)), publicUrl(requestUrl))], transaction);
  });
  switch (outcome.kind) {
    case 'not-found':
      throw new AppError('NOT_FOUND');
    case 'own-plan':
      throw new AppError('OWN_PLAN');
    case 'related-reviewer':
      throw new AppError('RELATED_REVIEWER');
    case 'not-submitted':
      throw new AppError('NOT_SUBMITTED', { extra: { status: outcome.status } });
    case 'already-decided':
      throw new AppError('ALREADY_DECIDED');
    case 'stale':
      throw new AppError('STALE_REVISION', { extra: { currentRevision: outcome.currentRevision } });
    case 'ok':
      break;
  }
  return (await getPlan(db, person.organizationId, planId))!;
}

/** Starts a new draft revision from an approved plan; the approved revision stays as it was. */
export async function reopen(person: Person, planId: number): Promise<PlanDetail> {
  assertCan(person, 'plan.reopen');
  const outcome = await reopenApproved(getDb(), person.organizationId, planId, person.id);
  if (outcome.kind === 'not-found') throw new AppError('NOT_FOUND');
  if (outcome.kind === 'not-approved') throw new AppError('NOT_APPROVED', { extra: { status: outcome.status } });
  return (await getPlan(getDb(), person.organizationId, planId))!;
}

/** Takes a submitted plan back to a draft at the same revision, before a reviewer decides it. */
export async function withdraw(person: Person, planId: number): Promise<PlanDetail> {
  assertCan(person, 'plan.withdraw');
  const outcome = await withdrawPlan(getDb(), person.organizationId, planId, { id: person.id, isAdmin: can(person.role, 'plan.withdraw-any') });
  if (outcome.kind === 'not-found') throw new AppError('NOT_FOUND');
  if (outcome.kind === 'not-author') throw new AppError('NOT_AUTHOR');
  if (outcome.kind === 'not-submitted') throw new AppError('NOT_WITHDRAWABLE', { extra: { status: outcome.status } });
  return (await getPlan(getDb(), person.organizationId, planId))!;
}

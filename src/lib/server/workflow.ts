/**
 * The review workflow as the endpoints and pages use it: each step re-reads and re-checks on the
 * server, moves the plan in one transaction, and queues the messages that go with it.
 */
import { getDb } from '../../../db/connection';
import { getPlan, type PlanDetail } from '../../../db/repositories/plans';
import { decidePlan, reopenApproved, submitPlan, type Decision } from '../../../db/repositories/review';
import { canonicalHash } from '../domain/canonical-json';
import type { Person } from '../domain/people';
import { checkDocument } from './checking';
import { AppError } from './errors';
import { queueMail } from './mail';
import { decidedMessage, submittedMessage } from './mail-messages';
import { publicUrl } from './settings';

async function requirePlan(person: Person, planId: number): Promise<PlanDetail> {
  const plan = await getPlan(getDb(), person.organizationId, planId);
  if (!plan) throw new AppError('NOT_FOUND');
  return plan;
}

/** Submits the plan for review; refused while the server's own check finds any blocker. */
export async function submitForReview(person: Person, planId: number, requestUrl?: URL): Promise<PlanDetail> {
  const db = getDb();
  const plan = await requirePlan(person, planId);
  const report = await checkDocument(plan.document);
  const outcome = await submitPlan(db, person.organizationId, planId, person.id, report);
  if (outcome.kind === 'not-found') throw new AppError('NOT_FOUND');
  if (outcome.kind === 'not-submittable') throw new AppError('NOT_SUBMITTABLE', { extra: { status: outcome.status } });
  if (outcome.kind === 'blocked') {
    const blockers = report.findings.filter((f) => f.severity === 'blocker').map((f) => ({ rule: f.rule, elements: f.elements, message: f.message }));
    throw new AppError('SUBMIT_BLOCKED', { extra: { blockers } });
  }
  const reviewers = await db.models.User.findAll({ where: { organizationId: person.organizationId, role: 'reviewer', disabled: false }, attributes: ['email', 'id'] });
  const ref = { id: plan.id, title: plan.title, revision: plan.currentRevision, organizationId: person.organizationId };
  await queueMail(reviewers.filter((r) => r.id !== person.id).map((r) => submittedMessage(r.email, ref, person.name, publicUrl(requestUrl))));
  return (await getPlan(db, person.organizationId, planId))!;
}

/** Records a reviewer's decision; the approval carries the hashes of the document and report. */
export async function decide(
  person: Person,
  planId: number,
  input: { decision: Decision; comment?: string; teachingNote?: string; revision?: number },
  requestUrl?: URL,
): Promise<PlanDetail> {
  const db = getDb();
  const plan = await requirePlan(person, planId);
  const approving = input.decision === 'approve';
  const outcome = await decidePlan(db, person.organizationId, planId, person.id, {
    decision: input.decision,
    comment: input.comment || null,
    teachingNote: approving ? input.teachingNote || null : null,
    documentHash: approving ? canonicalHash(plan.document) : null,
    reportHash: approving ? canonicalHash(plan.report) : null,
    revision: input.revision ?? plan.currentRevision,
  });
  switch (outcome.kind) {
    case 'not-found':
      throw new AppError('NOT_FOUND');
    case 'own-plan':
      throw new AppError('OWN_PLAN');
    case 'not-submitted':
      throw new AppError('NOT_SUBMITTED', { extra: { status: outcome.status } });
    case 'already-decided':
      throw new AppError('ALREADY_DECIDED');
    case 'stale':
      throw new AppError('STALE_REVISION', { extra: { currentRevision: outcome.currentRevision } });
    case 'ok':
      break;
  }
  const author = await db.models.User.findByPk(plan.authorId, { attributes: ['email', 'disabled'] });
  if (author && !author.disabled) {
    const open = await db.models.PlanComment.findAll({ where: { planId, resolvedAt: null }, order: [['id', 'ASC']] });
    const ref = { id: plan.id, title: plan.title, revision: plan.currentRevision, organizationId: person.organizationId };
    await queueMail([decidedMessage(author.email, ref, input.decision, person.name, open.map((c) => (c.elementId ? `${c.elementId}: ${c.body}` : c.body)), publicUrl(requestUrl))]);
  }
  return (await getPlan(db, person.organizationId, planId))!;
}

/** Starts a new draft revision from an approved plan; the approved revision stays as it was. */
export async function reopen(person: Person, planId: number): Promise<PlanDetail> {
  const outcome = await reopenApproved(getDb(), person.organizationId, planId, person.id);
  if (outcome.kind === 'not-found') throw new AppError('NOT_FOUND');
  if (outcome.kind === 'not-approved') throw new AppError('NOT_APPROVED', { extra: { status: outcome.status } });
  return (await getPlan(getDb(), person.organizationId, planId))!;
}

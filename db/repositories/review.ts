/**
 * The review workflow in the database: submit, decide, start a new revision after approval.
 * Every transition locks the plan row, reads the facts inside the transaction and asks the
 * domain's guards (src/lib/domain/review-guards.ts) what may happen, then persists that; two
 * racing requests can never both move a plan, and the unique (plan, revision) key on decisions
 * is a second guard.
 */
import { Transaction, UniqueConstraintError } from 'sequelize';
import type { PlanStatus } from '@/lib/domain/plan-status';
import { judgeDecision, judgeReopen, judgeSubmit, relatedToEditors, type Decision, type PersonLink } from '@/lib/domain/review-guards';
import type { Db } from '@db/connection';
import { recordEvent } from './audit';
import { storeLibraryFacts } from './library';
import { nameMap } from './names';
import type { StoredReport } from './plans';

export type { Decision } from '@/lib/domain/review-guards';
export { nameMap } from './names';

type Outcome<T extends string> = { kind: 'ok' } | { kind: T; status?: PlanStatus };

// Every query inside a transaction must pass it: a query on another pooled connection while the
// row lock is held can starve the pool under a burst of requests.
const locked = () => ({ isolationLevel: Transaction.ISOLATION_LEVELS.READ_COMMITTED });

/** Work to do inside a workflow transaction once the plan has moved (e.g. queue its mail). */
export type InTransaction = (transaction: Transaction, revision: number) => Promise<void>;

/**
 * Moves a draft or returned plan to submitted; the caller has re-checked the current revision.
 * What may happen is `judgeSubmit`'s verdict; this function reads the facts under the row lock
 * and persists the verdict.
 */
export async function submitPlan(
  db: Db,
  organizationId: number,
  planId: number,
  actorId: string,
  report: StoredReport,
  options: { checkedRevision?: number; then?: InTransaction } = {},
): Promise<Outcome<'not-found' | 'not-submittable' | 'blocked' | 'stale'> & { revision?: number }> {
  return db.sequelize.transaction(locked(), async (transaction) => {
    const plan = await db.models.Plan.findOne({ where: { id: planId, organizationId }, lock: transaction.LOCK.UPDATE, transaction });
    if (!plan) return { kind: 'not-found' as const };
    const counts = { blockers: report.summary.blockers, warnings: report.summary.warnings };
    const decided = (await db.models.PlanDecision.count({ where: { planId, revision: plan.currentRevision }, transaction })) > 0;
    const verdict = judgeSubmit({ status: plan.status, currentRevision: plan.currentRevision, checkedRevision: options.checkedRevision, blockers: counts.blockers, decided });
    if (verdict.kind === 'not-submittable') return { kind: 'not-submittable' as const, status: verdict.status };
    if (verdict.kind === 'stale') return { kind: 'stale' as const, revision: verdict.revision };
    if (verdict.kind === 'blocked') {
      if (verdict.storeReport) {
        await db.models.PlanRevision.update({ report: JSON.stringify(report) }, { where: { planId, number: plan.currentRevision }, transaction });
        await plan.update(counts, { transaction });
      }
      return { kind: 'blocked' as const };
    }
    const { revision } = verdict;
    if (verdict.copy) {
      const current = await db.models.PlanRevision.findOne({ where: { planId, number: plan.currentRevision }, transaction });
      await db.models.PlanRevision.create({ planId, number: revision, document: current!.document, report: JSON.stringify(report), createdBy: actorId }, { transaction });
    } else {
      await db.models.PlanRevision.update({ report: JSON.stringify(report) }, { where: { planId, number: revision }, transaction });
    }
    await plan.update({ ...counts, currentRevision: revision, status: verdict.status, submittedAt: new Date() }, { transaction });
    await recordEvent(db, { organizationId, actorId, action: 'plan.submitted', subjectType: 'plan', subjectId: planId, details: { revision, ...(verdict.copy ? { copiedFrom: revision - 1 } : {}) } }, transaction);
    await options.then?.(transaction, revision);
    return { kind: 'ok' as const, revision };
  });
}

/** People who created any revision of the plan: its author and editors, who may not review it. */
export async function planEditors(db: Db, planId: number, transaction?: Transaction): Promise<Set<string>> {
  const rows = await db.models.PlanRevision.findAll({ where: { planId }, attributes: ['createdBy'], group: ['createdBy'], transaction });
  const plan = await db.models.Plan.findByPk(planId, { attributes: ['authorId'], transaction });
  return new Set([...rows.map((r) => r.createdBy), ...(plan ? [plan.authorId] : [])]);
}

export interface DecisionInput {
  decision: Decision;
  comment: string | null;
  teachingNote: string | null;
  /** For approvals: hashes of the approved document and report. */
  documentHash: string | null;
  reportHash: string | null;
  /** The revision the reviewer looked at; a decision on anything else is stale. */
  revision: number;
}

export type DecisionOutcome =
  | { kind: 'ok'; revision: number; status: PlanStatus }
  | { kind: 'not-found' }
  | { kind: 'not-submitted'; status: PlanStatus }
  | { kind: 'stale'; currentRevision: number }
  | { kind: 'own-plan' }
  | { kind: 'related-reviewer' }
  | { kind: 'already-decided' };

/**
 * Records one reviewer's decision on the submitted revision and moves the plan on, as
 * `judgeDecision` rules; an approval also stores what the library shows of the revision.
 */
export async function decidePlan(db: Db, organizationId: number, planId: number, reviewerId: string, input: DecisionInput, then?: InTransaction): Promise<DecisionOutcome> {
  try {
    return await db.sequelize.transaction(locked(), async (transaction): Promise<DecisionOutcome> => {
      const plan = await db.models.Plan.findOne({ where: { id: planId, organizationId }, lock: transaction.LOCK.UPDATE, transaction });
      if (!plan) return { kind: 'not-found' };
      const editors = await planEditors(db, planId, transaction);
      // The people are read only when the verdict needs them (an approval by a non-editor).
      const people = input.decision === 'approve' && !editors.has(reviewerId) ? await peopleLinks(db, organizationId, transaction) : [];
      const verdict = judgeDecision({
        status: plan.status,
        currentRevision: plan.currentRevision,
        decision: input.decision,
        revision: input.revision,
        reviewerId,
        editors,
        related: () => relatedToEditors(people, reviewerId, editors),
      });
      if (verdict.kind !== 'decide') return verdict;
      const { revision, status } = verdict;
      await db.models.PlanDecision.create(
        { planId, revision, decision: input.decision, reviewerId, comment: input.comment, teachingNote: input.teachingNote, documentHash: input.documentHash, reportHash: input.reportHash },
        { transaction },
      );
      await plan.update({ status, submittedAt: null, ...(verdict.approvedRevision !== null ? { approvedRevision: verdict.approvedRevision } : {}) }, { transaction });
      if (verdict.approvedRevision !== null) await storeLibraryFacts(db, planId, revision, transaction);
      if (verdict.commentOnRevision && input.comment) {
        await db.models.PlanComment.create({ planId, revision, elementId: null, authorId: reviewerId, body: input.comment, resolvedAt: null, resolvedBy: null }, { transaction });
      }
      await recordEvent(db, { organizationId, actorId: reviewerId, action: status === 'approved' ? 'plan.approved' : 'plan.returned', subjectType: 'plan', subjectId: planId, details: { revision, comment: input.comment, documentHash: input.documentHash } }, transaction);
      await then?.(transaction, revision);
      return { kind: 'ok', revision, status };
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) return { kind: 'already-decided' };
    throw error;
  }
}

/** The organisation's people as the independence rule needs them (id, mailbox, who invited them). */
async function peopleLinks(db: Db, organizationId: number, transaction?: Transaction): Promise<PersonLink[]> {
  const rows = await db.models.User.findAll({ where: { organizationId }, attributes: ['id', 'email', 'invitedBy'], transaction });
  return rows.map((r) => ({ id: r.id, email: r.email, invitedBy: r.invitedBy }));
}

/** Starts a new draft revision of an approved plan (a copy of the approved document). */
export async function reopenApproved(db: Db, organizationId: number, planId: number, actorId: string): Promise<Outcome<'not-found' | 'not-approved'> & { revision?: number }> {
  return db.sequelize.transaction(locked(), async (transaction) => {
    const plan = await db.models.Plan.findOne({ where: { id: planId, organizationId }, lock: transaction.LOCK.UPDATE, transaction });
    if (!plan) return { kind: 'not-found' as const };
    const verdict = judgeReopen(plan.status, plan.currentRevision);
    if (verdict.kind === 'not-approved') return verdict;
    const current = await db.models.PlanRevision.findOne({ where: { planId, number: plan.currentRevision }, transaction });
    const number = verdict.revision;
    await db.models.PlanRevision.create({ planId, number, document: current!.document, report: current!.report, createdBy: actorId }, { transaction });
    await plan.update({ status: verdict.status, currentRevision: number }, { transaction });
    await recordEvent(db, { organizationId, actorId, action: 'plan.reopened', subjectType: 'plan', subjectId: planId, details: { revision: number, approvedRevision: plan.approvedRevision } }, transaction);
    return { kind: 'ok' as const, revision: number };
  });
}

export interface DecisionRecord {
  revision: number;
  decision: Decision;
  reviewerId: string;
  reviewerName: string;
  comment: string | null;
  teachingNote: string | null;
  documentHash: string | null;
  reportHash: string | null;
  decidedAt: Date;
}

export async function listDecisions(db: Db, planId: number): Promise<DecisionRecord[]> {
  const rows = await db.models.PlanDecision.findAll({ where: { planId }, order: [['revision', 'ASC']] });
  const names = await nameMap(db, rows.map((r) => r.reviewerId));
  return rows.map((r) => ({
    revision: r.revision,
    decision: r.decision,
    reviewerId: r.reviewerId,
    reviewerName: names.get(r.reviewerId) ?? '',
    comment: r.comment,
    teachingNote: r.teachingNote,
    documentHash: r.documentHash,
    reportHash: r.reportHash,
    decidedAt: r.decidedAt,
  }));
}

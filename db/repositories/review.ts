/**
 * The review workflow in the database: submit, decide, start a new revision after approval.
 * Every transition locks the plan row and checks the state inside the transaction, so two
 * racing requests can never both move a plan; the unique (plan, revision) key on decisions is
 * a second guard.
 */
import { Transaction, UniqueConstraintError } from 'sequelize';
import { isEditable, type PlanStatus } from '../../src/lib/domain/plan-status';
import type { Db } from '../connection';
import { recordEvent } from './audit';
import type { StoredReport } from './plans';

export type Decision = 'approve' | 'return';

type Outcome<T extends string> = { kind: 'ok' } | { kind: T; status?: PlanStatus };

// Every query inside a transaction must pass it: a query on another pooled connection while the
// row lock is held can starve the pool under a burst of requests.
const locked = () => ({ isolationLevel: Transaction.ISOLATION_LEVELS.READ_COMMITTED });

/** Moves a draft or returned plan to submitted; the caller has re-checked the current revision. */
export async function submitPlan(db: Db, organizationId: number, planId: number, actorId: string, report: StoredReport): Promise<Outcome<'not-found' | 'not-submittable' | 'blocked'>> {
  return db.sequelize.transaction(locked(), async (transaction) => {
    const plan = await db.models.Plan.findOne({ where: { id: planId, organizationId }, lock: transaction.LOCK.UPDATE, transaction });
    if (!plan) return { kind: 'not-found' };
    if (!isEditable(plan.status)) return { kind: 'not-submittable', status: plan.status };
    const blockers = report.summary?.blockers ?? 0;
    await db.models.PlanRevision.update({ report: JSON.stringify(report) }, { where: { planId, number: plan.currentRevision }, transaction });
    await plan.update({ blockers, warnings: report.summary?.warnings ?? 0 }, { transaction });
    if (blockers > 0) return { kind: 'blocked' };
    await plan.update({ status: 'submitted', submittedAt: new Date() }, { transaction });
    await recordEvent(db, { organizationId, actorId, action: 'plan.submitted', subjectType: 'plan', subjectId: planId, details: { revision: plan.currentRevision } }, transaction);
    return { kind: 'ok' };
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
  | { kind: 'already-decided' };

/** Records one reviewer's decision on the submitted revision and moves the plan on. */
export async function decidePlan(db: Db, organizationId: number, planId: number, reviewerId: string, input: DecisionInput): Promise<DecisionOutcome> {
  try {
    return await db.sequelize.transaction(locked(), async (transaction): Promise<DecisionOutcome> => {
      const plan = await db.models.Plan.findOne({ where: { id: planId, organizationId }, lock: transaction.LOCK.UPDATE, transaction });
      if (!plan) return { kind: 'not-found' };
      if ((await planEditors(db, planId, transaction)).has(reviewerId)) return { kind: 'own-plan' };
      if (plan.status !== 'submitted') return { kind: 'not-submitted', status: plan.status };
      if (plan.currentRevision !== input.revision) return { kind: 'stale', currentRevision: plan.currentRevision };
      await db.models.PlanDecision.create(
        { planId, revision: plan.currentRevision, decision: input.decision, reviewerId, comment: input.comment, teachingNote: input.teachingNote, documentHash: input.documentHash, reportHash: input.reportHash },
        { transaction },
      );
      const status: PlanStatus = input.decision === 'approve' ? 'approved' : 'returned';
      await plan.update({ status, submittedAt: null, ...(status === 'approved' ? { approvedRevision: plan.currentRevision } : {}) }, { transaction });
      if (input.decision === 'return' && input.comment) {
        await db.models.PlanComment.create({ planId, revision: plan.currentRevision, elementId: null, authorId: reviewerId, body: input.comment, resolvedAt: null, resolvedBy: null }, { transaction });
      }
      await recordEvent(db, { organizationId, actorId: reviewerId, action: status === 'approved' ? 'plan.approved' : 'plan.returned', subjectType: 'plan', subjectId: planId, details: { revision: plan.currentRevision, comment: input.comment, documentHash: input.documentHash } }, transaction);
      return { kind: 'ok', revision: plan.currentRevision, status };
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) return { kind: 'already-decided' };
    throw error;
  }
}

/** Starts a new draft revision of an approved plan (a copy of the approved document). */
export async function reopenApproved(db: Db, organizationId: number, planId: number, actorId: string): Promise<Outcome<'not-found' | 'not-approved'> & { revision?: number }> {
  return db.sequelize.transaction(locked(), async (transaction) => {
    const plan = await db.models.Plan.findOne({ where: { id: planId, organizationId }, lock: transaction.LOCK.UPDATE, transaction });
    if (!plan) return { kind: 'not-found' as const };
    if (plan.status !== 'approved') return { kind: 'not-approved' as const, status: plan.status };
    const current = await db.models.PlanRevision.findOne({ where: { planId, number: plan.currentRevision }, transaction });
    const number = plan.currentRevision + 1;
    await db.models.PlanRevision.create({ planId, number, document: current!.document, report: current!.report, createdBy: actorId }, { transaction });
    await plan.update({ status: 'draft', currentRevision: number, lockVersion: plan.lockVersion + 1 }, { transaction });
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

export async function nameMap(db: Db, ids: string[]): Promise<Map<string, string>> {
  const unique = [...new Set(ids)];
  if (!unique.length) return new Map();
  const rows = await db.models.User.findAll({ where: { id: unique }, attributes: ['id', 'name'] });
  return new Map(rows.map((r) => [r.id, r.name]));
}

/**
 * The review workflow in the database: submit, decide, start a new revision after approval.
 * Every transition locks the plan row and checks the state inside the transaction, so two
 * racing requests can never both move a plan; the unique (plan, revision) key on decisions is
 * a second guard.
 */
import { Transaction, UniqueConstraintError } from 'sequelize';
import { mailboxKey } from '../../src/lib/domain/people';
import { isEditable, type PlanStatus } from '../../src/lib/domain/plan-status';
import type { Db } from '../connection';
import { recordEvent } from './audit';
import type { StoredReport } from './plans';

export type Decision = 'approve' | 'return';

type Outcome<T extends string> = { kind: 'ok' } | { kind: T; status?: PlanStatus };

// Every query inside a transaction must pass it: a query on another pooled connection while the
// row lock is held can starve the pool under a burst of requests.
const locked = () => ({ isolationLevel: Transaction.ISOLATION_LEVELS.READ_COMMITTED });

/** Work to do inside a workflow transaction once the plan has moved (e.g. queue its mail). */
export type InTransaction = (transaction: Transaction, revision: number) => Promise<void>;

/**
 * Moves a draft or returned plan to submitted; the caller has re-checked the current revision.
 * A returned plan submitted again without edits gets a new revision (a copy of the returned
 * document), since the returned revision keeps its decision and each revision is decided once.
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
    if (!isEditable(plan.status)) return { kind: 'not-submittable' as const, status: plan.status };
    // The report is of the revision the caller read; a save since then has not been checked.
    if (options.checkedRevision !== undefined && plan.currentRevision !== options.checkedRevision) return { kind: 'stale' as const, revision: plan.currentRevision };
    const blockers = report.summary?.blockers ?? 0;
    const counts = { blockers, warnings: report.summary?.warnings ?? 0 };
    const decided = (await db.models.PlanDecision.count({ where: { planId, revision: plan.currentRevision }, transaction })) > 0;
    // A decided revision never changes: a blocked resubmission leaves it (and the plan) as they are.
    if (blockers > 0) {
      if (!decided) {
        await db.models.PlanRevision.update({ report: JSON.stringify(report) }, { where: { planId, number: plan.currentRevision }, transaction });
        await plan.update(counts, { transaction });
      }
      return { kind: 'blocked' as const };
    }
    let revision = plan.currentRevision;
    if (decided) {
      const current = await db.models.PlanRevision.findOne({ where: { planId, number: revision }, transaction });
      revision += 1;
      await db.models.PlanRevision.create({ planId, number: revision, document: current!.document, report: JSON.stringify(report), createdBy: actorId }, { transaction });
      await plan.update({ currentRevision: revision, lockVersion: plan.lockVersion + 1 }, { transaction });
    } else {
      await db.models.PlanRevision.update({ report: JSON.stringify(report) }, { where: { planId, number: revision }, transaction });
    }
    await plan.update({ ...counts, status: 'submitted', submittedAt: new Date() }, { transaction });
    await recordEvent(db, { organizationId, actorId, action: 'plan.submitted', subjectType: 'plan', subjectId: planId, details: { revision, ...(decided ? { copiedFrom: revision - 1 } : {}) } }, transaction);
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

/** Records one reviewer's decision on the submitted revision and moves the plan on. */
export async function decidePlan(db: Db, organizationId: number, planId: number, reviewerId: string, input: DecisionInput, then?: InTransaction): Promise<DecisionOutcome> {
  try {
    return await db.sequelize.transaction(locked(), async (transaction): Promise<DecisionOutcome> => {
      const plan = await db.models.Plan.findOne({ where: { id: planId, organizationId }, lock: transaction.LOCK.UPDATE, transaction });
      if (!plan) return { kind: 'not-found' };
      const editors = await planEditors(db, planId, transaction);
      if (editors.has(reviewerId)) return { kind: 'own-plan' };
      if (input.decision === 'approve' && (await relatedToEditors(db, organizationId, reviewerId, editors, transaction))) return { kind: 'related-reviewer' };
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
      await then?.(transaction, plan.currentRevision);
      return { kind: 'ok', revision: plan.currentRevision, status };
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) return { kind: 'already-decided' };
    throw error;
  }
}

/**
 * True when the reviewer is too close to the plan's author or editors to approve it: someone in
 * the chain of people who invited the reviewer is an editor (an admin's second account, or an
 * account made by that account), or the reviewer shares a mailbox with an editor.
 */
export async function relatedToEditors(db: Db, organizationId: number, reviewerId: string, editors: Set<string>, transaction?: Transaction): Promise<boolean> {
  const people = await db.models.User.findAll({ where: { organizationId }, attributes: ['id', 'email', 'invitedBy'], transaction });
  const byId = new Map(people.map((p) => [p.id, p]));
  const reviewer = byId.get(reviewerId);
  if (!reviewer) return false;
  const editorMailboxes = new Set([...editors].map((id) => byId.get(id)).filter((p) => !!p).map((p) => mailboxKey(p!.email)));
  if (editorMailboxes.has(mailboxKey(reviewer.email))) return true;
  const seen = new Set<string>([reviewerId]);
  for (let inviter = reviewer.invitedBy; inviter && !seen.has(inviter); inviter = byId.get(inviter)?.invitedBy ?? null) {
    if (editors.has(inviter)) return true;
    seen.add(inviter);
  }
  return false;
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

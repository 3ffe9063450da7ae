/** Reading revisions one by one, and the comments pinned to their elements. */
import { Op } from 'sequelize';
import type { PlanDocument } from '@/lib/schemas/plan';
import { parseStoredReport } from '@/lib/schemas/report';
import type { Db } from '@db/connection';
import { recordEvent } from './audit';
import { readStoredDocument, type StoredReport } from './plans';
import { listDecisions, nameMap, type DecisionRecord } from './review';

export interface RevisionSummary {
  number: number;
  createdBy: string;
  createdByName: string;
  createdAt: Date;
  blockers: number | null;
  warnings: number | null;
  decision: DecisionRecord | null;
}

export interface RevisionDetail extends RevisionSummary {
  document: PlanDocument;
  report: StoredReport | null;
  /** draft | submitted | approved | returned | superseded: this revision's own state. */
  state: string;
}

async function planRow(db: Db, organizationId: number, planId: number) {
  return db.models.Plan.findOne({ where: { id: planId, organizationId } });
}

export async function listRevisions(db: Db, organizationId: number, planId: number): Promise<RevisionSummary[] | null> {
  if (!(await planRow(db, organizationId, planId))) return null;
  const rows = await db.models.PlanRevision.findAll({ where: { planId }, order: [['number', 'DESC']], attributes: ['number', 'createdBy', 'createdAt', 'report'] });
  const names = await nameMap(db, rows.map((r) => r.createdBy));
  const decisions = new Map((await listDecisions(db, planId)).map((d) => [d.revision, d]));
  return rows.map((r) => {
    const summary = parseStoredReport(r.report)?.summary;
    return {
      number: r.number,
      createdBy: r.createdBy,
      createdByName: names.get(r.createdBy) ?? '',
      createdAt: r.createdAt,
      blockers: summary?.blockers ?? null,
      warnings: summary?.warnings ?? null,
      decision: decisions.get(r.number) ?? null,
    };
  });
}

export async function getRevision(db: Db, organizationId: number, planId: number, number: number): Promise<RevisionDetail | null> {
  const plan = await planRow(db, organizationId, planId);
  if (!plan) return null;
  const row = await db.models.PlanRevision.findOne({ where: { planId, number } });
  if (!row) return null;
  const decision = (await listDecisions(db, planId)).find((d) => d.revision === number) ?? null;
  const names = await nameMap(db, [row.createdBy]);
  const report = parseStoredReport(row.report);
  const state = decision
    ? decision.decision === 'approve' ? 'approved' : 'returned'
    : number === plan.currentRevision ? plan.status : 'superseded';
  return {
    number,
    createdBy: row.createdBy,
    createdByName: names.get(row.createdBy) ?? '',
    createdAt: row.createdAt,
    blockers: report?.summary?.blockers ?? null,
    warnings: report?.summary?.warnings ?? null,
    decision,
    document: readStoredDocument(row.document),
    report,
    state,
  };
}

export interface CommentView {
  id: number;
  revision: number;
  elementId: string | null;
  authorId: string;
  authorName: string;
  body: string;
  createdAt: Date;
  resolvedAt: Date | null;
  resolvedByName: string | null;
  /** The comment this one answers; null when it starts a thread. */
  replyTo: number | null;
}

export async function listComments(db: Db, organizationId: number, planId: number): Promise<CommentView[] | null> {
  if (!(await planRow(db, organizationId, planId))) return null;
  const rows = await db.models.PlanComment.findAll({ where: { planId }, order: [['createdAt', 'ASC'], ['id', 'ASC']] });
  const names = await nameMap(db, rows.flatMap((r) => [r.authorId, ...(r.resolvedBy ? [r.resolvedBy] : [])]));
  return rows.map((r) => ({
    id: r.id,
    revision: r.revision,
    elementId: r.elementId,
    authorId: r.authorId,
    authorName: names.get(r.authorId) ?? '',
    body: r.body,
    createdAt: r.createdAt,
    resolvedAt: r.resolvedAt,
    resolvedByName: r.resolvedBy ? names.get(r.resolvedBy) ?? null : null,
    replyTo: r.replyTo ?? null,
  }));
}

/** Adds a comment to a plan of the organisation; null when the plan is not the organisation's. */
export async function addComment(db: Db, organizationId: number, planId: number, authorId: string, input: { elementId: string | null; body: string; revision: number }): Promise<number | null> {
  return db.sequelize.transaction(async (transaction) => {
    if (!(await db.models.Plan.findOne({ where: { id: planId, organizationId }, attributes: ['id'], transaction }))) return null;
    const row = await db.models.PlanComment.create({ planId, revision: input.revision, elementId: input.elementId, authorId, body: input.body, resolvedAt: null, resolvedBy: null }, { transaction });
    await recordEvent(db, { organizationId, actorId: authorId, action: 'comment.added', subjectType: 'plan', subjectId: planId, details: { commentId: row.id, elementId: input.elementId, revision: input.revision } }, transaction);
    return row.id;
  });
}

/**
 * Marks a comment resolved (or open again); false when it is not a comment of this plan of this
 * organisation, or is a reply (a thread is resolved by its first comment). The plan is checked against the organisation in the same transaction as the write.
 */
export async function setCommentResolved(db: Db, organizationId: number, planId: number, commentId: number, actorId: string, resolved: boolean): Promise<boolean> {
  return db.sequelize.transaction(async (transaction) => {
    if (!(await db.models.Plan.findOne({ where: { id: planId, organizationId }, attributes: ['id'], transaction }))) return false;
    // Found first, then changed: an update that changes nothing reports no rows in MariaDB.
    const comment = await db.models.PlanComment.findOne({ where: { id: commentId, planId, replyTo: null }, transaction });
    if (!comment) return false;
    await comment.update(resolved ? { resolvedAt: new Date(), resolvedBy: actorId } : { resolvedAt: null, resolvedBy: null }, { transaction });
    await recordEvent(db, { organizationId, actorId, action: resolved ? 'comment.resolved' : 'comment.reopened', subjectType: 'plan', subjectId: planId, details: { commentId } }, transaction);
    return true;
  });
}

/** Open comment counts for many plans at once (the home page's Returned list). */
export async function openCommentCounts(db: Db, planIds: number[]): Promise<Map<number, number>> {
  if (!planIds.length) return new Map();
  const rows = (await db.models.PlanComment.findAll({
    where: { planId: { [Op.in]: planIds }, resolvedAt: null, replyTo: null },
    attributes: ['planId', [db.sequelize.fn('COUNT', db.sequelize.col('id')), 'n']],
    group: ['planId'],
    raw: true,
  })) as unknown as { planId: number; n: number | string }[];
  return new Map(rows.map((r) => [r.planId, Number(r.n)]));
}

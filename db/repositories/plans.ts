/**
 * Plans and their revisions. Every function takes the organisation id: a plan of another
 * organisation is simply not found. Revisions are only ever inserted.
 */
import { QueryTypes, Transaction } from 'sequelize';
import type { PlanStatus } from '@/lib/domain/plan-status';
import { judgeSave, mayStoreReport } from '@/lib/domain/review-guards';
import { defaultSortDir, type ListPlansQuery } from '@/lib/schemas/api';
import { pruneDeep } from '@/lib/schemas/depth';
import { migratePlan } from '@/lib/domain/plan-migrations';
import type { CheckReport } from '@/lib/domain/report';
import { planSchema, type PlanDocument } from '@/lib/schemas/plan';
import { parseStoredReport } from '@/lib/schemas/report';
import type { Db } from '@db/connection';
import { recordEvent } from './audit';

export interface PlanSummary {
  id: number;
  title: string;
  structure: string;
  status: PlanStatus;
  blockers: number | null;
  warnings: number | null;
  authorId: string;
  authorName: string;
  currentRevision: number;
  submittedAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
}

/** A stored check report, read through its schema (src/lib/schemas/report.ts). */
export type StoredReport = CheckReport;

export interface PlanDetail extends PlanSummary {
  document: PlanDocument;
  report: StoredReport | null;
  revisionCreatedAt: Date;
  revisionCreatedBy: string;
}

export interface PlanPage {
  items: PlanSummary[];
  total: number;
  page: number;
  pageSize: number;
  pages: number;
}

/**
 * Parses a stored document with the plan schema after migrating it to the current version
 * (`migratePlan`): a corrupt row is an error, never silently used. Extra fields nested deeper
 * than the format allows (stored before the limit) are cut first.
 */
export function readStoredDocument(text: string): PlanDocument {
  return planSchema.parse(migratePlan(pruneDeep(JSON.parse(text))));
}

/** Sort keys to columns (fixed strings: nothing from the request reaches the SQL text). */
const SORT_COLUMNS: Record<ListPlansQuery['sort'], string> = {
  updated: 'updated_at',
  created: 'created_at',
  title: 'title',
  status: 'status',
  blockers: 'blockers',
  warnings: 'warnings',
  structure: 'structure',
  submitted: 'submitted_at',
};

const SUMMARY_COLUMNS = `p.id, p.title, p.structure, p.status, p.blockers, p.warnings, p.author_id AS authorId, u.name AS authorName,
  p.current_revision AS currentRevision, p.submitted_at AS submittedAt, p.created_at AS createdAt, p.updated_at AS updatedAt`;

type SummaryRow = Omit<PlanSummary, 'authorName'> & { authorName: string | null; total?: number | bigint };

const toDate = (v: Date | string) => (v instanceof Date ? v : new Date(`${v.replace(' ', 'T')}Z`));

function rowToSummary(row: SummaryRow): PlanSummary {
  return {
    id: Number(row.id),
    title: row.title,
    structure: row.structure,
    status: row.status,
    blockers: row.blockers === null ? null : Number(row.blockers),
    warnings: row.warnings === null ? null : Number(row.warnings),
    authorId: row.authorId,
    authorName: row.authorName ?? '',
    currentRevision: Number(row.currentRevision),
    submittedAt: row.submittedAt === null ? null : toDate(row.submittedAt),
    createdAt: toDate(row.createdAt),
    updatedAt: toDate(row.updatedAt),
  };
}

/**
 * One page of the organisation's plans, filtered and sorted (ties broken by id for stable paging).
 * One query: the page and, through a window count, the total. Only a page past the end (no rows,
 * so no total) costs a second, counting query. Plain rows: a list needs no model instances and
 * never reads a document.
 */
export async function listPlans(db: Db, organizationId: number, query: ListPlansQuery & { authorId?: string; statuses?: PlanStatus[] }): Promise<PlanPage> {
  const where = ['p.organization_id = ?'];
  const values: unknown[] = [organizationId];
  if (query.status) {
    where.push('p.status = ?');
    values.push(query.status);
  } else if (query.statuses) {
    if (query.statuses.length === 0) where.push('FALSE');
    else {
      where.push(`p.status IN (${query.statuses.map(() => '?').join(', ')})`);
      values.push(...query.statuses);
    }
  }
  if (query.authorId) {
    where.push('p.author_id = ?');
    values.push(query.authorId);
  }
  if (query.q) {
    where.push('p.title LIKE ?'); // backslash is LIKE's escape character by default
    values.push(`%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`);
  }
  const dir = (query.dir ?? defaultSortDir(query.sort)) === 'asc' ? 'ASC' : 'DESC';
  const filter = where.join(' AND ');
  const sql = `SELECT ${SUMMARY_COLUMNS}, COUNT(*) OVER () AS total FROM plans p LEFT JOIN users u ON u.id = p.author_id
    WHERE ${filter} ORDER BY p.${SORT_COLUMNS[query.sort]} ${dir}, p.id ${dir} LIMIT ? OFFSET ?`;
  const rows = await db.sequelize.query<SummaryRow>(sql, { replacements: [...values, query.pageSize, (query.page - 1) * query.pageSize], type: QueryTypes.SELECT });
  let count = rows.length ? Number(rows[0].total) : 0;
  if (!rows.length && query.page > 1) {
    const [counted] = await db.sequelize.query<{ n: number | bigint }>(`SELECT COUNT(*) AS n FROM plans p WHERE ${filter}`, { replacements: values, type: QueryTypes.SELECT });
    count = Number(counted.n);
  }
  return {
    items: rows.map(rowToSummary),
    total: count,
    page: query.page,
    pageSize: query.pageSize,
    pages: Math.max(1, Math.ceil(count / query.pageSize)),
  };
}

export async function countPlansByStatus(db: Db, organizationId: number, authorId?: string): Promise<Record<PlanStatus, number>> {
  const rows = (await db.models.Plan.findAll({
    where: { organizationId, ...(authorId ? { authorId } : {}) },
    attributes: ['status', [db.sequelize.fn('COUNT', db.sequelize.col('id')), 'n']],
    group: ['status'],
    raw: true,
  })) as unknown as { status: PlanStatus; n: number | string }[];
  const counts: Record<PlanStatus, number> = { draft: 0, submitted: 0, returned: 0, approved: 0 };
  for (const r of rows) counts[r.status] = Number(r.n);
  return counts;
}

/** A plan with its current revision: the plan, its author and the revision in one query. */
export async function getPlan(db: Db, organizationId: number, id: number): Promise<PlanDetail | null> {
  const [row] = await db.sequelize.query<SummaryRow & { document: string; report: string | null; revisionCreatedAt: Date | string; revisionCreatedBy: string }>(
    `SELECT ${SUMMARY_COLUMNS}, r.document, r.report, r.created_at AS revisionCreatedAt, r.created_by AS revisionCreatedBy
     FROM plans p LEFT JOIN users u ON u.id = p.author_id JOIN plan_revisions r ON r.plan_id = p.id AND r.number = p.current_revision
     WHERE p.id = ? AND p.organization_id = ?`,
    { replacements: [id, organizationId], type: QueryTypes.SELECT },
  );
  if (!row) return null;
  return {
    ...rowToSummary(row),
    document: readStoredDocument(row.document),
    report: parseStoredReport(row.report),
    revisionCreatedAt: toDate(row.revisionCreatedAt),
    revisionCreatedBy: row.revisionCreatedBy,
  };
}

export interface NewPlan {
  organizationId: number;
  authorId: string;
  title: string;
  structure: string;
  document: PlanDocument;
  report: StoredReport | null;
  status?: PlanStatus;
}

/** Creates a plan with its first revision, in one transaction, and records it in the audit trail. */
export async function createPlan(db: Db, input: NewPlan): Promise<PlanDetail> {
  const id = await db.sequelize.transaction(async (transaction) => {
    const plan = await db.models.Plan.create(
      {
        organizationId: input.organizationId,
        authorId: input.authorId,
        title: input.title,
        structure: input.structure,
        status: input.status ?? 'draft',
        currentRevision: 1,
        blockers: input.report?.summary?.blockers ?? null,
        warnings: input.report?.summary?.warnings ?? null,
      },
      { transaction },
    );
    await db.models.PlanRevision.create(
      {
        planId: plan.id,
        number: 1,
        document: JSON.stringify({ ...input.document, title: input.title }),
        report: input.report ? JSON.stringify(input.report) : null,
        createdBy: input.authorId,
      },
      { transaction },
    );
    await recordEvent(db, { organizationId: input.organizationId, actorId: input.authorId, action: 'plan.created', subjectType: 'plan', subjectId: plan.id, details: { revision: 1, title: input.title } }, transaction);
    return plan.id;
  });
  return (await getPlan(db, input.organizationId, id))!;
}

export type SaveResult =
  | { kind: 'saved'; plan: PlanDetail }
  | { kind: 'stale'; current: PlanDetail }
  | { kind: 'not-editable'; current: PlanDetail }
  | { kind: 'not-found' };

export interface DraftSave {
  expectedRevision: number;
  title?: string;
  structure?: string;
  document: PlanDocument;
  report: StoredReport | null;
}

/**
 * Saves a new revision of a draft. The plan row is locked for the transaction, so of two saves
 * made from the same revision exactly one wins; the other is told the current revision.
 */
export async function saveDraft(db: Db, organizationId: number, planId: number, actorId: string, save: DraftSave): Promise<SaveResult> {
  const outcome = await db.sequelize.transaction({ isolationLevel: Transaction.ISOLATION_LEVELS.READ_COMMITTED }, async (transaction) => {
    const plan = await db.models.Plan.findOne({ where: { id: planId, organizationId }, lock: transaction.LOCK.UPDATE, transaction });
    if (!plan) return 'not-found' as const;
    const verdict = judgeSave({ status: plan.status, currentRevision: plan.currentRevision, expectedRevision: save.expectedRevision });
    if (verdict.kind !== 'save') return verdict.kind;
    const number = verdict.revision;
    const title = save.title ?? save.document.title;
    await db.models.PlanRevision.create(
      { planId, number, document: JSON.stringify({ ...save.document, title }), report: save.report ? JSON.stringify(save.report) : null, createdBy: actorId },
      { transaction },
    );
    await plan.update(
      {
        status: verdict.status,
        currentRevision: number,
        title,
        ...(save.structure !== undefined ? { structure: save.structure } : {}),
        blockers: save.report?.summary?.blockers ?? null,
        warnings: save.report?.summary?.warnings ?? null,
      },
      { transaction },
    );
    await recordEvent(db, { organizationId, actorId, action: 'plan.saved', subjectType: 'plan', subjectId: planId, details: { revision: number } }, transaction);
    return 'saved' as const;
  });
  if (outcome === 'not-found') return { kind: 'not-found' };
  const current = (await getPlan(db, organizationId, planId))!;
  if (outcome === 'saved') return { kind: 'saved', plan: current };
  return { kind: outcome, current };
}

/**
 * Stores a check report on the current revision (the report is derived data, not the document),
 * with the plan's finding counts, in one transaction under the plan's row lock.
 */
export async function storeReport(db: Db, organizationId: number, planId: number, revision: number, report: StoredReport): Promise<boolean> {
  return db.sequelize.transaction({ isolationLevel: Transaction.ISOLATION_LEVELS.READ_COMMITTED }, async (transaction) => {
    const plan = await db.models.Plan.findOne({ where: { id: planId, organizationId }, lock: transaction.LOCK.UPDATE, transaction });
    if (!plan) return false;
    const decided = (await db.models.PlanDecision.count({ where: { planId, revision }, transaction })) > 0;
    if (!mayStoreReport({ status: plan.status, currentRevision: plan.currentRevision, revision, decided })) return false;
    await db.models.PlanRevision.update({ report: JSON.stringify(report) }, { where: { planId, number: revision }, transaction });
    await plan.update({ blockers: report.summary?.blockers ?? null, warnings: report.summary?.warnings ?? null }, { transaction });
    return true;
  });
}

/** A short description of the structure from the document's first structure node. */
export function describeStructure(document: PlanDocument): string {
  const structure = document.nodes.find((n) => n.kind === 'structure');
  if (!structure || structure.kind !== 'structure') return '';
  return `${structure.label ?? 'Structure'} (${structure.material})`;
}

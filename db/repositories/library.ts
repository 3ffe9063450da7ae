/**
 * The library: each approved revision of the organisation's plans, with its teaching note, tags
 * and the findings that were fixed along the way. Those are worked out once, at approval
 * (`storeLibraryFacts`, migration 0009), so the library reads one decision row per plan and no
 * documents. Approvals from before the migration are filled the first time the library reads them.
 */
import { Op, type Transaction } from 'sequelize';
import { libraryFacts } from '@/lib/domain/library-facts';
import { PLAN_TAGS, type PlanTag } from '@/lib/domain/plan-tags';
import { parseStoredReport } from '@/lib/schemas/report';
import type { Db } from '@db/connection';
import type { PlanDecision } from '@db/models';
import { nameMap } from './names';
import { readStoredDocument } from './plans';

export interface LibraryEntry {
  planId: number;
  revision: number;
  title: string;
  structure: string;
  material: string | null;
  tags: PlanTag[];
  reviewerName: string;
  approvedAt: Date;
  teachingNote: string | null;
  fixedRules: string[];
  documentHash: string | null;
}

export interface LibraryFilters {
  material?: string;
  tag?: string;
  fixed?: string;
}

/**
 * Works out and stores the library's facts on the approving decision of (plan, revision): reads
 * that revision's document and the reports up to it. Runs inside the approval's transaction.
 */
export async function storeLibraryFacts(db: Db, planId: number, revision: number, transaction?: Transaction): Promise<void> {
  const rows = await db.models.PlanRevision.findAll({ where: { planId, number: { [Op.lte]: revision } }, attributes: ['number', 'report'], transaction });
  const approved = await db.models.PlanRevision.findOne({ where: { planId, number: revision }, attributes: ['document'], transaction });
  if (!approved) return;
  const document = readStoredDocument(approved.document);
  const reportOf = (n: number) => parseStoredReport(rows.find((r) => r.number === n)?.report ?? null);
  const earlier = rows.filter((r) => r.number < revision).map((r) => parseStoredReport(r.report));
  const facts = libraryFacts(document, reportOf(revision), earlier);
  await db.models.PlanDecision.update(
    { title: document.title, libraryTags: JSON.stringify(facts.tags), material: facts.material, fixedRules: JSON.stringify(facts.fixedRules) },
    { where: { planId, revision, decision: 'approve' }, transaction },
  );
}

const DECISION_COLUMNS = ['planId', 'revision', 'reviewerId', 'decidedAt', 'teachingNote', 'documentHash', 'title', 'libraryTags', 'material', 'fixedRules'] as const;

const stringList = (text: string | null): string[] => (text ? (JSON.parse(text) as unknown[]).filter((v): v is string => typeof v === 'string') : []);
const tagList = (text: string | null): PlanTag[] => stringList(text).filter((t): t is PlanTag => (PLAN_TAGS as readonly string[]).includes(t));

/** The organisation's library, newest approval first; `onlyPlanId` reads one plan's entry. */
export async function listLibrary(db: Db, organizationId: number, filters: LibraryFilters = {}, onlyPlanId?: number): Promise<LibraryEntry[]> {
  const plans = await db.models.Plan.findAll({
    where: { organizationId, approvedRevision: { [Op.ne]: null }, ...(onlyPlanId !== undefined ? { id: onlyPlanId } : {}) },
    attributes: ['id', 'structure', 'approvedRevision'],
  });
  if (!plans.length) return [];
  const approvedOf = new Map(plans.map((p) => [p.id, p.approvedRevision!]));
  const read = () => db.models.PlanDecision.findAll({ where: { planId: [...approvedOf.keys()], decision: 'approve' }, attributes: [...DECISION_COLUMNS] });
  let decisions: PlanDecision[] = (await read()).filter((d) => approvedOf.get(d.planId) === d.revision);
  const unfilled = decisions.filter((d) => d.libraryTags === null);
  if (unfilled.length) {
    for (const d of unfilled) await storeLibraryFacts(db, d.planId, d.revision);
    decisions = (await read()).filter((d) => approvedOf.get(d.planId) === d.revision);
  }
  const names = await nameMap(db, decisions.map((d) => d.reviewerId));
  const structureOf = new Map(plans.map((p) => [p.id, p.structure]));
  const entries: LibraryEntry[] = decisions.map((d) => ({
    planId: d.planId,
    revision: d.revision,
    title: d.title ?? '',
    structure: structureOf.get(d.planId) ?? '',
    material: d.material,
    tags: tagList(d.libraryTags),
    reviewerName: names.get(d.reviewerId) ?? '',
    approvedAt: d.decidedAt,
    teachingNote: d.teachingNote,
    fixedRules: stringList(d.fixedRules),
    documentHash: d.documentHash,
  }));
  return filterLibrary(entries, filters).sort((a, b) => b.approvedAt.getTime() - a.approvedAt.getTime() || a.planId - b.planId);
}

/** The library entry of one approved plan, or null when the plan is not in the library. */
export async function libraryEntry(db: Db, organizationId: number, planId: number): Promise<LibraryEntry | null> {
  return (await listLibrary(db, organizationId, {}, planId))[0] ?? null;
}

/** The filters of the library page, applied to entries already read. */
export function filterLibrary(entries: LibraryEntry[], filters: LibraryFilters): LibraryEntry[] {
  return entries.filter(
    (e) => (!filters.material || e.material === filters.material) && (!filters.tag || e.tags.includes(filters.tag as PlanTag)) && (!filters.fixed || e.fixedRules.includes(filters.fixed)),
  );
}

/**
 * The library: each approved revision of the organisation's plans, with its teaching note, tags
 * and the findings that were fixed along the way (rules that fired on an earlier revision and not
 * on the approved one). Reads everything for one organisation and filters in memory: fine for
 * hundreds of approved plans; past that, store tags and fixed rules at approval time.
 */
import { Op } from 'sequelize';
import { planTags, type PlanTag } from '../../src/lib/domain/plan-tags';
import type { CheckReport } from '../../src/lib/domain/report';
import type { PlanDocument } from '../../src/lib/schemas/plan';
import type { Db } from '../connection';
import { readStoredDocument } from './plans';
import { nameMap } from './review';

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

const rulesOf = (report: string | null) => new Set(report ? (JSON.parse(report) as CheckReport).findings.filter((f) => f.severity !== 'note').map((f) => f.rule) : []);

export async function listLibrary(db: Db, organizationId: number, filters: LibraryFilters = {}): Promise<LibraryEntry[]> {
  const plans = await db.models.Plan.findAll({ where: { organizationId, approvedRevision: { [Op.ne]: null } }, attributes: ['id', 'title', 'structure', 'approvedRevision'] });
  if (!plans.length) return [];
  const planIds = plans.map((p) => p.id);
  const [decisions, revisions] = await Promise.all([
    db.models.PlanDecision.findAll({ where: { planId: planIds, decision: 'approve' } }),
    db.models.PlanRevision.findAll({ where: { planId: planIds }, attributes: ['planId', 'number', 'document', 'report'] }),
  ]);
  const names = await nameMap(db, decisions.map((d) => d.reviewerId));
  const entries: LibraryEntry[] = [];
  for (const plan of plans) {
    const decision = decisions.find((d) => d.planId === plan.id && d.revision === plan.approvedRevision);
    const approved = revisions.find((r) => r.planId === plan.id && r.number === plan.approvedRevision);
    if (!decision || !approved) continue;
    const document: PlanDocument = readStoredDocument(approved.document);
    const now = rulesOf(approved.report);
    const before = new Set(revisions.filter((r) => r.planId === plan.id && r.number < approved.number).flatMap((r) => [...rulesOf(r.report)]));
    const structure = document.nodes.find((n) => n.kind === 'structure');
    entries.push({
      planId: plan.id,
      revision: approved.number,
      title: document.title,
      structure: plan.structure,
      material: structure && structure.kind === 'structure' ? structure.material : null,
      tags: planTags(document),
      reviewerName: names.get(decision.reviewerId) ?? '',
      approvedAt: decision.decidedAt,
      teachingNote: decision.teachingNote,
      fixedRules: [...before].filter((r) => !now.has(r)).sort(),
      documentHash: decision.documentHash,
    });
  }
  return entries
    .filter((e) => (!filters.material || e.material === filters.material) && (!filters.tag || e.tags.includes(filters.tag as PlanTag)) && (!filters.fixed || e.fixedRules.includes(filters.fixed)))
    .sort((a, b) => b.approvedAt.getTime() - a.approvedAt.getTime() || a.planId - b.planId);
}

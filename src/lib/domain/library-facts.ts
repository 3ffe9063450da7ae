/**
 * What the library shows about an approved revision, worked out once at approval and stored with
 * the decision: its configuration tags, the structure's material, and the findings fixed along
 * the way (rules that fired, above note level, on an earlier revision and not on the approved
 * one). Pure.
 */
import type { PlanDocument } from '@/lib/schemas/plan';
import { planTags, type PlanTag } from './plan-tags';
import type { CheckReport } from './report';

export interface LibraryFacts {
  tags: PlanTag[];
  material: string | null;
  fixedRules: string[];
}

const rulesOf = (report: CheckReport | null) => new Set(report ? report.findings.filter((f) => f.severity !== 'note').map((f) => f.rule) : []);

export function libraryFacts(document: PlanDocument, approvedReport: CheckReport | null, earlierReports: readonly (CheckReport | null)[]): LibraryFacts {
  const now = rulesOf(approvedReport);
  const before = new Set(earlierReports.flatMap((r) => [...rulesOf(r)]));
  const structure = document.nodes.find((n) => n.kind === 'structure');
  return {
    tags: planTags(document),
    material: structure && structure.kind === 'structure' ? structure.material : null,
    fixedRules: [...before].filter((r) => !now.has(r)).sort(),
  };
}

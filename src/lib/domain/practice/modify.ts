/**
 * Turning an approved plan into an exercise: apply the modifications to a copy, give the links
 * neutral ids so the remaining ones do not show where one was taken out, and run the checker to
 * find what the change planted. The original document is never mutated.
 */
import { checkPlan } from '@/lib/domain/checker';
import type { CheckReport, Finding } from '@/lib/domain/report';
import type { PlanDocument, PlanLink } from '@/lib/schemas/plan';
import { findingKey, type AnswerKey, type GapKind, type Modifications } from './types';

export interface ModificationIssue {
  path: string;
  message: string;
}

export type Applied = { ok: true; document: PlanDocument } | { ok: false; issues: ModificationIssue[] };

/** Applies removals (jumpers, bonds) and cable changes (jumpers) to a copy of the plan. */
export function applyModifications(original: PlanDocument, mods: Modifications): Applied {
  const issues: ModificationIssue[] = [];
  const byId = new Map(original.links.map((l) => [l.id, l]));
  mods.removeLinks.forEach((id, i) => {
    const link = byId.get(id);
    if (!link || link.kind === 'reach') issues.push({ path: `removeLinks[${i}]`, message: `no jumper or bond with id "${id}" in this revision` });
  });
  mods.changeLinks.forEach((change, i) => {
    const link = byId.get(change.id);
    if (!link || link.kind !== 'jumper') issues.push({ path: `changeLinks[${i}].id`, message: `no jumper with id "${change.id}" in this revision` });
    else if (link.cable === change.cable) issues.push({ path: `changeLinks[${i}].cable`, message: `is already ${change.cable}; pick another size` });
    if (mods.removeLinks.includes(change.id)) issues.push({ path: `changeLinks[${i}].id`, message: `"${change.id}" is also removed` });
  });
  if (mods.removeLinks.length + mods.changeLinks.length === 0) issues.push({ path: 'removeLinks', message: 'remove or change at least one link' });
  if (issues.length) return { ok: false, issues };
  const removed = new Set(mods.removeLinks);
  const cables = new Map(mods.changeLinks.map((c) => [c.id, c.cable]));
  const links = original.links
    .filter((l) => !removed.has(l.id))
    .map((l): PlanLink => (l.kind === 'jumper' && cables.has(l.id) ? { ...l, cable: cables.get(l.id)! } : { ...l }));
  return { ok: true, document: { ...original, nodes: original.nodes.map((n) => ({ ...n })), links } };
}

/** A prefix for link ids that no node id can be confused with. */
function linkPrefix(document: PlanDocument): string {
  let prefix = 'L';
  while (document.nodes.some((n) => n.id.startsWith(prefix))) prefix += 'k';
  return prefix;
}

/**
 * Renames every link to L1, L2, … in document order, so the ids left after a removal run without
 * a hole (jA, jC with no jB would give the gap away). Returns the renamed copy and the map.
 */
export function neutralLinkIds(document: PlanDocument, title = 'Practice plan'): { document: PlanDocument; linkIds: Record<string, string> } {
  const prefix = linkPrefix(document);
  const linkIds: Record<string, string> = {};
  const links = document.links.map((l, i) => {
    linkIds[l.id] = `${prefix}${i + 1}`;
    return { ...l, id: linkIds[l.id] };
  });
  return { document: { ...document, title, links }, linkIds };
}

const translate = (finding: Finding, ids: Record<string, string>): Finding => ({ ...finding, elements: finding.elements.map((e) => ids[e] ?? e) });

/** Blocker findings of `modified` that the original (translated into the modified ids) lacks. */
export function plantedFindings(originalReport: CheckReport, modifiedReport: CheckReport, linkIds: Record<string, string>): Finding[] {
  const before = new Set(originalReport.findings.filter((f) => f.severity === 'blocker').map((f) => findingKey(translate(f, linkIds))));
  return modifiedReport.findings.filter((f) => f.severity === 'blocker' && !before.has(findingKey(f)));
}

/** Element ids the answer key holds: everything the planted findings name, minus what already had a blocker. */
export function answerElements(planted: Finding[], originalReport: CheckReport, linkIds: Record<string, string>): string[] {
  const already = new Set(originalReport.findings.filter((f) => f.severity === 'blocker').flatMap((f) => f.elements.map((e) => linkIds[e] ?? e)));
  return [...new Set(planted.flatMap((f) => f.elements))].filter((e) => !already.has(e)).sort();
}

/** Names the gap from the planted findings and the nodes the removed links touched. */
export function classifyGap(original: PlanDocument, mods: Modifications, planted: Finding[]): GapKind {
  const rules = new Set(planted.map((f) => f.rule));
  if (rules.has('pole-ground-relied')) return 'pole-ground-only';
  if (rules.has('cable-underrated') || rules.has('cable-below-minimum') || rules.has('clamp-underrated')) return 'cable-underrated';
  const kindOf = new Map(original.nodes.map((n) => [n.id, n.kind]));
  const touched = original.links.filter((l) => mods.removeLinks.includes(l.id)).flatMap((l) => [kindOf.get(l.from), kindOf.get(l.to)]);
  if (touched.includes('bucket')) return 'bucket-unbonded';
  if (touched.includes('mat')) return 'mat-unbonded';
  if (rules.has('phase-ungrounded')) return 'phase-ungrounded';
  return 'zone-gap';
}

export interface BuiltExercise {
  /** The modified plan as the apprentice sees it (neutral link ids, neutral title). */
  document: PlanDocument;
  report: CheckReport;
  key: AnswerKey;
  gap: GapKind;
}

export type BuildResult = { ok: true; exercise: BuiltExercise } | { ok: false; reason: 'invalid'; issues: ModificationIssue[] } | { ok: false; reason: 'no-gap' };

/**
 * Builds an exercise from an approved plan and its modifications, or refuses it: the modified
 * plan must carry at least one blocker the original does not, naming at least one element.
 */
export function buildExercise(original: PlanDocument, mods: Modifications, originalReport: CheckReport = checkPlan(original)): BuildResult {
  const applied = applyModifications(original, mods);
  if (!applied.ok) return { ok: false, reason: 'invalid', issues: applied.issues };
  const { document, linkIds } = neutralLinkIds(applied.document);
  const report = checkPlan(document);
  const planted = plantedFindings(originalReport, report, linkIds);
  const elements = answerElements(planted, originalReport, linkIds);
  if (!planted.length || !elements.length) return { ok: false, reason: 'no-gap' };
  return { ok: true, exercise: { document, report, key: { planted, elements, linkIds }, gap: classifyGap(original, mods, planted) } };
}

/**
 * Proposals: try taking out each jumper and bond of an approved plan, and swapping each jumper's
 * cable for a smaller one, run the checker on every candidate, and keep one candidate per kind of
 * gap — so a reviewer is offered gaps that each produce a blocker of a different kind.
 */
import { checkPlan } from '@/lib/domain/checker';
import type { Finding } from '@/lib/domain/report';
import type { CableSize, PlanDocument } from '@/lib/schemas/plan';
import { applyModifications, buildExercise, plantedFindings } from './modify';
import { GAP_KINDS, type GapKind, type Modifications } from './types';

export interface Proposal {
  gap: GapKind;
  modifications: Modifications;
  /** The blockers the change produces, in the original plan's ids so the reviewer can find them. */
  findings: Finding[];
}

/** Smaller cables to try, smallest last: No. 2 is the OSHA minimum, No. 4 is below it. */
const SWAPS: CableSize[] = ['2', '4'];

function candidates(plan: PlanDocument): Modifications[] {
  const out: Modifications[] = [];
  for (const link of plan.links) {
    if (link.kind === 'jumper' || link.kind === 'bond') out.push({ removeLinks: [link.id], changeLinks: [] });
  }
  for (const link of plan.links) {
    if (link.kind !== 'jumper') continue;
    for (const cable of SWAPS) if (cable !== link.cable) out.push({ removeLinks: [], changeLinks: [{ id: link.id, cable }] });
  }
  return out;
}

/** One proposal per gap kind, in GAP_KINDS order; a plan may offer fewer than all kinds. */
export function proposeRemovals(plan: PlanDocument): Proposal[] {
  const originalReport = checkPlan(plan);
  const byGap = new Map<GapKind, Proposal>();
  for (const mods of candidates(plan)) {
    const built = buildExercise(plan, mods, originalReport);
    if (!built.ok || byGap.has(built.exercise.gap)) continue;
    // The same change checked in the original's ids, so the sentences name the reviewer's elements.
    const applied = applyModifications(plan, mods);
    const findings = applied.ok ? plantedFindings(originalReport, checkPlan(applied.document), {}) : [];
    byGap.set(built.exercise.gap, { gap: built.exercise.gap, modifications: mods, findings });
  }
  return GAP_KINDS.flatMap((g) => (byGap.has(g) ? [byGap.get(g)!] : []));
}

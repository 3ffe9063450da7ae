/**
 * Plans that use the organisation's grounding sets. A jumper names its set by the set's tag in the
 * plan format's `equipmentId` field. With an inventory beside the plan, each named set that is on
 * record lends the jumper its own figures (cable, length, clamp rating, clamp kind, connection): the
 * set as built and tested is what hangs there, so the ratings are computed from it.
 */
import type { LinkOf, PlanDocument } from '@/lib/schemas/plan';
import { dueState, type DueState, type SetRecord, type SetStatus } from './equipment';
import type { UnitSystem } from './units';

/** When the check runs: a draft being edited, a submission, or the record made in the field. */
export const CHECK_STAGES = ['draft', 'submit', 'field'] as const;
export type CheckStage = (typeof CHECK_STAGES)[number];

export interface CheckOptions {
  /** Units for lengths in the findings' sentences (default metric); the report's figures stay SI. */
  units?: UnitSystem;
  /** The organisation's sets; without it the set rules do not run (no inventory to check against). */
  inventory?: readonly SetRecord[];
  /** Today's date (YYYY-MM-DD), for overdue tests; the checker has no clock. */
  today?: string;
  /** Default 'draft'. An overdue test is a warning in a draft and a blocker at submit and in the field. */
  stage?: CheckStage;
}

export interface SetUse {
  tag: string;
  /** Jumper ids naming this set, in plan order. */
  jumpers: string[];
  set: SetRecord | null;
  due: DueState | null;
}

export interface SetContext {
  /** The plan as drawn, before the sets' figures were applied (for set-differs). */
  original: PlanDocument;
  uses: SetUse[];
  today: string | null;
  stage: CheckStage;
}

/** The sets a plan names (tags in `equipmentId`), grouped by tag in order of first use. */
export function setTagsOf(plan: PlanDocument): string[] {
  const tags = plan.links.flatMap((l) => (l.kind === 'jumper' && l.equipmentId ? [l.equipmentId] : []));
  return [...new Set(tags)];
}

const byTag = (inventory: readonly SetRecord[]) => new Map(inventory.map((s) => [s.tag.toLowerCase(), s]));

/** Resolves the plan's sets and returns the plan with each known set's figures on its jumpers. */
export function applyInventory(plan: PlanDocument, options: CheckOptions): { plan: PlanDocument; sets: SetContext | null } {
  if (!options.inventory) return { plan, sets: null };
  const index = byTag(options.inventory);
  const uses = new Map<string, SetUse>();
  const links = plan.links.map((link) => {
    if (link.kind !== 'jumper' || !link.equipmentId) return link;
    const set = index.get(link.equipmentId.toLowerCase()) ?? null;
    const key = link.equipmentId.toLowerCase();
    const use = uses.get(key) ?? { tag: set?.tag ?? link.equipmentId, jumpers: [], set, due: set && options.today ? dueState(set.testDueOn, options.today) : null };
    use.jumpers.push(link.id);
    uses.set(key, use);
    if (!set) return link;
    const fromSet: LinkOf<'jumper'> = { ...link, cable: set.cable, lengthM: set.lengthM, clampKa: set.clampKa, clampCycles: set.clampCycles, clampKind: set.clampKind, connection: set.connection };
    return fromSet;
  });
  return { plan: { ...plan, links }, sets: { original: plan, uses: [...uses.values()], today: options.today ?? null, stage: options.stage ?? 'draft' } };
}

/** One line of the report's list of sets used. */
export interface ReportSet {
  tag: string;
  jumpers: string[];
  known: boolean;
  status: SetStatus | null;
  lastTestedOn: string | null;
  testDueOn: string | null;
  due: DueState | null;
}

export function reportSets(sets: SetContext): ReportSet[] {
  return sets.uses.map((u) => ({
    tag: u.tag,
    jumpers: u.jumpers,
    known: u.set !== null,
    status: u.set?.status ?? null,
    lastTestedOn: u.set?.lastTestedOn ?? null,
    testDueOn: u.set?.testDueOn ?? null,
    due: u.due,
  }));
}

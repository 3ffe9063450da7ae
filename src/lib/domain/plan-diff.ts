/**
 * What changed between two revisions of a plan: nodes and links added, removed and changed
 * (by id), each change listing the fields that differ. Positions count as a change of layout only.
 */
import type { PlanDocument } from '@/lib/schemas/plan';
import { canonicalJson } from './canonical-json';

export interface ElementChange {
  id: string;
  kind: string;
  /** Field names whose values differ; `position` alone means the element only moved. */
  fields: string[];
}

export interface PlanDiff {
  added: { id: string; kind: string }[];
  removed: { id: string; kind: string }[];
  changed: ElementChange[];
  /** Top-level fields that differ: title, system, criteria. */
  plan: string[];
}

type Element = { id: string; kind: string } & Record<string, unknown>;

function diffElements(before: Element[], after: Element[], out: PlanDiff): void {
  const old = new Map(before.map((e) => [e.id, e]));
  const next = new Map(after.map((e) => [e.id, e]));
  for (const e of after) if (!old.has(e.id)) out.added.push({ id: e.id, kind: e.kind });
  for (const e of before) if (!next.has(e.id)) out.removed.push({ id: e.id, kind: e.kind });
  for (const e of after) {
    const was = old.get(e.id);
    if (!was) continue;
    const keys = [...new Set([...Object.keys(was), ...Object.keys(e)])].sort();
    const fields = keys.filter((k) => canonicalJson(was[k]) !== canonicalJson(e[k]));
    if (fields.length) out.changed.push({ id: e.id, kind: e.kind, fields });
  }
}

/** Compares two plan documents element by element. */
export function diffPlans(before: PlanDocument, after: PlanDocument): PlanDiff {
  const out: PlanDiff = { added: [], removed: [], changed: [], plan: [] };
  diffElements(before.nodes as Element[], after.nodes as Element[], out);
  diffElements(before.links as Element[], after.links as Element[], out);
  for (const key of ['title', 'system', 'criteria'] as const) {
    if (canonicalJson(before[key]) !== canonicalJson(after[key])) out.plan.push(key);
  }
  return out;
}

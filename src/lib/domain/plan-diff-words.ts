/**
 * A plan diff as a crew reads it: each change as "what: before → after" in words and units, never
 * the plan format's field names. Pure; units are the plan format's own (metric) until a unit
 * setting is passed in.
 */
import type { PlanDocument } from '@/lib/schemas/plan';
import { canonicalJson } from './canonical-json';
import { buildPlanModel } from './plan-model';
import { diffPlans } from './plan-diff';

/** Words and unit for each field a change can touch; `ref` fields hold an element id. */
const FIELDS: Readonly<Record<string, { words: string; unit?: string; ref?: true }>> = {
  label: { words: 'label' },
  material: { words: 'material' },
  phase: { words: 'phase' },
  groundOhms: { words: 'resistance to earth', unit: 'Ω' },
  standsOn: { words: 'stands on', ref: true },
  insulatedBoom: { words: 'insulated boom' },
  onTruck: { words: 'on the truck', ref: true },
  lengthM: { words: 'length', unit: 'm' },
  diameterMm: { words: 'diameter', unit: 'mm' },
  soilOhmM: { words: 'soil resistivity', unit: 'Ω·m' },
  spacingM: { words: 'spacing', unit: 'm' },
  workDistanceM: { words: 'distance from the work', unit: 'm' },
  spanM: { words: 'span', unit: 'm' },
  cable: { words: 'cable' },
  clampKa: { words: 'clamp rating', unit: 'kA' },
  clampCycles: { words: 'clamp rating time', unit: 'cycles' },
  clampKind: { words: 'clamp kind' },
  connection: { words: 'connection' },
  equipmentId: { words: 'grounding set' },
  ohms: { words: 'resistance', unit: 'Ω' },
  from: { words: 'from', ref: true },
  to: { words: 'to', ref: true },
  arrangement: { words: 'arrangement' },
  count: { words: 'count' },
  phases: { words: 'phases' },
  title: { words: 'title' },
  nominalKv: { words: 'nominal voltage', unit: 'kV' },
  frequencyHz: { words: 'frequency', unit: 'Hz' },
  faultKa: { words: 'available fault current', unit: 'kA' },
  clearingCycles: { words: 'clearing time', unit: 'cycles' },
  xOverR: { words: 'X/R ratio' },
  phaseSpacingM: { words: 'phase spacing', unit: 'm' },
  bodyKg: { words: 'body weight', unit: 'kg' },
  bodyOhms: { words: 'body resistance', unit: 'Ω' },
};

export interface ChangeInWords {
  kind: 'added' | 'removed' | 'changed';
  /** The element's label and id, or "The plan". */
  what: string;
  /** "length 3 m → 4.5 m", "moved on the drawing", … (empty for added and removed). */
  changes: string[];
}

const fieldWords = (key: string) => FIELDS[key]?.words ?? key.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase();

function valueWords(key: string, value: unknown, name: (id: string) => string): string {
  if (value === undefined || value === null || value === '') return 'none';
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'number') return FIELDS[key]?.unit ? `${value} ${FIELDS[key].unit}` : String(value);
  if (typeof value === 'string') return FIELDS[key]?.ref ? name(value) : value.replace(/-/g, ' ');
  if (Array.isArray(value)) return value.map((v) => valueWords(key, v, name)).join(', ');
  return canonicalJson(value);
}

function changesOf(was: Record<string, unknown>, now: Record<string, unknown>, keys: string[], name: (id: string) => string): string[] {
  return keys.map((k) => (k === 'position' ? 'moved on the drawing' : `${fieldWords(k)} ${valueWords(k, was[k], name)} → ${valueWords(k, now[k], name)}`));
}

/** Every difference between two revisions, in words. */
export function diffInWords(before: PlanDocument, after: PlanDocument): ChangeInWords[] {
  const diff = diffPlans(before, after);
  const old = buildPlanModel(before);
  const next = buildPlanModel(after);
  const name = (id: string) => (next.node(id) || next.link(id) ? next.nameOf(id) : old.nameOf(id));
  const element = (doc: PlanDocument, id: string) => ([...doc.nodes, ...doc.links] as { id: string }[]).find((e) => e.id === id) as Record<string, unknown>;
  const out: ChangeInWords[] = [];
  const planChanges: string[] = [];
  for (const key of diff.plan) {
    if (key === 'title') planChanges.push(...changesOf(before, after, ['title'], name));
    else {
      const was = (before[key] ?? {}) as Record<string, unknown>;
      const now = (after[key] ?? {}) as Record<string, unknown>;
      const keys = [...new Set([...Object.keys(was), ...Object.keys(now)])].sort().filter((k) => canonicalJson(was[k]) !== canonicalJson(now[k]));
      planChanges.push(...changesOf(was, now, keys, name));
    }
  }
  if (planChanges.length) out.push({ kind: 'changed', what: 'The plan', changes: planChanges });
  for (const e of diff.added) out.push({ kind: 'added', what: next.nameOf(e.id), changes: [] });
  for (const e of diff.removed) out.push({ kind: 'removed', what: old.nameOf(e.id), changes: [] });
  for (const e of diff.changed) out.push({ kind: 'changed', what: name(e.id), changes: changesOf(element(before, e.id), element(after, e.id), e.fields, name) });
  return out;
}

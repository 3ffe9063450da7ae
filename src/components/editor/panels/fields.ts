/**
 * The inspector's form for each node and link kind: which fields, their labels and how they are
 * typed. Lengths (keys ending in `M`) are shown in the chosen units and stored in metres; every
 * candidate is validated by the plan schema before it is stored.
 */
import type { z } from 'zod';
import { lengthInputValue, parseLength, parseNumber, type UnitSystem } from '@/lib/domain/units';
import { CABLE_SIZES, MATERIALS, criteriaSchema, linkSchema, nodeSchema, systemSchema, type LinkKind, type NodeKind } from '@/lib/schemas/plan';

export type FieldType = 'text' | 'number' | 'length' | 'select' | 'boolean' | 'node';

export interface FieldSpec {
  key: string;
  label: string;
  type: FieldType;
  optional?: boolean;
  /** Unit shown after a plain number. */
  unit?: string;
  options?: readonly { value: string; label: string }[];
  /** For `node`: which kinds may be picked. */
  nodeFilter?: (kind: NodeKind) => boolean;
  numeric?: boolean;
  hint?: string;
  /** A number stored in a metric unit that a crew in feet types in another: stored = typed × factor. */
  imperial?: { unit: string; factor: number };
}

/** Rods are specified in inches in feet mode and stored in millimetres (1 in = 25.4 mm exactly). */
const INCHES = { unit: 'in', factor: 25.4 } as const;
/** The value shown for a stored number: converted for a field with an imperial unit. */
const shownNumber = (f: FieldSpec, v: number, units: UnitSystem) => (units === 'imperial' && f.imperial ? String(Number((v / f.imperial.factor).toFixed(4))) : String(v));

/** What a person can stand on or in (the cluster bar stands for a climber's footing at the bar). */
export const STANDABLE: ReadonlySet<NodeKind> = new Set<NodeKind>(['bucket', 'truck', 'mat', 'earth', 'structure', 'crossarm', 'cluster-bar']);

const label: FieldSpec = { key: 'label', label: 'Label', type: 'text', optional: true };
const groundOhms: FieldSpec = { key: 'groundOhms', label: 'Resistance to earth', type: 'number', unit: 'Ω', optional: true, hint: 'Leave blank to use the default the check reports.' };
const material: FieldSpec = { key: 'material', label: 'Material', type: 'select', options: MATERIALS.map((m) => ({ value: m, label: m[0].toUpperCase() + m.slice(1) })) };

export const NODE_FIELDS: Record<NodeKind, FieldSpec[]> = {
  phase: [label, { key: 'phase', label: 'Phase', type: 'text', optional: true }],
  neutral: [label, groundOhms],
  'shield-wire': [label, groundOhms],
  structure: [label, material, { ...groundOhms, label: 'Footing resistance', hint: 'Steel footings only; for concrete, enter it on the brought-out ground wire (hardware).' }],
  crossarm: [label, material],
  hardware: [label, { ...groundOhms, hint: 'Only for a ground wire brought out of a concrete structure: its resistance to earth.' }],
  'cluster-bar': [label],
  'ground-rod': [
    label,
    { key: 'lengthM', label: 'Driven length', type: 'length' },
    { key: 'diameterMm', label: 'Rod diameter', type: 'number', unit: 'mm', imperial: INCHES },
    { key: 'soilOhmM', label: 'Soil resistivity', type: 'number', unit: 'Ω·m' },
    { key: 'count', label: 'Number of rods', type: 'number', optional: true },
    { key: 'spacingM', label: 'Rod spacing', type: 'length', optional: true, hint: 'Needed when there is more than one rod.' },
    { key: 'workDistanceM', label: 'Distance to nearest work position', type: 'length', optional: true },
  ],
  earth: [label],
  bucket: [label, { key: 'insulatedBoom', label: 'Insulated boom', type: 'boolean' }],
  truck: [label, groundOhms],
  mat: [label],
  'pole-ground': [label],
  worker: [label, { key: 'standsOn', label: 'Stands on', type: 'node', nodeFilter: (k) => STANDABLE.has(k), hint: 'What the worker stands on or in. A new worker stands nowhere until you choose.' }],
  'supply-end': [label],
};

export const LINK_FIELDS: Record<LinkKind, FieldSpec[]> = {
  jumper: [
    { key: 'cable', label: 'Cable size', type: 'select', options: CABLE_SIZES.map((c) => ({ value: c, label: c })) },
    { key: 'lengthM', label: 'Lead length', type: 'length' },
    { key: 'spanM', label: 'Straight distance between clamps', type: 'length', optional: true },
    { key: 'clampKa', label: 'Clamp rating', type: 'number', unit: 'kA', optional: true },
    { key: 'clampCycles', label: 'Clamp rating time', type: 'number', unit: 'cycles', optional: true },
    { key: 'ohms', label: 'Measured resistance', type: 'number', unit: 'Ω', optional: true, hint: 'Overrides the computed impedance.' },
    { key: 'equipmentId', label: 'Grounding set', type: 'text', optional: true },
  ],
  bond: [{ key: 'ohms', label: 'Resistance', type: 'number', unit: 'Ω', optional: true }, { key: 'label', label: 'Label', type: 'text', optional: true }],
  reach: [{ key: 'label', label: 'Label', type: 'text', optional: true }],
};

export const SYSTEM_FIELDS: FieldSpec[] = [
  { key: 'faultKa', label: 'Fault current', type: 'number', unit: 'kA', hint: 'Symmetrical rms at the work location.' },
  { key: 'clearingCycles', label: 'Clearing time', type: 'number', unit: 'cycles' },
  { key: 'xOverR', label: 'X/R ratio', type: 'number' },
  { key: 'frequencyHz', label: 'Frequency', type: 'select', numeric: true, options: [{ value: '60', label: '60 Hz' }, { value: '50', label: '50 Hz' }] },
  { key: 'phaseSpacingM', label: 'Phase spacing', type: 'length', optional: true },
  { key: 'nominalKv', label: 'Nominal voltage', type: 'number', unit: 'kV', optional: true },
];

export const CRITERIA_FIELDS: FieldSpec[] = [
  { key: 'bodyKg', label: 'Body weight basis', type: 'select', numeric: true, options: [{ value: '50', label: '50 kg (110 lb)' }, { value: '70', label: '70 kg (154 lb)' }] },
  { key: 'bodyOhms', label: 'Body resistance', type: 'number', unit: 'Ω', optional: true },
];

export type FormValues = Record<string, string>;

/** The strings the inputs start from for a stored object. */
export function toFormValues(fields: FieldSpec[], source: Record<string, unknown>, units: UnitSystem): FormValues {
  const out: FormValues = {};
  for (const f of fields) {
    const v = source[f.key];
    if (f.type === 'boolean') out[f.key] = v ? 'true' : 'false';
    else if (f.type === 'length') out[f.key] = typeof v === 'number' ? lengthInputValue(v, units) : '';
    else if (typeof v === 'number' && f.type === 'number') out[f.key] = shownNumber(f, v, units);
    else out[f.key] = v === undefined || v === null ? '' : String(v);
  }
  return out;
}

export type BuildResult = { ok: true; value: Record<string, unknown> } | { ok: false; errors: Record<string, string> };

/**
 * Reads the form back onto `base` (stored units) and validates the result with `schema`; errors
 * are keyed by field and name it ("Lead length must be greater than 0").
 */
export function buildFromForm(fields: FieldSpec[], values: FormValues, base: Record<string, unknown>, units: UnitSystem, schema: z.ZodTypeAny): BuildResult {
  const errors: Record<string, string> = {};
  const next: Record<string, unknown> = { ...base };
  for (const f of fields) {
    const raw = (values[f.key] ?? '').trim();
    if (f.type === 'boolean') {
      next[f.key] = raw === 'true';
      continue;
    }
    if (raw === '' && (f.optional || f.type === 'text')) {
      delete next[f.key];
      if (!f.optional) next[f.key] = '';
      continue;
    }
    if (f.type === 'length') {
      const r = parseLength(raw, units);
      if (r.ok) next[f.key] = r.value;
      else errors[f.key] = `${f.label} ${r.message}`;
    } else if (f.type === 'number' || f.numeric) {
      const r = parseNumber(raw);
      if (r.ok) next[f.key] = units === 'imperial' && f.imperial ? r.value * f.imperial.factor : r.value;
      else errors[f.key] = `${f.label} ${r.message}`;
    } else next[f.key] = raw;
  }
  if (Object.keys(errors).length === 0) {
    const parsed = schema.safeParse(next);
    if (parsed.success) return { ok: true, value: next };
    for (const issue of parsed.error.issues) {
      const key = String(issue.path[0] ?? '');
      const field = fields.find((f) => f.key === key);
      errors[field ? key : '_form'] ??= `${field?.label ?? key} ${issue.message}`;
    }
  }
  return { ok: false, errors };
}

export const NODE_SCHEMA = nodeSchema;
export const LINK_SCHEMA = linkSchema;
export const SYSTEM_SCHEMA = systemSchema;
export const CRITERIA_SCHEMA = criteriaSchema;

/**
 * Tiny plan builders for checker tests: every plan goes through the real schema, so a test can
 * never check a document the product would refuse.
 */
import { parsePlan, type PlanDocument, type PlanLink, type PlanNode } from '@/lib/schemas/plan';

type Extra = Record<string, unknown>;

export const node = {
  phase: (id: string, extra: Extra = {}) => ({ id, kind: 'phase', phase: id, ...extra }),
  neutral: (id = 'N', extra: Extra = {}) => ({ id, kind: 'neutral', groundOhms: 5, ...extra }),
  shield: (id = 'SW', extra: Extra = {}) => ({ id, kind: 'shield-wire', groundOhms: 10, ...extra }),
  structure: (id: string, material: string, extra: Extra = {}) => ({ id, kind: 'structure', material, ...extra }),
  crossarm: (id: string, material: string, extra: Extra = {}) => ({ id, kind: 'crossarm', material, ...extra }),
  hardware: (id: string, extra: Extra = {}) => ({ id, kind: 'hardware', ...extra }),
  cluster: (id = 'CB', extra: Extra = {}) => ({ id, kind: 'cluster-bar', ...extra }),
  rod: (id = 'R1', extra: Extra = {}) => ({ id, kind: 'ground-rod', lengthM: 2.4384, diameterMm: 15.875, soilOhmM: 100, ...extra }),
  earth: (id = 'E') => ({ id, kind: 'earth' }),
  bucket: (id = 'BK', extra: Extra = {}) => ({ id, kind: 'bucket', insulatedBoom: true, ...extra }),
  truck: (id = 'T1', extra: Extra = {}) => ({ id, kind: 'truck', ...extra }),
  mat: (id = 'M1') => ({ id, kind: 'mat' }),
  poleGround: (id = 'PG') => ({ id, kind: 'pole-ground' }),
  worker: (id: string, standsOn: string, extra: Extra = {}) => ({ id, kind: 'worker', standsOn, ...extra }),
};

export const link = {
  jumper: (id: string, from: string, to: string, extra: Extra = {}) => ({ id, kind: 'jumper', from, to, cable: '2/0', lengthM: 3, ...extra }),
  bond: (id: string, from: string, to: string, extra: Extra = {}) => ({ id, kind: 'bond', from, to, ...extra }),
  reach: (id: string, from: string, to: string) => ({ id, kind: 'reach', from, to }),
};

export interface PlanOverrides {
  title?: string;
  system?: Extra;
  criteria?: Extra;
  nodes?: Extra[];
  links?: Extra[];
}

/** A raw document (not parsed), for schema and command-line tests that need broken ones. */
export function rawPlan(overrides: PlanOverrides = {}): Extra {
  return {
    format: 'bondmap-plan',
    version: 1,
    title: overrides.title ?? 'Test plan',
    system: { nominalKv: 12.47, frequencyHz: 60, faultKa: 10, clearingCycles: 15, xOverR: 10, phaseSpacingM: 0.9, ...overrides.system },
    criteria: { bodyKg: 50, bodyOhms: 1000, ...overrides.criteria },
    nodes: overrides.nodes ?? [],
    links: overrides.links ?? [],
  };
}

/** Parses through the real schema and throws with every issue when the document is invalid. */
export function makePlan(overrides: PlanOverrides = {}): PlanDocument {
  const result = parsePlan(rawPlan(overrides));
  if (!result.ok) throw new Error(`test plan is invalid:\n${result.issues.map((i) => `${i.path}: ${i.message}`).join('\n')}`);
  return result.plan;
}

/**
 * The clean base case: three phases and the neutral jumpered to one cluster bar, a bucket bonded to
 * it, a worker in the bucket who can reach every phase.
 */
export function bucketNodes(): Extra[] {
  return [node.phase('A'), node.phase('B'), node.phase('C'), node.neutral(), node.cluster(), node.bucket(), node.worker('W1', 'BK')];
}
export function bucketLinks(extra: Extra = {}): Extra[] {
  return [
    link.jumper('jA', 'A', 'CB', extra),
    link.jumper('jB', 'B', 'CB', extra),
    link.jumper('jC', 'C', 'CB', extra),
    link.jumper('jN', 'CB', 'N', extra),
    link.jumper('jBK', 'BK', 'CB', extra),
    link.reach('rA', 'W1', 'A'),
    link.reach('rB', 'W1', 'B'),
    link.reach('rC', 'W1', 'C'),
  ];
}
export function bucketPlan(overrides: PlanOverrides = {}): PlanDocument {
  return makePlan({ nodes: bucketNodes(), links: bucketLinks(), ...overrides });
}

/** Finds the node or link with `id` and merges `patch` into it, in a copy. */
export function patchElement<T extends Extra>(items: T[], id: string, patch: Extra): T[] {
  return items.map((item) => (item.id === id ? ({ ...item, ...patch } as T) : item));
}

export type { PlanDocument, PlanLink, PlanNode };

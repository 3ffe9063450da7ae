/**
 * Seeded generator of realistic-looking plans for benchmarks and cross-checks: a line of
 * structures, each with three phases jumpered to a cluster bar, a neutral, hardware bonds,
 * spans joining the structures, some driven rods, trucks and buckets, and workers with reaches.
 * All data invented.
 */
import type { PlanDocument, PlanLink, PlanNode } from '@/lib/schemas/plan';

/** Mulberry32: a small, fast, seeded generator, so every run builds the same plans. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export interface GenerateOptions {
  /** Approximate number of nodes + links. */
  elements: number;
  seed: number;
  frequencyHz?: 50 | 60;
}

const CABLES = ['2', '1/0', '2/0', '4/0'] as const;

/** Builds a plan of at least `elements` nodes and links, a structure (about twenty elements) at a time. */
export function generatePlan({ elements, seed, frequencyHz = 60 }: GenerateOptions): PlanDocument {
  const rand = seededRandom(seed);
  const pick = <T>(list: readonly T[]): T => list[Math.floor(rand() * list.length)];
  const nodes: PlanNode[] = [{ id: 'E', kind: 'earth' }];
  const links: PlanLink[] = [];
  let linkCount = 0;
  const link = (l: Record<string, unknown>) => links.push({ id: `l${linkCount++}`, ...l } as PlanLink);
  const jumper = (from: string, to: string) =>
    link({ kind: 'jumper', from, to, cable: pick(CABLES), lengthM: 1 + rand() * 8, ...(rand() < 0.1 ? { ohms: rand() * 0.003 } : {}) });
  let structures = 0;
  for (let s = 0; s === 0 || nodes.length + links.length < elements; s++) {
    structures = s + 1;
    const p = `s${s}`;
    const steel = rand() < 0.3;
    nodes.push(
      { id: `${p}A`, kind: 'phase', phase: 'A' },
      { id: `${p}B`, kind: 'phase', phase: 'B' },
      { id: `${p}C`, kind: 'phase', phase: 'C' },
      { id: `${p}N`, kind: 'neutral', ...(rand() < 0.5 ? { groundOhms: 2 + rand() * 20 } : {}) },
      { id: `${p}CB`, kind: 'cluster-bar' },
      { id: `${p}P`, kind: 'structure', material: steel ? 'steel' : 'wood', ...(steel && rand() < 0.5 ? { groundOhms: 5 + rand() * 40 } : {}) },
      { id: `${p}X`, kind: 'crossarm', material: 'wood' },
      { id: `${p}H`, kind: 'hardware' },
    );
    for (const phase of ['A', 'B', 'C']) if (rand() < 0.92) jumper(`${p}${phase}`, `${p}CB`);
    jumper(`${p}CB`, `${p}N`);
    link({ kind: 'bond', from: `${p}H`, to: steel ? `${p}P` : `${p}N`, ...(rand() < 0.5 ? { ohms: rand() * 0.01 } : {}) });
    if (steel) link({ kind: 'bond', from: `${p}P`, to: `${p}CB` });
    if (s > 0) {
      // Spans to the previous structure: phase and neutral conductors as resistive bonds.
      const q = `s${s - 1}`;
      for (const phase of ['A', 'B', 'C']) link({ kind: 'bond', from: `${q}${phase}`, to: `${p}${phase}`, ohms: 0.01 + rand() * 0.05 });
      link({ kind: 'bond', from: `${q}N`, to: `${p}N`, ohms: 0.01 + rand() * 0.04 });
    }
    if (rand() < 0.25) {
      nodes.push({ id: `${p}R`, kind: 'ground-rod', lengthM: 1.5 + rand() * 2, diameterMm: 16, soilOhmM: 30 + rand() * 500, ...(rand() < 0.3 ? { count: 2 + Math.floor(rand() * 4), spacingM: 1 + rand() * 4 } : {}), ...(rand() < 0.5 ? { workDistanceM: rand() * 10 } : {}) } as PlanNode);
      jumper(`${p}CB`, `${p}R`);
    }
    if (rand() < 0.2) {
      nodes.push({ id: `${p}T`, kind: 'truck', ...(rand() < 0.7 ? { groundOhms: 20 + rand() * 200 } : {}) }, { id: `${p}K`, kind: 'bucket', insulatedBoom: true });
      jumper(`${p}K`, `${p}CB`);
      if (rand() < 0.6) jumper(`${p}T`, rand() < 0.5 ? `${p}N` : `${p}CB`);
      nodes.push({ id: `${p}W`, kind: 'worker', standsOn: `${p}K` } as PlanNode);
      link({ kind: 'reach', from: `${p}W`, to: `${p}${pick(['A', 'B', 'C'])}` });
      link({ kind: 'reach', from: `${p}W`, to: `${p}H` });
    }
    if (rand() < 0.15) {
      nodes.push({ id: `${p}G`, kind: 'worker', standsOn: rand() < 0.5 ? 'E' : `${p}CB` } as PlanNode);
      link({ kind: 'reach', from: `${p}G`, to: steel ? `${p}P` : `${p}H` });
      if (rand() < 0.3) link({ kind: 'reach', from: `${p}G`, to: `${p}T${rand() < 0.5 ? '' : 'x'}`.replace(/x$/, 'CB') });
    }
  }
  // Keep references valid: drop reaches to trucks that were not generated.
  const ids = new Set(nodes.map((n) => n.id));
  return {
    format: 'bondmap-plan',
    version: 1,
    title: `generated plan, ${structures} structures, seed ${seed}`,
    system: { frequencyHz, faultKa: 2 + rand() * 30, clearingCycles: 3 + Math.floor(rand() * 30), xOverR: rand() * 30, phaseSpacingM: 0.6 + rand() },
    criteria: { bodyKg: rand() < 0.5 ? 50 : 70, bodyOhms: 1000 },
    nodes,
    links: links.filter((l) => ids.has(l.from) && ids.has(l.to)),
  };
}

/**
 * Random valid plan documents for property tests (fast-check): every kind, every optional field,
 * ids n0… for nodes and l0… for links; each plan is parsed by the real schema.
 */
import fc from 'fast-check';
import { CABLE_SIZES, parsePlan, type PlanDocument } from '@/lib/schemas/plan';

const num = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
const opt = <T>(arb: fc.Arbitrary<T>) => fc.option(arb, { nil: undefined });

const NODE_KINDS = ['phase', 'neutral', 'shield-wire', 'structure', 'crossarm', 'hardware', 'cluster-bar', 'ground-rod', 'earth', 'bucket', 'truck', 'mat', 'pole-ground', 'worker'] as const;

const nodeBody = fc.record({
  // Phases, workers and cluster bars weighted up so most plans have contacts to check.
  kind: fc.constantFrom(...NODE_KINDS, 'phase', 'phase', 'worker', 'worker', 'cluster-bar'),
  material: fc.constantFrom('wood', 'steel', 'concrete', 'fiberglass'),
  groundOhms: opt(num(0.01, 1000)),
  lengthM: num(0.3, 10),
  diameterMm: num(5, 40),
  soilOhmM: num(1, 10000),
  count: fc.integer({ min: 1, max: 6 }),
  spacingM: num(0.3, 30),
  workDistanceM: opt(num(0, 50)),
  pick: fc.nat(),
});

const linkBody = fc.record({
  kind: fc.constantFrom('jumper', 'jumper', 'jumper', 'bond', 'reach', 'reach'),
  a: fc.nat(),
  b: fc.nat(),
  cable: fc.constantFrom(...CABLE_SIZES),
  lengthM: num(0.2, 40),
  spanM: opt(num(0, 40)),
  clampKa: opt(num(1, 100)),
  clampCycles: opt(num(1, 120)),
  ohms: opt(num(0, 2)),
});

type ValueOf<A> = A extends fc.Arbitrary<infer T> ? T : never;

/** Turns random records into a valid plan: ids n0…, l0…; workers stand on and reach non-workers. */
function assemble(raw: { system: Record<string, unknown>; criteria: Record<string, unknown>; nodes: ValueOf<typeof nodeBody>[]; links: ValueOf<typeof linkBody>[] }): PlanDocument {
  const kinds = raw.nodes.map((n, i) => (i === 0 && n.kind === 'worker' ? 'hardware' : n.kind));
  const others = kinds.flatMap((k, i) => (k === 'worker' ? [] : [`n${i}`]));
  const workers = kinds.flatMap((k, i) => (k === 'worker' ? [`n${i}`] : []));
  const nodes = raw.nodes.map((n, i) => {
    const id = `n${i}`;
    const kind = kinds[i];
    switch (kind) {
      case 'structure':
      case 'crossarm':
        return { id, kind, material: n.material, ...(kind === 'structure' && n.groundOhms ? { groundOhms: n.groundOhms } : {}) };
      case 'neutral':
      case 'shield-wire':
      case 'truck':
        return { id, kind, ...(n.groundOhms ? { groundOhms: n.groundOhms } : {}) };
      case 'ground-rod':
        return { id, kind, lengthM: n.lengthM, diameterMm: n.diameterMm, soilOhmM: n.soilOhmM, count: n.count, spacingM: n.spacingM, ...(n.workDistanceM !== undefined ? { workDistanceM: n.workDistanceM } : {}) };
      case 'worker':
        return { id, kind, standsOn: others[n.pick % others.length] };
      case 'bucket':
        return { id, kind, insulatedBoom: n.pick % 2 === 0 };
      default:
        return { id, kind };
    }
  });
  const links = raw.links.flatMap((l, i) => {
    const id = `l${i}`;
    if (l.kind === 'reach') {
      if (workers.length === 0) return [];
      return [{ id, kind: 'reach', from: workers[l.a % workers.length], to: others[l.b % others.length] }];
    }
    const from = others[l.a % others.length];
    const to = others[l.b % others.length];
    if (from === to) return [];
    const ohms = l.ohms !== undefined ? { ohms: l.ohms } : {};
    if (l.kind === 'bond') return [{ id, kind: 'bond', from, to, ...ohms }];
    const clamp = l.clampKa !== undefined ? { clampKa: l.clampKa, ...(l.clampCycles !== undefined ? { clampCycles: l.clampCycles } : {}) } : {};
    return [{ id, kind: 'jumper', from, to, cable: l.cable, lengthM: l.lengthM, ...(l.spanM !== undefined ? { spanM: l.spanM } : {}), ...clamp, ...ohms }];
  });
  const doc = { format: 'bondmap-plan', version: 1, title: 'random', system: raw.system, criteria: raw.criteria, nodes, links };
  const parsed = parsePlan(doc);
  if (!parsed.ok) throw new Error(`generator made an invalid plan: ${JSON.stringify(parsed.issues)}`);
  return parsed.plan;
}

export const planArb = fc
  .record({
    system: fc.record({
      frequencyHz: fc.constantFrom(50, 60),
      faultKa: num(0.1, 200),
      clearingCycles: num(0.5, 300),
      xOverR: num(0, 100),
      phaseSpacingM: opt(num(0.1, 10)),
    }),
    criteria: fc.record({ bodyKg: fc.constantFrom(50, 70), bodyOhms: num(100, 5000) }),
    nodes: fc.array(nodeBody, { minLength: 2, maxLength: 14 }),
    links: fc.array(linkBody, { maxLength: 18 }),
  })
  .map((raw) => {
    const system = Object.fromEntries(Object.entries(raw.system).filter(([, v]) => v !== undefined));
    return assemble({ ...raw, system });
  });


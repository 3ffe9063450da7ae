import { describe, expect, it } from 'vitest';
import {
  analyseNetwork,
  BARE_STRANDS_OHMS,
  BOND_DEFAULT_OHMS,
  buildNetwork,
  decrementFactor,
  DEFAULT_GROUND_OHMS,
  jumperImpedance,
  REFERENCE,
  rodGroupOhms,
  tolerableBodyAmps,
} from '@/lib/domain/calc';
import { radiusFromDiameterMm } from '@/lib/domain/calc/units';
import { tinyPlan } from './plans';

const phaseToEarth = (extraNodes: Record<string, unknown>[] = [], extraLinks: Record<string, unknown>[] = [], system: Record<string, unknown> = {}) =>
  tinyPlan(
    [{ id: 'A', kind: 'phase' }, { id: 'CB', kind: 'cluster-bar' }, { id: 'N', kind: 'neutral', groundOhms: 5 }, ...extraNodes],
    [
      { id: 'jA', kind: 'jumper', from: 'A', to: 'CB', cable: '2/0', lengthM: 2 },
      { id: 'jN', kind: 'jumper', from: 'CB', to: 'N', cable: '2/0', lengthM: 2 },
      ...extraLinks,
    ],
    system,
  );

const noNaN = (value: unknown) => expect(JSON.stringify(value)).not.toMatch(/NaN|Infinity/);

describe('buildNetwork', () => {
  it('leaves wood, fiberglass and workers out, and takes earth as the reference', () => {
    const plan = phaseToEarth(
      [
        { id: 'P', kind: 'structure', material: 'wood' },
        { id: 'X', kind: 'crossarm', material: 'fiberglass' },
        { id: 'E', kind: 'earth' },
        { id: 'W', kind: 'worker', standsOn: 'CB' },
      ],
      [{ id: 'b1', kind: 'bond', from: 'P', to: 'CB' }],
    );
    const network = buildNetwork(plan);
    expect(network.size).toBe(3);
    expect(network.indexOf.get('E')).toBe(REFERENCE);
    for (const id of ['P', 'X', 'W']) expect(network.indexOf.has(id)).toBe(false);
    expect(network.branchElement).not.toContain('b1'); // a bond to wood bonds nothing
  });

  it('reports every default ground resistance it assumed, and none that the plan gave', () => {
    const plan = tinyPlan(
      [
        { id: 'N', kind: 'neutral' },
        { id: 'S', kind: 'shield-wire' },
        { id: 'T1', kind: 'structure', material: 'steel' },
        { id: 'T2', kind: 'structure', material: 'concrete', groundOhms: 50 },
        { id: 'T3', kind: 'structure', material: 'steel', groundOhms: 7 },
        { id: 'H', kind: 'hardware', groundOhms: 12 },
      ],
      [],
    );
    const { assumptions } = buildNetwork(plan);
    expect(assumptions.map((a) => [a.element, a.field, a.value])).toEqual([
      ['N', 'groundOhms', DEFAULT_GROUND_OHMS.neutral.value],
      ['S', 'groundOhms', DEFAULT_GROUND_OHMS['shield-wire'].value],
      ['T1', 'groundOhms', DEFAULT_GROUND_OHMS.steel.value],
    ]);
  });

  it('takes no footing for concrete, and a brought-out ground wire (hardware) at its given resistance (docs/plan-format.md)', () => {
    const network = buildNetwork(tinyPlan([{ id: 'T2', kind: 'structure', material: 'concrete', groundOhms: 50 }, { id: 'H', kind: 'hardware', groundOhms: 12 }], []));
    expect(network.indexOf.has('T2')).toBe(false);
    expect(network.branchElement).toEqual(['H']);
    expect(network.branchRe[0]).toBe(12);
  });

  it('refuses a link to an earth node: nothing can be clamped to remote earth (issue: earth is the reference)', () => {
    const plan = tinyPlan([{ id: 'A', kind: 'phase' }, { id: 'E', kind: 'earth' }], [{ id: 'jE', kind: 'jumper', from: 'A', to: 'E', cable: '2/0', lengthM: 2 }]);
    const network = buildNetwork(plan);
    expect(network.branchElement).not.toContain('jE');
    expect(network.floating.has('A')).toBe(true);
  });

  it('joins a bucket on a boom that is not insulated to its truck', () => {
    const plan = phaseToEarth([{ id: 'BK', kind: 'bucket', insulatedBoom: false }, { id: 'T', kind: 'truck' }], [{ id: 'jB', kind: 'jumper', from: 'BK', to: 'CB', cable: '2/0', lengthM: 2 }]);
    const network = buildNetwork(plan);
    expect(network.floating.has('T')).toBe(false);
    expect(network.branchKind[network.branchElement.indexOf('BK')]).toBe('boom');
    const insulated = buildNetwork(phaseToEarth([{ id: 'BK', kind: 'bucket', insulatedBoom: true }, { id: 'T', kind: 'truck' }], [{ id: 'jB', kind: 'jumper', from: 'BK', to: 'CB', cable: '2/0', lengthM: 2 }]));
    expect(insulated.floating.has('T')).toBe(true);
  });

  it('adds BARE_STRANDS_OHMS to a jumper with bare strands, and nothing to a measured one', () => {
    const plan = phaseToEarth([{ id: 'H', kind: 'hardware' }], [
      { id: 'jb', kind: 'jumper', from: 'H', to: 'CB', cable: '2/0', lengthM: 2, connection: 'bare-strands' },
      { id: 'jm', kind: 'jumper', from: 'H', to: 'N', cable: '2/0', lengthM: 2, connection: 'bare-strands', ohms: 0.003 },
    ]);
    const network = buildNetwork(plan);
    const re = (id: string) => network.branchRe[network.branchElement.indexOf(id)];
    expect(re('jb') - re('jA')).toBeCloseTo(BARE_STRANDS_OHMS, 15);
    expect(re('jm')).toBe(0.003);
  });

  it('does not ground a truck without groundOhms (its tyres insulate) nor through a pole ground', () => {
    const plan = tinyPlan(
      [{ id: 'T', kind: 'truck' }, { id: 'PG', kind: 'pole-ground' }, { id: 'T2', kind: 'truck', groundOhms: 80 }],
      [],
    );
    const network = buildNetwork(plan);
    expect([...network.floating].sort()).toEqual(['PG', 'T']);
    expect(network.indexOf.get('T2')).toBe(0);
    expect(network.branchRe[0]).toBe(80);
  });

  it('uses `ohms` as a pure resistance and 0.0001 Ω for a bond without it (docs/plan-format.md)', () => {
    const plan = phaseToEarth([{ id: 'H', kind: 'hardware' }], [
      { id: 'b1', kind: 'bond', from: 'H', to: 'CB' },
      { id: 'j9', kind: 'jumper', from: 'H', to: 'N', cable: '4/0', lengthM: 3, ohms: 0.002 },
    ]);
    const network = buildNetwork(plan);
    const branch = (id: string) => network.branchElement.indexOf(id);
    expect(network.branchRe[branch('b1')]).toBe(BOND_DEFAULT_OHMS);
    expect(network.branchIm[branch('j9')]).toBe(0);
    expect(network.branchRe[branch('j9')]).toBe(0.002);
    const computed = jumperImpedance('2/0', 2, 60);
    expect(network.branchRe[branch('jA')]).toBeCloseTo(computed.resistanceOhms, 15);
    expect(network.branchIm[branch('jA')]).toBeCloseTo(computed.reactanceOhms, 15);
  });
});

describe('analyseNetwork', () => {
  it('puts the whole fault current through a single series path and the rod current through the rod', () => {
    const plan = tinyPlan(
      [
        { id: 'A', kind: 'phase' },
        { id: 'CB', kind: 'cluster-bar' },
        { id: 'R', kind: 'ground-rod', lengthM: 2.4, diameterMm: 16, soilOhmM: 100 },
      ],
      [
        { id: 'j1', kind: 'jumper', from: 'A', to: 'CB', cable: '2', lengthM: 3 },
        { id: 'j2', kind: 'jumper', from: 'CB', to: 'R', cable: '2', lengthM: 3 },
      ],
      { faultKa: 4 },
    );
    const figures = analyseNetwork(plan);
    // The solve injects Df × If (IEEE Std 80: effective asymmetrical rms over the shock duration).
    const df = decrementFactor(10, 0.25, 60);
    expect(figures.jumpers.map((j) => j.currentKa)).toEqual([expect.closeTo(4 * df, 9), expect.closeTo(4 * df, 9)]);
    const rodOhms = rodGroupOhms({ soilOhmM: 100, lengthM: 2.4, radius: radiusFromDiameterMm(16), count: 1 }).ohms;
    expect(figures.rods[0].ohms).toBeCloseTo(rodOhms, 12);
    expect(figures.rods[0].currentKa).toBeCloseTo(4 * df, 9);
    expect(figures.rods[0].potentialRiseVolts).toBeCloseTo(4000 * df * rodOhms, 6);
  });

  it('marks contacts on wood as floating and lists phases with no path to earth, without NaN', () => {
    const plan = tinyPlan(
      [
        { id: 'A', kind: 'phase' },
        { id: 'B', kind: 'phase' },
        { id: 'CB', kind: 'cluster-bar' },
        { id: 'N', kind: 'neutral' },
        { id: 'P', kind: 'structure', material: 'wood' },
        { id: 'W1', kind: 'worker', standsOn: 'P' },
        { id: 'W2', kind: 'worker', standsOn: 'CB' },
      ],
      [
        { id: 'j1', kind: 'jumper', from: 'A', to: 'CB', cable: '2', lengthM: 3 },
        { id: 'j2', kind: 'jumper', from: 'CB', to: 'N', cable: '2', lengthM: 3 },
        { id: 'r1', kind: 'reach', from: 'W1', to: 'A' },
        { id: 'r2', kind: 'reach', from: 'W2', to: 'B' },
        { id: 'r3', kind: 'reach', from: 'W2', to: 'A' },
      ],
    );
    const figures = analyseNetwork(plan);
    noNaN(figures);
    expect(figures.unsolvedPhases).toEqual(['B']);
    expect(figures.contacts.map((c) => [c.worker, c.surface, c.status])).toEqual([
      ['W1', 'A', 'floating'],
      ['W2', 'B', 'floating'],
      ['W2', 'A', 'solved'],
    ]);
    expect(figures.contacts[2].worstPhase).toBe('A');
  });

  it('solves a plan where nothing reaches earth without crashing', () => {
    const plan = tinyPlan(
      [{ id: 'A', kind: 'phase' }, { id: 'CB', kind: 'cluster-bar' }, { id: 'W', kind: 'worker', standsOn: 'CB' }, { id: 'R', kind: 'ground-rod', lengthM: 2, diameterMm: 16, soilOhmM: 50 }],
      [{ id: 'j1', kind: 'jumper', from: 'A', to: 'CB', cable: '2', lengthM: 3, clampKa: 20 }, { id: 'r1', kind: 'reach', from: 'W', to: 'A' }],
    );
    const figures = analyseNetwork(plan);
    noNaN(figures);
    expect(figures.unsolvedPhases).toEqual(['A']);
    expect(figures.contacts[0].status).toBe('floating');
    expect(figures.jumpers[0].currentKa).toBeNull();
    // The unconnected rod still gets a barricade, on the whole fault current (conservative).
    expect(figures.rods[0].currentKa).toBeCloseTo(0, 12);
    expect(figures.assumptions).toContainEqual(expect.objectContaining({ element: 'j1', field: 'clampCycles', value: 15 }));
  });

  it('handles a 0 Ω jumper by a 1 µΩ floor: finite, and the current still flows through it', () => {
    const plan = phaseToEarth([], [{ id: 'j0', kind: 'jumper', from: 'A', to: 'N', cable: '4/0', lengthM: 2, ohms: 0 }]);
    const figures = analyseNetwork(plan);
    noNaN(figures);
    const j0 = figures.jumpers.find((j) => j.link === 'j0');
    expect(j0?.ohms).toBe(0);
    expect(j0?.currentKa).toBeGreaterThan(9.99);
  });

  it('takes a worker standing on earth at remote-earth potential', () => {
    const plan = phaseToEarth([{ id: 'E', kind: 'earth' }, { id: 'W', kind: 'worker', standsOn: 'E' }], [{ id: 'r', kind: 'reach', from: 'W', to: 'N' }]);
    const contact = analyseNetwork(plan).contacts[0];
    // Fault 10 kA × Df through the 5 Ω neutral ground: the neutral rises 50 kV × Df above remote earth.
    const df = decrementFactor(10, 0.25, 60);
    expect(contact.touchVolts).toBeCloseTo(50_000 * df, 3);
    expect(contact.bodyAmps).toBeCloseTo((50_000 * df) / (1000 + 5), 0);
    expect(contact.systemVoltageLimited).toBe(false);
  });

  it('caps the open-circuit voltage at the line-to-neutral voltage when nominalKv is given', () => {
    const nodes = [{ id: 'E', kind: 'earth' }, { id: 'W', kind: 'worker', standsOn: 'E' }];
    const plan = tinyPlan(
      [{ id: 'A', kind: 'phase' }, { id: 'CB', kind: 'cluster-bar' }, { id: 'N', kind: 'neutral', groundOhms: 5 }, ...nodes],
      [{ id: 'jA', kind: 'jumper', from: 'A', to: 'CB', cable: '2/0', lengthM: 2 }, { id: 'jN', kind: 'jumper', from: 'CB', to: 'N', cable: '2/0', lengthM: 2 }, { id: 'r', kind: 'reach', from: 'W', to: 'N' }],
      { nominalKv: 12.47 },
    );
    const contact = analyseNetwork(plan).contacts[0];
    // 12.47 kV phase-to-phase → 12470/√3 = 7199.6 V line-to-neutral [calc].
    expect(contact.touchVolts).toBeCloseTo(7199.6, 1);
    expect(contact.bodyAmps).toBeCloseTo(7199.6 / 1005, 3);
    expect(contact.systemVoltageLimited).toBe(true);
  });

  it('checks a reach to another worker against that worker’s standing node', () => {
    const plan = phaseToEarth(
      [{ id: 'E', kind: 'earth' }, { id: 'W1', kind: 'worker', standsOn: 'E' }, { id: 'W2', kind: 'worker', standsOn: 'CB' }],
      [{ id: 'r', kind: 'reach', from: 'W1', to: 'W2' }],
      { xOverR: 0 },
    );
    const contact = analyseNetwork(plan).contacts[0];
    expect(contact.status).toBe('solved');
    expect(contact.touchVolts).toBeGreaterThan(49_000); // the cluster bar rises with the neutral, ~50 kV
  });

  it('uses the plan’s body weight and resistance', () => {
    const plan = tinyPlan(
      [{ id: 'A', kind: 'phase' }, { id: 'G', kind: 'hardware', groundOhms: 1e-9 }, { id: 'E', kind: 'earth' }, { id: 'W', kind: 'worker', standsOn: 'E' }],
      [{ id: 'b', kind: 'bond', from: 'A', to: 'G', ohms: 0.01 }, { id: 'r', kind: 'reach', from: 'W', to: 'A' }],
      { clearingCycles: 30, xOverR: 0 },
      { bodyKg: 70, bodyOhms: 500 },
    );
    const contact = analyseNetwork(plan).contacts[0];
    expect(contact.limitAmps).toBe(tolerableBodyAmps(0.5, 70));
    expect(contact.bodyAmps).toBeCloseTo(100 / 500.01, 6); // the 1 nΩ ground adds 1e-7 V
  });
});

describe('analyseNetwork on generated plans with links knocked out', () => {
  it('never crashes and never reports NaN, whatever is left connected', async () => {
    const { generatePlan, seededRandom } = await import('../../../bench/generate-plan');
    for (let seed = 1; seed <= 30; seed++) {
      const plan = generatePlan({ elements: 80, seed });
      const rand = seededRandom(seed);
      const broken = { ...plan, links: plan.links.filter(() => rand() > 0.3) };
      const figures = analyseNetwork(broken);
      noNaN(figures);
      for (const c of figures.contacts) {
        expect(c.bodyAmps).toBeGreaterThanOrEqual(0);
        // The body can never carry more than the open-circuit voltage drives through R_body alone.
        expect(c.bodyAmps).toBeLessThanOrEqual(c.touchVolts / 1000 + 1e-12);
      }
    }
  });
});

import { describe, expect, it } from 'vitest';
import { parsePlan, type PlanDocument } from '@/lib/schemas/plan';
import { analyseNetwork, r20OhmPerM, stepTouchCriteria, surfaceLayerFactor, tolerableBodyAmps } from '@/lib/domain/calc';
import { checkEntries, loadReference } from './reference';

const FOOT_M = 0.3048;

/**
 * A fault on phase A returning to earth through one resistive path; a worker on earth touches A.
 * The path ends on hardware with a 1 nΩ resistance to earth (nothing is clamped to remote earth
 * itself), and X/R 0 makes the decrement factor 1, so the worked examples' symmetrical current is
 * what the solve injects.
 */
function dividerPlan(pathOhms: number[], faultKa: number, bodyOhms: number): PlanDocument {
  const nodeIds = ['A', ...pathOhms.slice(1).map((_, i) => `M${i}`), 'G'];
  const input = {
    format: 'bondmap-plan',
    version: 1,
    title: 'current divider',
    system: { frequencyHz: 60, faultKa, clearingCycles: 15, xOverR: 0 },
    criteria: { bodyKg: 50, bodyOhms },
    nodes: [
      { id: 'A', kind: 'phase', phase: 'A' },
      ...nodeIds.slice(1, -1).map((id) => ({ id, kind: 'hardware' })),
      { id: 'G', kind: 'hardware', groundOhms: 1e-9 },
      { id: 'E', kind: 'earth' },
      { id: 'W', kind: 'worker', standsOn: 'E' },
    ],
    links: [
      // Resistances only, as the examples state: each path element is given as `ohms`.
      ...pathOhms.map((ohms, i) => ({ id: `p${i}`, kind: 'bond', from: nodeIds[i], to: nodeIds[i + 1], ohms })),
      { id: 'touch', kind: 'reach', from: 'W', to: 'A' },
    ],
  };
  const parsed = parsePlan(input);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return parsed.plan;
}

const dividerContact = (i: Record<string, number | string>) => {
  const ohms = r20OhmPerM(i.cable as '2' | '4/0') * Number(i.lengthFt) * FOOT_M;
  return analyseNetwork(dividerPlan([ohms], Number(i.faultKa), Number(i.bodyOhms))).contacts[0];
};

describe('body current and criteria against fixtures/reference/body-current.json', () => {
  // Dalziel table: IEEE Std 80 [pub]. Step/touch: IEEE Std 80 from memory; bare soil computed.
  // Dividers: computed from I_B = I_F·Z_J/(Z_J + R_B), solved here through the network solver.
  checkEntries(loadReference('body-current.json'), {
    tolerableBodyAmps: (i) => tolerableBodyAmps(Number(i.durationS), Number(i.bodyKg) as 50 | 70),
    touchVolts: (i) => stepTouchCriteria({ surfaceOhmM: Number(i.surfaceOhmM), cs: Number(i.cs), durationS: Number(i.durationS), bodyKg: Number(i.bodyKg) as 50 | 70 }).touchVolts,
    stepVolts: (i) => stepTouchCriteria({ surfaceOhmM: Number(i.surfaceOhmM), cs: Number(i.cs), durationS: Number(i.durationS), bodyKg: Number(i.bodyKg) as 50 | 70 }).stepVolts,
    surfaceLayerFactor: (i) => surfaceLayerFactor(Number(i.soilOhmM), Number(i.surfaceOhmM), Number(i.surfaceDepthM)),
    dividerTouchVolts: (i) => dividerContact(i).touchVolts,
    dividerBodyAmps: (i) => dividerContact(i).bodyAmps,
    farSideBodyAmps: (i) =>
      analyseNetwork(dividerPlan([Number(i.loopOhms), Number(i.jumperOhms)], Number(i.faultKa), Number(i.bodyOhms))).contacts[0].bodyAmps,
  });
});

describe('tolerableBodyAmps outside IEEE Std 80 validity (0.03 s to 3 s)', () => {
  it('holds the 0.03 s value for shorter durations instead of crediting more', () => {
    expect(tolerableBodyAmps(0.01, 50)).toBe(tolerableBodyAmps(0.03, 50));
    expect(tolerableBodyAmps(0.01, 50)).toBeCloseTo(0.116 / Math.sqrt(0.03), 12);
  });
  it('keeps falling beyond 3 s (the conservative direction)', () => {
    expect(tolerableBodyAmps(6, 70)).toBeCloseTo(0.157 / Math.sqrt(6), 12);
    expect(tolerableBodyAmps(6, 70)).toBeLessThan(tolerableBodyAmps(3, 70));
  });
  it('defaults to the lighter body constant only when asked for 50 kg', () => {
    expect(tolerableBodyAmps(1, 70) / tolerableBodyAmps(1, 50)).toBeCloseTo(0.157 / 0.116, 12);
  });
});

describe('surface layer factor', () => {
  it('is 1 without a surface layer (IEEE Std 80)', () => {
    expect(surfaceLayerFactor(100, 3000, 0)).toBe(1);
    expect(surfaceLayerFactor(100, 100, 0.1)).toBe(1);
  });
});

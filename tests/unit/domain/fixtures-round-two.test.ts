/**
 * Figures of the issue-11 fixture plans beyond their rule ids (fixtures/plans/expected.json),
 * each against a value computed from its source, named beside the check.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkPlan } from '@/lib/domain/checker';
import { decrementFactor, singleRodOhms } from '@/lib/domain/calc';
import { IEEE142_MULTIPLIERS } from '@/lib/domain/calc/rods';
import { radiusFromDiameterMm } from '@/lib/domain/calc/units';
import { parsePlan, type PlanDocument } from '@/lib/schemas/plan';

const dir = join(__dirname, '../../../fixtures/plans');
function load(name: string): PlanDocument {
  const parsed = parsePlan(JSON.parse(readFileSync(join(dir, `${name}.json`), 'utf8')));
  if (!parsed.ok) throw new Error(`${name}: ${JSON.stringify(parsed.issues)}`);
  return parsed.plan;
}
const check = (name: string) => checkPlan(load(name));

describe('issue 11 fixtures, figures', () => {
  it('earth-jumper-no-ground: the ground hand’s contact is no longer solved against a perfect ground (was 10.8 V)', () => {
    const contact = check('earth-jumper-no-ground').contacts.find((c) => c.worker === 'W2');
    expect(contact?.status).toBe('floating');
    expect(contact?.touchVolts).toBeNull();
  });

  it('rod-triangle: three rods one length apart by the resistance matrix, above the remembered IEEE Std 142 multiplier', () => {
    const report = check('rod-triangle');
    const single = singleRodOhms(100, 2.4384, radiusFromDiameterMm(15.875)); // 39.90 Ω, docs/engineering.md §5 [calc]
    const table = ((new Map(IEEE142_MULTIPLIERS).get(3) as number) * single) / 3; // 17.16 Ω, IEEE Std 142 F = 1.29 [from memory]
    expect(report.rods[0].ohms).toBeCloseTo(17.943, 3); // mutual-resistance matrix [calc]
    expect((report.rods[0].ohms as number) / table).toBeGreaterThan(1.04); // the issue: the table is 4–7 % low for a triangle
    expect(report.rods[0].method).toMatch(/3 rods in a ring, mutual resistance of each pair/);
  });

  it('asymmetry-tips-contact: 0.220 A symmetrical passes, Df × If = 1.101 × 10 kA gives 0.242 A and fails (IEEE Std 80)', () => {
    const plan = load('asymmetry-tips-contact');
    const report = checkPlan(plan);
    // docs/engineering.md §3 table: X/R 20, 15 cycles → Df 1.101.
    expect(report.fault.decrementFactor).toBeCloseTo(1.101, 3);
    expect(report.fault.injectedKa).toBeCloseTo(11.01, 2);
    // I_B = I·Z/(Z + R_B), Z = 0.0105 + 0.0105 + 0.001 = 0.022 Ω [calc].
    expect(report.contacts[0].bodyAmps).toBeCloseTo((11010 * 0.022) / 1000.022, 3);
    const symmetrical = checkPlan({ ...plan, system: { ...plan.system, xOverR: 0 } });
    expect(symmetrical.contacts[0].bodyAmps).toBeCloseTo((10000 * 0.022) / 1000.022, 4);
    expect(symmetrical.findings.filter((f) => f.rule === 'body-current-exceeds')).toEqual([]);
  });

  it('rod-only-voltage-cap: 1.58 kA through a 39.9 Ω rod would be 63 kV; the contact is capped at 12.47/√3 = 7.20 kV', () => {
    const report = check('rod-only-voltage-cap');
    expect(report.rods[0].potentialRiseVolts).toBeCloseTo(1.5 * decrementFactor(10, 0.25, 60) * 1000 * 39.905, -2);
    const contact = report.contacts.find((c) => c.worker === 'W2');
    expect(contact?.systemVoltageLimited).toBe(true);
    expect(contact?.touchVolts).toBeCloseTo(7199.56, 2);
    expect(report.findings.find((f) => f.rule === 'body-current-exceeds')?.message).toContain('limited to the 7.2 kV line-to-neutral voltage');
  });

  it('fifty-hertz-clamp: a 20 kA / 15-cycle (60 Hz, 0.25 s) clamp is good for 20·√(0.25/0.30) = 18.26 kA at 15 cycles of 50 Hz', () => {
    const report = check('fifty-hertz-clamp');
    expect(report.fault.durationS).toBeCloseTo(0.3, 12);
    expect(report.jumpers[0].clampRatingKa).toBeCloseTo(18.257, 3);
  });

  it('bare-strands-lead: the lead carries 1 mΩ more than the same lead with ferrules (Bondmap assumption)', () => {
    const plan = load('bare-strands-lead');
    const ferrule = checkPlan({ ...plan, links: plan.links.map((l) => (l.id === 'jN' ? { ...l, connection: 'ferrule' as const } : l)) });
    const ohmsOf = (r: ReturnType<typeof checkPlan>) => r.jumpers.find((j) => j.link === 'jN')?.resistanceOhms as number;
    expect(ohmsOf(checkPlan(plan)) - ohmsOf(ferrule)).toBeCloseTo(0.001, 12);
  });

  it('phase-to-phase-short-leads and supply-bracket: nothing to say about whip or the source side', () => {
    expect(check('phase-to-phase-short-leads').findings.filter((f) => f.rule === 'lead-whip')).toEqual([]);
    expect(check('supply-bracket').findings.filter((f) => f.rule.startsWith('supply-side'))).toEqual([]);
  });

  it('three-long-leads: 20 kA, X/R 10, 0.9 m → 2×10⁻⁷·(1.746·√2·20 kA)²/0.9 = 542 N/m (IEC 60909-0 κ; SI ampere)', () => {
    expect(check('three-long-leads').fault.peakForceNPerM).toBeCloseTo((2e-7 * (1.746 * Math.SQRT2 * 20000) ** 2) / 0.9, -1);
  });
});

/**
 * The rules of issue 11 (the checker, round two), each on a tiny plan where it fires and one where
 * it does not, through the real checker, with exact rule ids, severities and element ids.
 */
import { describe, expect, it } from 'vitest';
import { checkPlan } from '@/lib/domain/checker';
import { bucketLinks, bucketNodes, bucketPlan, link, makePlan, node, patchElement } from '../../helpers/plan-factory';
import { describeRuleCases } from '../../helpers/rule-cases';

const swapLink = (id: string, replacement: Record<string, unknown>, extraNodes: Record<string, unknown>[] = []) =>
  makePlan({ nodes: [...bucketNodes(), ...extraNodes], links: bucketLinks().map((l) => (l.id === id ? replacement : l)) });
const withNodes = (nodes: Record<string, unknown>[], links: Record<string, unknown>[] = []) => makePlan({ nodes: [...bucketNodes(), ...nodes], links: [...bucketLinks(), ...links] });
const patchedJumper = (patch: Record<string, unknown>) => makePlan({ nodes: bucketNodes(), links: patchElement(bucketLinks(), 'jA', patch) });

/** Phase-to-phase jumpering: A–B, B–C, one lead from C down to the cluster bar. */
const phaseToPhase = (patchAB: Record<string, unknown> = {}) =>
  makePlan({
    nodes: bucketNodes(),
    links: [
      link.jumper('jAB', 'A', 'B', { lengthM: 1.1, spanM: 1, ...patchAB }),
      link.jumper('jBC', 'B', 'C', { lengthM: 1.1, spanM: 1 }),
      link.jumper('jC', 'C', 'CB', { lengthM: 1.5 }),
      ...bucketLinks().filter((l) => !['jA', 'jB', 'jC'].includes(l.id as string)),
    ],
  });

/**
 * A source feeds phase AS at the next structure; a span joins it to AW at the work, which the
 * worker reaches. Grounds: at the work (AW to CB), at the source side (AS to CBS), both or neither.
 */
function supplyPlan(groundsAtWork: boolean, groundsAtSource: boolean) {
  return makePlan({
    nodes: [node.phase('AS'), node.phase('AW'), node.neutral('N'), node.neutral('NS'), node.cluster('CB'), node.cluster('CBS'), node.bucket(), node.worker('W1', 'BK'), { id: 'S1', kind: 'supply-end', phases: ['AS'] }],
    links: [
      link.bond('spanA', 'AS', 'AW', { ohms: 0.02 }),
      link.bond('spanN', 'NS', 'N', { ohms: 0.02 }),
      link.jumper('jN', 'CB', 'N'),
      link.jumper('jBK', 'BK', 'CB'),
      link.jumper('jNS', 'CBS', 'NS'),
      ...(groundsAtWork ? [link.jumper('jAW', 'AW', 'CB')] : []),
      ...(groundsAtSource ? [link.jumper('jAS', 'AS', 'CBS')] : []),
      link.reach('rA', 'W1', 'AW'),
    ],
  });
}

describeRuleCases([
  { rule: 'earth-link', severity: 'blocker', fires: () => swapLink('jN', link.jumper('jE', 'CB', 'E'), [node.earth('E')]), elements: [['jE', 'E']], clean: () => bucketPlan() },
  { rule: 'bond-not-rated', severity: 'blocker', fires: () => swapLink('jA', link.bond('bA', 'A', 'CB')), elements: [['A', 'bA']], clean: () => bucketPlan() },
  // A bond without ohms in the fault path: warning (the note form is in the details below).
  { rule: 'bond-fault-current', severity: 'warning', fires: () => swapLink('jA', link.bond('bA', 'A', 'CB')), elements: [['bA']], clean: () => bucketPlan() },
  { rule: 'worker-no-reach', severity: 'warning', fires: () => withNodes([node.worker('W2', 'CB')]), elements: [['W2']], clean: () => bucketPlan() },
  {
    rule: 'boom-uninsulated',
    severity: 'warning',
    fires: () => makePlan({ nodes: [...patchElement(bucketNodes(), 'BK', { insulatedBoom: false }), node.truck('T1')], links: bucketLinks() }),
    elements: [['BK', 'T1']],
    clean: () => makePlan({ nodes: [...patchElement(bucketNodes(), 'BK', { insulatedBoom: false }), node.truck('T1')], links: [...bucketLinks(), link.jumper('jT', 'T1', 'CB')] }),
  },
  {
    rule: 'concrete-ground-ignored',
    severity: 'warning',
    fires: () => withNodes([node.structure('S1', 'concrete', { groundOhms: 50 })]),
    elements: [['S1']],
    clean: () => withNodes([node.structure('S1', 'concrete'), node.hardware('GW', { groundOhms: 50 })], [link.jumper('jGW', 'GW', 'CB')]),
  },
  // Dwight's formula needs L ≫ a: 0.02 m against a 50 mm radius is refused (the issue's −421.8 Ω rod).
  { rule: 'rod-out-of-range', severity: 'blocker', fires: () => withNodes([node.rod('R1', { lengthM: 0.02, diameterMm: 100 })], [link.jumper('jR', 'CB', 'R1')]), elements: [['R1']], clean: () => withNodes([node.rod('R1')], [link.jumper('jR', 'CB', 'R1')]) },
  // 10 kA, X/R 10, 0.9 m: 2×10⁻⁷·(1.746·√2·10 kA)²/0.9 = 135 N/m ≥ 100 N/m (IEC 60909-0 κ; SI ampere).
  { rule: 'lead-whip', severity: 'warning', fires: () => phaseToPhase({ lengthM: 3 }), elements: [['jAB']], clean: () => phaseToPhase() },
  { rule: 'lead-whip', severity: 'note', fires: () => bucketPlan(), elements: [['CB', 'jA', 'jB', 'jC']], clean: () => phaseToPhase() },
  { rule: 'clamp-live-line', severity: 'blocker', fires: () => patchedJumper({ clampKind: 'live-line' }), elements: [['jA']], clean: () => patchedJumper({ clampKind: 'grounding' }) },
  { rule: 'lead-bare-strands', severity: 'warning', fires: () => patchedJumper({ connection: 'bare-strands' }), elements: [['jA']], clean: () => patchedJumper({ connection: 'ferrule' }) },
  { rule: 'supply-side-ungrounded', severity: 'blocker', fires: () => supplyPlan(false, false), elements: [['S1', 'AW']], clean: () => supplyPlan(true, true) },
  { rule: 'supply-side-single-point', severity: 'note', fires: () => supplyPlan(true, false), elements: [['S1', 'AW']], clean: () => supplyPlan(true, true) },
]);

describe('round-two details', () => {
  it('earth-link: a cluster bar jumpered to earth is no ground — the phases and zone are ungrounded too', () => {
    const report = checkPlan(swapLink('jN', link.jumper('jE', 'CB', 'E'), [node.earth('E')]));
    // The neutral N is left without a jumper, so bond-not-rated does not apply; the phases are ungrounded.
    expect(report.findings.filter((f) => f.severity === 'blocker').map((f) => f.rule)).toEqual(expect.arrayContaining(['earth-link', 'phase-ungrounded', 'zone-ungrounded']));
  });

  it('bond-fault-current is a note with the current when the bond has ohms', () => {
    const found = checkPlan(swapLink('jA', link.bond('bA', 'A', 'CB', { ohms: 0.001 }))).findings.filter((f) => f.rule === 'bond-fault-current');
    expect(found.map((f) => [f.severity, f.elements])).toEqual([['note', ['bA']]]);
    expect(found[0].message).toMatch(/carries up to 10\.5 kA/); // 10 kA × Df 1.052 (IEEE Std 80, X/R 10, 15 cycles)
  });

  it('a span (marked, or between two phases) is line conductor: no bond rules', () => {
    const report = checkPlan(supplyPlan(true, true));
    expect(report.findings.filter((f) => f.rule.startsWith('bond-'))).toEqual([]);
  });

  it('a reach to another worker is checked against what that worker stands on', () => {
    const report = checkPlan(withNodes([node.earth('E'), node.worker('W2', 'E')], [link.reach('rW', 'W2', 'W1')]));
    expect(report.findings.filter((f) => f.severity === 'blocker').map((f) => [f.rule, f.elements])).toEqual([
      ['body-current-exceeds', ['W2', 'W1']],
      ['surface-outside-zone', ['W2', 'W1']],
    ]);
    expect(report.contacts.find((c) => c.worker === 'W2')?.status).toBe('solved');
  });

  it('the system voltage caps a contact and the finding says so (12.47 kV → 7.2 kV line-to-neutral)', () => {
    const report = checkPlan(withNodes([node.truck('T1'), node.earth('E'), node.worker('W2', 'E')], [link.jumper('jT', 'T1', 'N'), link.reach('rT', 'W2', 'T1')]));
    const contact = report.contacts.find((c) => c.worker === 'W2');
    expect(contact?.systemVoltageLimited).toBe(true);
    expect(contact?.touchVolts).toBeCloseTo(12470 / Math.sqrt(3), 6);
    expect(report.fault.lineToNeutralVolts).toBeCloseTo(7199.56, 2);
    expect(report.findings.find((f) => f.rule === 'body-current-exceeds')?.message).toMatch(/limited to the 7\.2 kV line-to-neutral voltage/);
  });

  it('a truck on an uninsulated boom is in the zone, so a ground worker touching it is a contact with the zone', () => {
    const plan = makePlan({
      nodes: [...patchElement(bucketNodes(), 'BK', { insulatedBoom: false }), node.truck('T1'), node.earth('E'), node.worker('W2', 'E')],
      links: [...bucketLinks(), link.reach('rT', 'W2', 'T1')],
    });
    const report = checkPlan(plan);
    expect(report.contacts.find((c) => c.worker === 'W2')?.status).toBe('solved');
    expect(report.findings.map((f) => [f.rule, f.elements])).toContainEqual(['body-current-exceeds', ['W2', 'T1']]);
  });

  it('concrete is not a bonding path: standing on it is a blocker, a jumper to it a warning', () => {
    const plan = makePlan({ nodes: [...patchElement(bucketNodes(), 'W1', { standsOn: 'S1' }), node.structure('S1', 'concrete')], links: [...bucketLinks(), link.jumper('jS', 'S1', 'CB')] });
    const rules = checkPlan(plan).findings.map((f) => [f.rule, f.severity]);
    expect(rules).toContainEqual(['stand-not-conductive', 'blocker']);
    expect(rules).toContainEqual(['link-on-insulator', 'warning']);
  });

  it('lead-whip stays quiet when the phase spacing keeps the force low', () => {
    // 2×10⁻⁷·(34.7 kA)²/5 m = 48 N/m < 100 N/m.
    const plan = makePlan({ system: { phaseSpacingM: 5 }, nodes: bucketNodes(), links: patchElement(bucketLinks(), 'jA', { lengthM: 5, spanM: 1 }) });
    expect(checkPlan(plan).findings.filter((f) => f.rule === 'lead-whip')).toEqual([]);
  });

  it('the check reports the decrement factor and the current it injected (IEEE Std 80: Df × If)', () => {
    const report = checkPlan(bucketPlan());
    expect(report.fault.injectedKa).toBeCloseTo(10 * (report.fault.decrementFactor ?? NaN), 12);
    expect(report.fault.decrementFactor).toBeCloseTo(1.052, 3); // docs/engineering.md §3 table, X/R 10, 15 cycles
  });
});

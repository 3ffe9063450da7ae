import { describe, expect, it } from 'vitest';
import { calc } from '@/lib/domain/calc/index';
import type { CalcEntryPoints, NetworkFigures } from '@/lib/domain/calc/contract';
import { checkPlan } from '@/lib/domain/checker';
import { CAUTION, type Finding } from '@/lib/domain/report';
import { compareFindings } from '@/lib/domain/rules/index';
import { bucketLinks, bucketNodes, bucketPlan, link, makePlan, node } from '../../helpers/plan-factory';

/** The real calculations with the network figures rewritten by `edit`. */
const withNetwork = (edit: (n: NetworkFigures) => NetworkFigures): CalcEntryPoints => ({ ...calc, analyseNetwork: (plan) => edit(calc.analyseNetwork(plan)) });

describe('checkPlan report', () => {
  it('has the version-1 shape, the caution and a consistent summary', () => {
    const report = checkPlan(makePlan({ nodes: bucketNodes(), links: bucketLinks().filter((l) => l.id !== 'jA') }));
    expect(report).toMatchObject({ format: 'bondmap-check', version: 1, ok: false, caution: CAUTION });
    const count = (s: string) => report.findings.filter((f) => f.severity === s).length;
    expect(report.summary).toEqual({ blockers: count('blocker'), warnings: count('warning'), notes: count('note') });
    expect(report.summary.blockers).toBe(2);
    expect(Object.keys(report)).toEqual(
      expect.arrayContaining(['format', 'version', 'ok', 'summary', 'findings', 'fault', 'tolerableBodyAmps', 'zones', 'contacts', 'jumpers', 'rods']),
    );
  });

  it('is ok with no blocker even when warnings and notes remain', () => {
    const report = checkPlan(makePlan({ nodes: bucketNodes(), links: bucketLinks().map((l) => (l.id === 'jA' ? { ...l, lengthM: 6, spanM: 1 } : l)) }));
    expect(report.ok).toBe(true);
    // lead-slack and lead-whip (135 N/m at 0.9 m, above the 100 N/m threshold) on jA.
    expect(report.summary).toMatchObject({ blockers: 0, warnings: 2 });
  });

  it('computes the contract figures for the docs/plan-format.md example system', () => {
    const report = checkPlan(bucketPlan());
    // docs/plan-format.md: durationS = clearingCycles / frequencyHz = 15 / 60.
    expect(report.fault.durationS).toBeCloseTo(0.25, 12);
    // IEEE Std 80 (Dalziel, 50 kg): 0.116 / √0.25 = 0.232 A, docs/engineering.md §2 table.
    expect(report.tolerableBodyAmps).toBeCloseTo(0.232, 4);
    // docs/engineering.md §3 [calc]: X/R 10, 0.25 s → Df 1.052; IEC 60909-0 κ(X/R 10) = 1.7460.
    expect(report.fault.decrementFactor).toBeCloseTo(1.052, 3);
    expect(report.fault.peakFactor).toBeCloseTo(1.746, 3);
    expect(report.zones).toEqual([{ nodes: ['A', 'B', 'BK', 'C', 'CB', 'N'], grounded: true }]);
    expect(report.contacts.map((c) => [c.worker, c.surface])).toEqual([['W1', 'A'], ['W1', 'B'], ['W1', 'C']]);
    expect(report.jumpers.map((j) => j.link)).toEqual(['jA', 'jB', 'jC', 'jN', 'jBK']);
  });

  it('finds 0.490 A through a worker beyond the grounds (docs/engineering.md §2 [calc], ±0.001 A)', () => {
    const plan = makePlan({
      system: { xOverR: 0 }, // Df = 1: the worked example's symmetrical current is what is injected
      nodes: [node.phase('AG'), node.phase('AW'), node.cluster('CBG'), node.neutral('NW'), node.bucket(), node.worker('W1', 'BK')],
      links: [
        link.jumper('jAG', 'AG', 'CBG', { ohms: 0.001 }),
        link.bond('line', 'AG', 'AW', { ohms: 0.024 }),
        link.bond('neutral', 'CBG', 'NW', { ohms: 0.024, span: true }),
        link.bond('bBK', 'BK', 'NW', { ohms: 0 }),
        link.reach('rAW', 'W1', 'AW'),
      ],
    });
    const report = checkPlan(plan);
    // I_B = I_F·Z/(Z + R_B) = 10 000 × 0.049 / 1000.049 = 0.48998 A.
    expect(report.contacts[0].bodyAmps).toBeCloseTo(0.49, 3);
    const finding = report.findings.find((f) => f.rule === 'body-current-exceeds');
    expect(finding?.message).toContain('0.490 A');
    expect(finding?.message).toContain('0.232 A');
    // At X/R 10 the contact sees Df × If = 1.052 × 10 kA (IEEE Std 80 decrement factor, 15 cycles).
    const asymmetric = checkPlan({ ...plan, system: { ...plan.system, xOverR: 10 } });
    expect(asymmetric.contacts[0].bodyAmps).toBeCloseTo(0.49 * (asymmetric.fault.decrementFactor ?? NaN), 3);
    expect(asymmetric.findings.find((f) => f.rule === 'body-current-exceeds')?.message).toContain('10.5 kA (decrement factor 1.052)');
  });

  it('sorts findings by severity, then rule id, then elements', () => {
    const plan = makePlan({
      nodes: [...bucketNodes(), node.hardware('H2'), node.hardware('H1'), node.rod('R1')],
      links: [
        ...bucketLinks().map((l) => (l.id === 'jC' ? { ...l, lengthM: 9, spanM: 1 } : l)),
        link.reach('rH2', 'W1', 'H2'),
        link.reach('rH1', 'W1', 'H1'),
      ],
    });
    const findings = checkPlan(plan).findings;
    expect(findings.map((f) => `${f.severity}:${f.rule}:${f.elements.join('+')}`)).toEqual([
      'blocker:surface-outside-zone:W1+H1',
      'blocker:surface-outside-zone:W1+H2',
      'warning:lead-slack:jC',
      'warning:lead-whip:jC',
      'note:lead-whip:CB+jA+jB+jC',
      'note:rod-barricade:R1',
    ]);
  });

  it('compareFindings orders shorter element lists first on a tie', () => {
    const f = (elements: string[]): Finding => ({ rule: 'r', severity: 'note', elements, message: '', basis: '' });
    expect([f(['a', 'b']), f(['a']), f([])].sort(compareFindings).map((x) => x.elements)).toEqual([[], ['a'], ['a', 'b']]);
  });

  it('drops a finding repeated by a reach drawn twice', () => {
    const plan = makePlan({ nodes: [...bucketNodes(), node.hardware('H1')], links: [...bucketLinks(), link.reach('r1', 'W1', 'H1'), link.reach('r2', 'W1', 'H1')] });
    expect(checkPlan(plan).findings.filter((f) => f.rule === 'surface-outside-zone')).toHaveLength(1);
  });
});

describe('checkPlan guards against impossible figures', () => {
  it('turns NaN and infinities into nulls with figure-invalid blockers', () => {
    const broken = withNetwork((n) => ({
      ...n,
      jumpers: n.jumpers.map((j) => (j.link === 'jB' ? { ...j, ohms: NaN, dutyKa: Infinity } : j)),
      contacts: n.contacts.map((c) => (c.surface === 'C' ? { ...c, touchVolts: -Infinity, bodyAmps: NaN } : c)),
    }));
    expect(checkPlan(bucketPlan()).findings.filter((f) => f.rule === 'figure-invalid')).toEqual([]);
    const report = checkPlan(bucketPlan(), broken);
    const json = JSON.parse(JSON.stringify(report));
    expect(json).toEqual(report);
    expect(report.jumpers.find((j) => j.link === 'jB')).toMatchObject({ ohms: null, dutyKa: null });
    expect(report.contacts.find((c) => c.surface === 'C')).toMatchObject({ touchVolts: null, bodyAmps: null });
    expect(report.findings.filter((f) => f.rule === 'figure-invalid').map((f) => f.elements)).toEqual([['W1', 'C'], ['jB']]);
    expect(report.ok).toBe(false);
  });

  it('reports fault figures it could not compute', () => {
    const broken: CalcEntryPoints = { ...calc, tolerableBodyAmps: () => Infinity };
    const report = checkPlan(bucketPlan(), broken);
    expect(report.tolerableBodyAmps).toBeNull();
    expect(report.findings.filter((f) => f.rule === 'figure-invalid').map((f) => f.elements)).toEqual([[]]);
  });

  it('turns a calculation that throws into a calc-failed blocker, not an exception', () => {
    const throwing: CalcEntryPoints = { ...calc, analyseNetwork: () => { throw new Error('matrix is singular'); } };
    const report = checkPlan(bucketPlan(), throwing);
    expect(report.findings.find((f) => f.rule === 'calc-failed')?.message).toContain('matrix is singular');
    expect(report.contacts).toEqual([]);
    expect(report.ok).toBe(false);
    expect(report.fault.durationS).toBeCloseTo(0.25, 12);
  });

  it('blocks a contact the network left floating inside a grounded zone (contact-unsolved)', () => {
    const floating = withNetwork((n) => ({ ...n, contacts: n.contacts.map((c) => (c.surface === 'B' ? { ...c, status: 'floating' as const } : c)) }));
    const report = checkPlan(bucketPlan(), floating);
    expect(report.findings.filter((f) => f.rule === 'contact-unsolved').map((f) => [f.severity, f.elements])).toEqual([['blocker', ['W1', 'B']]]);
    expect(report.contacts.find((c) => c.surface === 'B')).toMatchObject({ touchVolts: null, bodyAmps: null, status: 'floating' });
  });

  it('leaves contact-unsolved out where another blocker already explains the floating side', () => {
    const plan = makePlan({ nodes: bucketNodes(), links: bucketLinks().filter((l) => l.id !== 'jN') });
    const report = checkPlan(plan);
    expect(report.contacts.every((c) => c.status === 'floating')).toBe(true);
    expect(report.findings.filter((f) => f.rule === 'contact-unsolved')).toEqual([]);
    expect(report.findings.map((f) => f.rule)).toContain('zone-ungrounded');
  });
});

describe('CAUTION', () => {
  it.each([/planning aid/, /employer's procedures/, /local codes/, /qualified person/, /absence of voltage/, /approved detector/, /energized until it is grounded/])(
    'says %s',
    (phrase) => expect(CAUTION).toMatch(phrase),
  );
});

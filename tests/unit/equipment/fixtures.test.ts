/**
 * Plans that use grounding sets (fixtures/equipment) checked against fixtures/equipment/inventory.csv
 * on a fixed day: each expected finding appears and no other blocker or warning does.
 */
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkPlan } from '@/lib/domain/checker';
import { inventoryFromCsv } from '@/lib/schemas/equipment-csv';
import { parsePlan, type PlanDocument } from '@/lib/schemas/plan';

const dir = join(__dirname, '../../../fixtures/equipment');
const TODAY = '2026-06-15';
type Expected = { rule: string; severity: string; elements: string[] }[];
const expected = JSON.parse(readFileSync(join(dir, 'expected.json'), 'utf8')) as Record<string, Expected>;
const files = readdirSync(dir).filter((f) => f.endsWith('.json') && f !== 'expected.json').sort();
const read = inventoryFromCsv(readFileSync(join(dir, 'inventory.csv'), 'utf8'));
if (!read.ok) throw new Error(JSON.stringify(read.issues));
const inventory = read.sets;
const load = (file: string): PlanDocument => {
  const parsed = parsePlan(JSON.parse(readFileSync(join(dir, file), 'utf8')));
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return parsed.plan;
};
const key = (f: { rule: string; severity: string; elements: string[] }) => `${f.severity} ${f.rule} ${f.elements.join(',')}`;

describe.each(files)('%s', (file) => {
  it('gives exactly the expected blockers and warnings', () => {
    const report = checkPlan(load(file), undefined, { inventory, today: TODAY });
    const serious = report.findings.filter((f) => f.severity !== 'note').map(key).sort();
    expect(serious).toEqual((expected[file] ?? []).map(key).sort());
  });
});

describe('set rules', () => {
  it('every set rule has a fixture that raises it', () => {
    const rules = new Set(Object.values(expected).flatMap((list) => list.map((e) => e.rule)));
    for (const rule of ['set-unknown', 'set-not-in-service', 'set-test-overdue', 'set-differs', 'set-used-twice']) expect(rules).toContain(rule);
  });

  it('makes an overdue test a blocker at submit and in the field, a warning in a draft', () => {
    const plan = load('set-test-overdue.json');
    const severity = (stage: 'draft' | 'submit' | 'field') => checkPlan(plan, undefined, { inventory, today: TODAY, stage }).findings.find((f) => f.rule === 'set-test-overdue')?.severity;
    expect(severity('draft')).toBe('warning');
    expect(severity('submit')).toBe('blocker');
    expect(severity('field')).toBe('blocker');
    // The day of the due date itself is not overdue yet.
    expect(checkPlan(plan, undefined, { inventory, today: '2026-05-01', stage: 'submit' }).findings.some((f) => f.rule === 'set-test-overdue')).toBe(false);
  });

  it("rates a jumper by its set's own figures", () => {
    const plan = load('set-differs.json');
    const without = checkPlan(plan);
    const withSets = checkPlan(plan, undefined, { inventory, today: TODAY });
    // Drawn with 27 kA clamps the jumper passes; its set's record says 5 kA, so it does not.
    expect(without.findings.some((f) => f.rule === 'clamp-underrated')).toBe(false);
    expect(withSets.jumpers.find((j) => j.link === 'jA')?.clampRatingKa).toBeLessThan(without.jumpers.find((j) => j.link === 'jA')?.clampRatingKa ?? 0);
    // Set LV-207 is 4/0 and 6 m: the longer, larger cable changes the jumper's resistance.
    expect(withSets.jumpers.find((j) => j.link === 'jB')?.resistanceOhms).not.toBeCloseTo(without.jumpers.find((j) => j.link === 'jB')?.resistanceOhms ?? 0, 6);
  });

  it('lists the sets used with status and due date', () => {
    const report = checkPlan(load('set-not-in-service.json'), undefined, { inventory, today: TODAY });
    expect(report.sets?.find((s) => s.tag === 'LV-206')).toEqual({ tag: 'LV-206', jumpers: ['jA'], known: true, status: 'out-of-service', lastTestedOn: '2025-09-01', testDueOn: '2026-09-01', due: 'ok' });
    expect(checkPlan(load('set-unknown.json'), undefined, { inventory, today: TODAY }).sets?.[0]).toMatchObject({ tag: 'LV-999', known: false, status: null });
  });

  it('runs no set rule and lists no sets without an inventory', () => {
    const report = checkPlan(load('set-unknown.json'));
    expect(report.findings.some((f) => f.rule.startsWith('set-'))).toBe(false);
    expect(report.sets).toBeUndefined();
  });
});

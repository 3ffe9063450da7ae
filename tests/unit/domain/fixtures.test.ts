/**
 * Every named plan in fixtures/plans against fixtures/plans/expected.json: each listed finding must
 * appear, and no other blocker or warning may (notes may, unless listed).
 */
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkPlan } from '@/lib/domain/checker';
import { parsePlan } from '@/lib/schemas/plan';

const dir = join(__dirname, '../../../fixtures/plans');
type Expected = { rule: string; severity?: string; elements: string[] }[];
const expected = JSON.parse(readFileSync(join(dir, 'expected.json'), 'utf8')) as Record<string, Expected>;
const files = readdirSync(dir).filter((f) => f.endsWith('.json') && f !== 'expected.json').sort();

describe('fixtures/plans', () => {
  it('has at least 22 plans, each with an expected entry and no stale entries', () => {
    expect(files.length).toBeGreaterThanOrEqual(22);
    expect(Object.keys(expected).sort()).toEqual(files);
  });

  it('names a clean case and a failing case for the required rules', () => {
    const rules = new Set(Object.values(expected).flatMap((list) => list.map((e) => e.rule)));
    for (const rule of ['stand-not-conductive', 'surface-outside-zone', 'phase-ungrounded', 'zone-ungrounded', 'pole-ground-relied', 'cable-below-minimum', 'cable-underrated', 'clamp-underrated', 'body-current-exceeds', 'lead-slack', 'rod-barricade']) {
      expect(rules, rule).toContain(rule);
    }
    expect(Object.values(expected).filter((list) => list.length === 0).length).toBeGreaterThanOrEqual(5);
  });
});

describe.each(files)('%s', (file) => {
  const input = JSON.parse(readFileSync(join(dir, file), 'utf8'));
  const parsed = parsePlan(input);

  it('is a valid plan document', () => {
    expect(parsed.ok ? [] : parsed.issues).toEqual([]);
  });

  it('gives exactly the expected blockers and warnings', () => {
    if (!parsed.ok) throw new Error('invalid fixture');
    const report = checkPlan(parsed.plan);
    const want = expected[file] ?? [];
    const key = (f: { rule: string; elements: string[] }) => `${f.rule} ${f.elements.join(',')}`;
    for (const e of want) {
      const hit = report.findings.find((f) => key(f) === key(e));
      expect(hit, `missing ${key(e)}`).toBeDefined();
      if (e.severity) expect(hit?.severity, key(e)).toBe(e.severity);
    }
    const serious = report.findings.filter((f) => f.severity !== 'note').map(key).sort();
    expect(serious).toEqual(want.filter((e) => e.severity !== 'note').map(key).sort());
    expect(report.ok).toBe(!want.some((e) => (e.severity ?? 'blocker') === 'blocker'));
  });
});

describe('seventy-kg-criteria.json under 50 kg criteria', () => {
  it('fails the 50 kg limit it passes at 70 kg (IEEE Std 80: 0.164 A vs 0.222 A at 0.5 s)', () => {
    const input = JSON.parse(readFileSync(join(dir, 'seventy-kg-criteria.json'), 'utf8'));
    const at = (bodyKg: number) => {
      const parsed = parsePlan({ ...input, criteria: { ...input.criteria, bodyKg } });
      if (!parsed.ok) throw new Error('invalid');
      return checkPlan(parsed.plan);
    };
    const heavy = at(70);
    const light = at(50);
    expect(heavy.contacts[0].bodyAmps).toBeCloseTo(0.19, 2);
    expect(heavy.contacts[0].limitAmps).toBeCloseTo(0.222, 3);
    expect(light.contacts[0].limitAmps).toBeCloseTo(0.164, 3);
    expect(light.findings.filter((f) => f.rule === 'body-current-exceeds').map((f) => f.elements)).toEqual([['W1', 'AW']]);
  });
});

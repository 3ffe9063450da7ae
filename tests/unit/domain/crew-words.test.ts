import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cableRating } from '@/lib/domain/calc/index';
import { checkPlan } from '@/lib/domain/checker';
import { RULE_IDS } from '@/lib/domain/rules/index';
import { inventoryFromCsv } from '@/lib/schemas/equipment-csv';
import { parsePlan } from '@/lib/schemas/plan';

const dir = join(__dirname, '../../../fixtures/plans');
const plans = readdirSync(dir).filter((f) => f.endsWith('.json')).map((f) => JSON.parse(readFileSync(join(dir, f), 'utf8')) as unknown);

describe('words a crew reads', () => {
  it('no basis or sentence tells a crew about "secondhand copies" (provenance stays in the code and README)', () => {
    let seen = 0;
    for (const raw of plans) {
      const parsed = parsePlan((raw as { plan?: unknown }).plan ?? raw);
      if (!parsed.ok) continue;
      for (const f of checkPlan(parsed.plan).findings) {
        seen += 1;
        expect(`${f.message} ${f.basis}`).not.toMatch(/secondhand|verify\)/i);
      }
    }
    expect(seen).toBeGreaterThan(0);
    for (const cable of ['4', '2/0', '4/0'] as const) expect(cableRating(cable, 0.25, 60).basis).not.toMatch(/secondhand/i);
  });
});

describe('no field names or rule ids in a finding', () => {
  const equipmentDir = join(__dirname, '../../../fixtures/equipment');
  const read = inventoryFromCsv(readFileSync(join(equipmentDir, 'inventory.csv'), 'utf8'));
  const equipmentPlans = readdirSync(equipmentDir).filter((f) => f.endsWith('.json') && f !== 'expected.json').map((f) => JSON.parse(readFileSync(join(equipmentDir, f), 'utf8')) as unknown);
  const all = [...plans, ...equipmentPlans];
  // Every camelCase key a plan document uses (groundOhms, standsOn, clampKa, …) is a field name.
  const keys = new Set<string>();
  const walk = (value: unknown): void => {
    if (Array.isArray(value)) value.forEach(walk);
    else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) { keys.add(k); walk(v); }
  };
  all.forEach(walk);
  const fieldNames = [...keys].filter((k) => /[a-z][A-Z]/.test(k));
  // The same plans with the values the check may assume left out, so every assumption note shows.
  const OPTIONAL = ['groundOhms', 'clampCycles'];
  const stripped = (raw: unknown): unknown => JSON.parse(JSON.stringify(raw, (k, v: unknown) => (OPTIONAL.includes(k) ? undefined : v)));

  it('every fixture plan (and the equipment fixtures, and both without optional values) gives sentences in plain words', () => {
    expect(fieldNames).toEqual(expect.arrayContaining(['groundOhms', 'standsOn', 'clampKa', 'lengthM', 'faultKa', 'insulatedBoom', 'equipmentId']));
    const inventory = read.ok ? read.sets : [];
    const rules = new Set<string>();
    for (const raw of [...all, ...all.map(stripped)]) {
      const parsed = parsePlan(raw);
      if (!parsed.ok) continue;
      for (const f of checkPlan(parsed.plan, undefined, { inventory, today: '2026-06-15' }).findings) {
        rules.add(f.rule);
        for (const word of [...fieldNames, ...RULE_IDS, 'out-of-service']) expect(f.message, f.rule).not.toMatch(new RegExp(`(^|[^\\w-])${word}($|[^\\w-])`));
      }
    }
    expect(rules).toContain('default-assumed');
    expect(rules).toContain('set-not-in-service');
  });
});

import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cableRating } from '../../../src/lib/domain/calc/index';
import { checkPlan } from '../../../src/lib/domain/checker';
import { parsePlan } from '../../../src/lib/schemas/plan';

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

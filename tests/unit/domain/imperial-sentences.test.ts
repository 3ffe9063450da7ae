/**
 * A crew in feet reads no metric unit in a finding's sentence: the rules that give a slack, a
 * force, a rod's size or a set's length say them in feet, inches and pounds-force per foot.
 * Conversions: 1 ft = 0.3048 m, 1 in = 25.4 mm, 1 lbf = 4.4482216152605 N (NIST SP 811, exact by definition).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkPlan } from '@/lib/domain/checker';
import { formatShortLength } from '@/lib/domain/units';
import { inventoryFromCsv } from '@/lib/schemas/equipment-csv';
import { parsePlan } from '@/lib/schemas/plan';
import { bucketLinks, bucketNodes, bucketPlan, link, makePlan, node, patchElement } from '../../helpers/plan-factory';

const METRIC = /\d m\b|\d mm\b|N\/m/;
const messages = (plan: Parameters<typeof checkPlan>[0], rule: string, options: Parameters<typeof checkPlan>[2] = {}) =>
  checkPlan(plan, undefined, { ...options, units: 'imperial' }).findings.filter((f) => f.rule === rule).map((f) => f.message);

describe('findings in feet', () => {
  it('lead-whip gives the slack in feet and inches and the force in lbf/ft', () => {
    const found = [...messages(bucketPlan(), 'lead-whip'), ...messages(makePlan({ nodes: bucketNodes(), links: patchElement(bucketLinks(), 'jA', { lengthM: 3, spanM: 1 }) }), 'lead-whip')];
    expect(found.length).toBeGreaterThanOrEqual(2);
    for (const m of found) {
      expect(m).toMatch(/\d+(\.\d)? lbf\/ft/);
      expect(m).not.toMatch(METRIC);
    }
    // 2 m of slack is 6 ft 7 in (78.74 in).
    expect(found.join(' ')).toContain('has 6 ft 7 in of slack');
  });

  it('rod-out-of-range gives a short rod in inches and its diameter in inches', () => {
    const plan = makePlan({ nodes: [...bucketNodes(), node.rod('R1', { lengthM: 0.02, diameterMm: 100 })], links: [...bucketLinks(), link.jumper('jR', 'CB', 'R1')] });
    const [m] = messages(plan, 'rod-out-of-range');
    // 20 mm = 0.787 in; 100 mm = 3.937 in; 20 radii of 50 mm = 1 m = 3 ft 3 in.
    expect(m).toContain('is 0.787 in long and 3.937 in across');
    expect(m).toContain('(3 ft 3 in here)');
    expect(m).not.toMatch(METRIC);
  });

  it('set-differs gives the drawn and recorded lengths in feet and inches', () => {
    const dir = join(__dirname, '../../../fixtures/equipment');
    const read = inventoryFromCsv(readFileSync(join(dir, 'inventory.csv'), 'utf8'));
    const parsed = parsePlan(JSON.parse(readFileSync(join(dir, 'set-differs.json'), 'utf8')));
    if (!read.ok || !parsed.ok) throw new Error('fixture');
    const found = messages(parsed.plan, 'set-differs', { inventory: read.sets, today: '2026-06-15' });
    expect(found.some((m) => /length \d+ ft \d+ in \(set: \d+ ft \d+ in\)/.test(m))).toBe(true);
    for (const m of found) expect(m).not.toMatch(METRIC);
  });

  it('keeps the metric wording for a crew in metres', () => {
    expect(formatShortLength(0.02)).toBe('20 mm');
    expect(formatShortLength(0.02, 'imperial')).toBe('0.787 in');
    expect(formatShortLength(1.2, 'imperial')).toBe('3 ft 11 in');
    expect(checkPlan(bucketPlan()).findings.filter((f) => f.rule === 'lead-whip').map((f) => f.message).join(' ')).toMatch(/\d N\/m/);
  });
});

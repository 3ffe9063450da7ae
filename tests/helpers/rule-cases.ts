/**
 * The table-driven harness for rule tests: each case is a plan where the rule fires with exact
 * elements and severity, and a corrected plan where it stays quiet.
 */
import { describe, expect, it } from 'vitest';
import { checkPlan } from '@/lib/domain/checker';
import type { PlanDocument } from '@/lib/schemas/plan';

export interface RuleCase {
  rule: string;
  severity: 'blocker' | 'warning' | 'note';
  fires: () => PlanDocument;
  elements: string[][];
  clean: () => PlanDocument;
}

export function describeRuleCases(cases: RuleCase[]): void {
  describe.each(cases)('rule $rule', ({ rule, severity, fires, elements, clean }) => {
    it(`fires as a ${severity} with exactly ${JSON.stringify(elements)}`, () => {
      const found = checkPlan(fires()).findings.filter((f) => f.rule === rule);
      expect(found.map((f) => f.elements)).toEqual(elements);
      expect(found.map((f) => f.severity)).toEqual(elements.map(() => severity));
      for (const f of found) {
        expect(f.message).toMatch(/\.$/);
        expect(f.basis.length).toBeGreaterThan(5);
      }
    });
    it('stays quiet on the corrected plan', () => {
      expect(checkPlan(clean()).findings.filter((f) => f.rule === rule)).toEqual([]);
    });
  });
}

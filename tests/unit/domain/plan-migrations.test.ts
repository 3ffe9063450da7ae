/**
 * Stored documents are migrated on load. Version 1 is current, so the real registry is empty and
 * the walk is tested with a registry of made-up steps; a document stored by the first version of
 * the app (before the checker's second round and its optional fields) still loads unchanged.
 */
import { describe, expect, it } from 'vitest';
import { migratePlan, PLAN_STEPS, PlanVersionError, type PlanStep } from '@/lib/domain/plan-migrations';
import { checkPlan } from '@/lib/domain/checker';
import { PLAN_VERSION, planSchema } from '@/lib/schemas/plan';
import firstRound from './stored-plan-v1-first-round.json';

describe('migratePlan', () => {
  it('has a step for every version below the current one', () => {
    for (let v = 1; v < PLAN_VERSION; v += 1) expect(typeof PLAN_STEPS[v], `step from version ${v}`).toBe('function');
    expect(Object.keys(PLAN_STEPS).map(Number).every((v) => v >= 1 && v < PLAN_VERSION)).toBe(true);
  });

  it('leaves a current document as it is', () => {
    expect(migratePlan(firstRound)).toEqual(firstRound);
  });

  it('loads a document stored before the second checker round, and it still checks clean', () => {
    const plan = planSchema.parse(migratePlan(structuredClone(firstRound)));
    expect(plan.title).toBe(firstRound.title);
    expect(checkPlan(plan).summary.blockers).toBe(0);
  });

  it('walks every step in order, each raising the version by one', () => {
    const seen: number[] = [];
    const steps: Record<number, PlanStep> = {
      1: (d) => (seen.push(d.version as number), { ...d, renamed: d.old, old: undefined }),
      2: (d) => (seen.push(d.version as number), { ...d, added: 'default' }),
    };
    const out = migratePlan({ format: 'bondmap-plan', version: 1, old: 'kept' }, steps, 3);
    expect(seen).toEqual([1, 2]);
    expect(out).toMatchObject({ version: 3, renamed: 'kept', added: 'default' });
    expect(migratePlan({ format: 'bondmap-plan', version: 2 }, steps, 3)).toMatchObject({ version: 3, added: 'default' });
  });

  it('refuses what it cannot bring up to date, never guessing', () => {
    expect(() => migratePlan(null)).toThrow(PlanVersionError);
    expect(() => migratePlan([])).toThrow(PlanVersionError);
    expect(() => migratePlan({ format: 'other', version: 1 })).toThrow(/format/);
    expect(() => migratePlan({ format: 'bondmap-plan' })).toThrow(/version undefined/);
    expect(() => migratePlan({ format: 'bondmap-plan', version: 1.5 })).toThrow(PlanVersionError);
    expect(() => migratePlan({ format: 'bondmap-plan', version: PLAN_VERSION + 1 })).toThrow(/newer/);
    expect(() => migratePlan({ format: 'bondmap-plan', version: 1 }, {}, 2)).toThrow(/no step/);
  });
});

/** The practice demo's plans are clear and each of its exercises plants the gap it is meant to. */
import { describe, expect, it } from 'vitest';
import { checkPlan } from '@/lib/domain/checker';
import { prepareExercise } from '@/lib/domain/practice';
import { DEMO_EXERCISES, DEMO_PRACTICE_PLANS } from '@db/seeders/demo-practice';
import { DEMO_PLANS } from '@db/seeders/demo-plans';

const all = [...DEMO_PLANS.filter((p) => p.status === 'approved').map((p) => p.document), ...DEMO_PRACTICE_PLANS];

describe('practice demo', () => {
  it.each(DEMO_PRACTICE_PLANS.map((p) => [p.title, p]))('%s is clear, as an approved plan must be', (_t, plan) => {
    expect(checkPlan(plan).summary.blockers).toBe(0);
  });
  it('five exercises, five different gaps, all three kinds', () => {
    const gaps = DEMO_EXERCISES.map((ex) => {
      const plan = all.find((p) => p.title === ex.plan)!;
      const built = prepareExercise(plan, ex.kind, ex.mods);
      if (!built.ok) throw new Error(`${ex.prompt}: ${built.reason}`);
      return built.exercise.gap;
    });
    expect(new Set(gaps).size).toBe(5);
    expect(new Set(DEMO_EXERCISES.map((e) => e.kind))).toEqual(new Set(['find', 'fix', 'numbers']));
  });
});

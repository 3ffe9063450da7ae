import { isGroundSource, isPoleGround } from '@/lib/domain/plan-model';
import { listOf } from './format';
import type { Finding, RuleContext } from './types';

export const PLAN_INCOMPLETE = 'plan-incomplete';

/**
 * Blocker when the plan lacks what a check needs: at least one phase conductor, a ground source
 * (neutral, shield wire, steel footing, a rod in range, or hardware with a resistance — not
 * remote earth, not a pole ground) and a worker with at least one reach line. Without them an
 * empty plan would pass. One finding says everything that is missing. No elements. Replaces the
 * note `no-worker` of earlier reports (docs/rules.md).
 */
export function checkPlanIncomplete(ctx: RuleContext): Finding[] {
  const { model } = ctx;
  const missing: string[] = [];
  if (model.nodesOf('phase').length === 0) missing.push('no phase conductor');
  if (!ctx.plan.nodes.some((n) => n.kind !== 'earth' && !isPoleGround(n) && isGroundSource(n))) {
    missing.push('no ground source (a neutral, shield wire, steel footing, driven rod, or ground wire with its resistance)');
  }
  if (!model.nodesOf('worker').some((w) => model.reachesOf(w.id).length > 0)) missing.push('no worker with a reach line');
  if (missing.length === 0) return [];
  return [
    {
      rule: PLAN_INCOMPLETE,
      severity: 'blocker',
      elements: [],
      message: `The plan cannot be checked: it has ${listOf(missing)}; add them before the plan is submitted.`,
      basis: 'Bondmap checker: a plan is checkable only with a phase, a ground source and a worker who can touch something (OSHA 29 CFR 1910.269(n)(3))',
    },
  ];
}

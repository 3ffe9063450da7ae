import { capitalise } from '@/lib/domain/plan-model';
import { listOf } from './format';
import type { Finding, RuleContext } from './types';

export const POLE_GROUND_RELIED = 'pole-ground-relied';

/**
 * Blocker for each zone whose phases, standing nodes or reached surfaces reach ground only through
 * a pole's existing ground wire, which may be broken, undersized or disconnected (common practice:
 * never rely on it; docs/plan-format.md). Elements: the zone's pole-ground nodes.
 */
export function checkPoleGroundRelied(ctx: RuleContext): Finding[] {
  const { model } = ctx;
  return ctx.zones.zones
    .filter((zone) => zone.groundedOnlyViaPoleGround && zone.poleGroundDependent.length > 0)
    .map((zone) => ({
      rule: POLE_GROUND_RELIED,
      severity: 'blocker' as const,
      elements: [...zone.poleGrounds],
      message:
        `${capitalise(listOf(zone.poleGroundDependent.map(model.nameOf)))} reach ground only through ${listOf(zone.poleGrounds.map(model.nameOf))}, which is never relied on; ` +
        'jumper the cluster bar straight to the neutral, a grounded footing or a temporary rod.',
      basis: 'common practice: never rely on a pole\'s existing ground wire',
    }));
}

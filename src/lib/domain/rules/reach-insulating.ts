import { capitalise, isNonBonding } from '@/lib/domain/plan-model';
import type { Finding, RuleContext } from './types';

export const REACH_INSULATING = 'reach-insulating';

/**
 * Note when a worker's reach goes to a wood, fiberglass or concrete pole or crossarm: it is not
 * counted as a conductive surface, but wet or contaminated wood can conduct and concrete holds
 * steel (common practice: do not treat it as insulation for personal protection). Elements:
 * worker, surface.
 */
export function checkReachInsulating(ctx: RuleContext): Finding[] {
  return ctx.model.linksOf('reach').flatMap((reach) => {
    const surface = ctx.model.node(reach.to);
    if (!surface || !isNonBonding(surface)) return [];
    return [
      {
        rule: REACH_INSULATING,
        severity: 'note' as const,
        elements: [reach.from, surface.id],
        message: `${capitalise(ctx.model.nameOf(reach.from))} can touch ${ctx.model.nameOf(surface.id)}; it is not counted as a conductor, but wet or dirty wood and fiberglass, and concrete with its steel, can carry current, so do not rely on it as insulation.`,
        basis: 'common practice',
      },
    ];
  });
}

import { capitalise, isNonBonding } from '@/lib/domain/plan-model';
import type { Finding, RuleContext } from './types';

export const STAND_NOT_CONDUCTIVE = 'stand-not-conductive';

/**
 * Blocker when a worker stands on wood, fiberglass or concrete: that is no bonding path, so the
 * worker's feet are at no defined potential (OSHA 29 CFR 1910.269(n)(3); docs/plan-format.md).
 * Elements: worker, footing.
 */
export function checkStandNotConductive(ctx: RuleContext): Finding[] {
  return ctx.model.nodesOf('worker').flatMap((worker) => {
    const footing = ctx.model.node(worker.standsOn);
    if (!footing || !isNonBonding(footing)) return [];
    const material = 'material' in footing ? footing.material : '';
    return [
      {
        rule: STAND_NOT_CONDUCTIVE,
        severity: 'blocker' as const,
        elements: [worker.id, footing.id],
        message:
          `${capitalise(ctx.model.nameOf(worker.id))} stands on ${ctx.model.nameOf(footing.id)}, which is ${material} and not a bonding path; ` +
          'stand on the cluster bar installed at your feet, or on a bonded bucket.',
        basis: 'OSHA 29 CFR 1910.269(n)(3); common practice (cluster bar at the feet)',
      },
    ];
  });
}

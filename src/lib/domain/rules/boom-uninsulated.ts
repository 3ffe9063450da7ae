import { boomPaths, capitalise, isBondingLink } from '@/lib/domain/plan-model';
import type { Finding, RuleContext } from './types';

export const BOOM_UNINSULATED = 'boom-uninsulated';

/**
 * Warning for a bucket on a boom that is not insulated (`insulatedBoom: false`): the boom puts
 * the truck at the bucket's potential, so the checker joins them (plan-model boomPaths).
 * - bucket bonded into the zone and truck with no jumper or bond of its own: the truck rises with
 *   the zone and carries fault current through its frame; elements: bucket, truck;
 * - the truck cannot be told (no `onTruck`, not exactly one truck): elements: the bucket.
 * Basis: common practice (bond the truck to the work-zone ground; keep ground workers off it or
 * on a bonded mat); OSHA 29 CFR 1910.269(n)(3).
 */
export function checkBoomUninsulated(ctx: RuleContext): Finding[] {
  const { model } = ctx;
  const linked = new Set<string>();
  for (const link of ctx.plan.links) {
    if (!isBondingLink(link) || model.isEarthLink(link)) continue;
    linked.add(link.from);
    linked.add(link.to);
  }
  const paths = new Map(boomPaths(ctx.plan).map((p) => [p.bucket, p.truck]));
  const basis = "common practice: bond the truck to the work-zone ground and keep ground workers off it or on a bonded mat; OSHA 29 CFR 1910.269(n)(3)";
  return model.nodesOf('bucket').flatMap((bucket): Finding[] => {
    if (bucket.insulatedBoom !== false) return [];
    const truck = paths.get(bucket.id);
    if (truck === undefined) {
      return [{
        rule: BOOM_UNINSULATED,
        severity: 'warning',
        elements: [bucket.id],
        message: `${capitalise(model.nameOf(bucket.id))} is on a boom that is not insulated, but the plan does not say which truck carries it; set its truck so the check can put the truck at the bucket's potential.`,
        basis,
      }];
    }
    if (!linked.has(bucket.id) || linked.has(truck)) return [];
    return [{
      rule: BOOM_UNINSULATED,
      severity: 'warning',
      elements: [bucket.id, truck],
      message:
        `${capitalise(model.nameOf(bucket.id))} is bonded into the zone on a boom that is not insulated, so ${model.nameOf(truck)} rises with the zone in a fault but has no jumper of its own; ` +
        'jumper the truck to the zone ground, and keep people on the ground off it or on a bonded mat.',
      basis,
    }];
  });
}

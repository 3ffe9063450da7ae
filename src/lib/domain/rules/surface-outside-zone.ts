import { capitalise, isConductive } from '@/lib/domain/plan-model';
import type { Finding, RuleContext } from './types';

export const SURFACE_OUTSIDE_ZONE = 'surface-outside-zone';

/**
 * Blocker when a worker can reach a conductive surface that is not bonded into the zone of what
 * the worker stands on: the equipotential zone of OSHA 29 CFR 1910.269(n)(3) is broken there.
 * A reach to another worker is a contact with what that worker stands on (passing a tool,
 * touching a person). Elements: worker, surface (or the other worker). Workers on non-bonding
 * material are left to stand-not-conductive, and reaches to it to reach-insulating.
 */
export function checkSurfaceOutsideZone(ctx: RuleContext): Finding[] {
  const { model, zones } = ctx;
  return model.nodesOf('worker').flatMap((worker) => {
    const footing = model.node(worker.standsOn);
    if (!footing || !isConductive(footing)) return [];
    return model.reachesOf(worker.id).flatMap((reach) => {
      const surface = model.node(model.reachTarget(reach));
      if (!surface || !isConductive(surface) || zones.sameZone(footing.id, surface.id)) return [];
      const other = reach.to !== surface.id;
      const what = other ? `${model.nameOf(reach.to)}, who stands on ${model.nameOf(surface.id)}` : model.nameOf(surface.id);
      const fix =
        other
          ? `bond ${model.nameOf(surface.id)} to ${model.nameOf(footing.id)}, or pass nothing between the two`
          : footing.kind === 'earth'
            ? `stand on a mat bonded to ${model.nameOf(surface.id)}, or stay out of reach of it`
            : `bond ${model.nameOf(surface.id)} to ${model.nameOf(footing.id)} with a jumper, or keep out of reach of it`;
      return [
        {
          rule: SURFACE_OUTSIDE_ZONE,
          severity: 'blocker' as const,
          elements: [worker.id, reach.to],
          message: `${capitalise(model.nameOf(worker.id))} can touch ${what}, which is not bonded to ${model.nameOf(footing.id)} where the worker stands; ${fix}.`,
          basis: 'OSHA 29 CFR 1910.269(n)(3)',
        },
      ];
    });
  });
}

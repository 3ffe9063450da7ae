import { capitalise, isConductive } from '../plan-model';
import type { Finding, RuleContext } from './types';

export const SURFACE_OUTSIDE_ZONE = 'surface-outside-zone';

/**
 * Blocker when a worker can reach a conductive surface that is not bonded into the zone of what
 * the worker stands on: the equipotential zone of OSHA 29 CFR 1910.269(n)(3) is broken there.
 * Elements: worker, surface. Workers on wood or fiberglass are left to stand-not-conductive, and
 * reaches to insulating material to reach-insulating.
 */
export function checkSurfaceOutsideZone(ctx: RuleContext): Finding[] {
  const { model, zones } = ctx;
  return model.nodesOf('worker').flatMap((worker) => {
    const footing = model.node(worker.standsOn);
    if (!footing || !isConductive(footing)) return [];
    return model.reachesOf(worker.id).flatMap((reach) => {
      const surface = model.node(reach.to);
      if (!surface || !isConductive(surface) || zones.sameZone(footing.id, surface.id)) return [];
      const fix =
        footing.kind === 'earth'
          ? `stand on a mat bonded to ${model.nameOf(surface.id)}, or stay out of reach of it`
          : `bond ${model.nameOf(surface.id)} to ${model.nameOf(footing.id)} with a jumper, or keep out of reach of it`;
      return [
        {
          rule: SURFACE_OUTSIDE_ZONE,
          severity: 'blocker' as const,
          elements: [worker.id, surface.id],
          message: `${capitalise(model.nameOf(worker.id))} can touch ${model.nameOf(surface.id)}, which is not bonded to ${model.nameOf(footing.id)} where the worker stands; ${fix}.`,
          basis: 'OSHA 29 CFR 1910.269(n)(3)',
        },
      ];
    });
  });
}

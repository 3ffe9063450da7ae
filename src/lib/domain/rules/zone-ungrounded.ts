import { isConductive } from '@/lib/domain/plan-model';
import type { Finding, RuleContext } from './types';

export const ZONE_UNGROUNDED = 'zone-ungrounded';

/**
 * Blocker when the zone a worker stands in has no ground source at all (no neutral, shield wire,
 * rod or grounded footing; remote earth counts only for a worker standing on it, and no pole ground standing in for one, which pole-ground-relied
 * reports): a fault would find no path to clear through (OSHA 29 CFR 1910.269(n)(4)(i)).
 * Elements: worker, the node the worker stands on.
 */
export function checkZoneUngrounded(ctx: RuleContext): Finding[] {
  const { model, zones } = ctx;
  return model.nodesOf('worker').flatMap((worker) => {
    const footing = model.node(worker.standsOn);
    if (!footing || !isConductive(footing)) return [];
    const zoneIndex = zones.zoneIndexOf(footing.id);
    const zone = zoneIndex === undefined ? undefined : zones.zones[zoneIndex];
    if (!zone || zone.grounded || zone.groundedOnlyViaPoleGround) return [];
    return [
      {
        rule: ZONE_UNGROUNDED,
        severity: 'blocker' as const,
        elements: [worker.id, footing.id],
        message:
          `The zone ${model.nameOf(worker.id)} stands in (${model.nameOf(footing.id)}) has no connection to the neutral, a shield wire, a rod or a grounded footing; ` +
          'jumper the cluster bar to the neutral or to a grounded footing before work starts.',
        basis: 'OSHA 29 CFR 1910.269(n)(3) and (n)(4)(i)',
      },
    ];
  });
}

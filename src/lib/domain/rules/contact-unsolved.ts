import { isConductive } from '@/lib/domain/plan-model';
import type { Finding, RuleContext } from './types';

export const CONTACT_UNSOLVED = 'contact-unsolved';

/**
 * Blocker when the current through a worker at a reach contact could not be computed because the
 * standing node or the surface has no path to remote earth, and no other blocker already explains
 * why: without the figure the contact cannot be shown safe (OSHA 29 CFR 1910.269(n)(3)).
 * Elements: worker, surface.
 */
export function checkContactUnsolved(ctx: RuleContext): Finding[] {
  const { model, zones } = ctx;
  return ctx.network.contacts.flatMap((contact) => {
    if (contact.status !== 'floating') return [];
    const worker = model.node(contact.worker);
    const footing = worker?.kind === 'worker' ? model.node(worker.standsOn) : undefined;
    const target = model.node(contact.surface);
    const surface = target?.kind === 'worker' ? model.node(target.standsOn) : target;
    if (!footing || !surface || !isConductive(footing) || !isConductive(surface)) return [];
    if (!zones.sameZone(footing.id, surface.id)) return [];
    const zoneIndex = zones.zoneIndexOf(footing.id);
    if (zoneIndex === undefined || !zones.zones[zoneIndex].grounded) return [];
    return [
      {
        rule: CONTACT_UNSOLVED,
        severity: 'blocker' as const,
        elements: [contact.worker, contact.surface],
        message:
          `The current through ${model.nameOf(contact.worker)} touching ${model.nameOf(contact.surface)} could not be worked out because part of the circuit has no path to earth; ` +
          'give every ground source a ground resistance and connect it to the cluster bar.',
        basis: 'OSHA 29 CFR 1910.269(n)(3)',
      },
    ];
  });
}

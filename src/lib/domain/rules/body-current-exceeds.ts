import { amps, factor, formatKiloamps, seconds, volts } from './format';
import { bodyKgOf, type Finding, type RuleContext } from './types';

export const BODY_CURRENT_EXCEEDS = 'body-current-exceeds';

/**
 * Blocker when the worst-case current through a worker at a reach contact exceeds the Dalziel
 * tolerable body current for the clearing time (IEEE Std 80; OSHA 29 CFR 1910.269(n)(3)). The
 * message names the injected current (Df × If) and says when the line-to-neutral voltage limited
 * the contact's voltage. Elements: worker, surface.
 */
export function checkBodyCurrentExceeds(ctx: RuleContext): Finding[] {
  const kg = bodyKgOf(ctx.plan);
  return ctx.network.contacts.flatMap((contact) => {
    const { bodyAmps, limitAmps, touchVolts } = contact;
    const capped = contact.systemVoltageLimited ? `, limited to the ${volts(touchVolts)} line-to-neutral voltage of the system,` : '';
    if (contact.status !== 'solved' || !Number.isFinite(bodyAmps) || !Number.isFinite(limitAmps) || bodyAmps <= limitAmps) return [];
    return [
      {
        rule: BODY_CURRENT_EXCEEDS,
        severity: 'blocker' as const,
        elements: [contact.worker, contact.surface],
        message:
          `If the line were re-energized with ${formatKiloamps(ctx.fault.injectedKa)} (decrement factor ${factor(ctx.fault.decrementFactor)}), ${ctx.model.nameOf(contact.worker)} touching ${ctx.model.nameOf(contact.surface)} would see ${volts(touchVolts)}${capped} and carry ${amps(bodyAmps)}, ` +
          `above the ${amps(limitAmps)} a ${kg} kg person tolerates for ${seconds(ctx.fault.durationS)}; ` +
          'install the grounds at the work location so the worker is inside them, with shorter, heavier leads to one cluster bar.',
        basis: `IEEE Std 80 (Dalziel, ${kg} kg)`,
      },
    ];
  });
}

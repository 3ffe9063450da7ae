import { CABLE_SIZES, type CableSize } from '@/lib/schemas/plan';
import { capitalise } from '@/lib/domain/plan-model';
import { BELOW_MINIMUM_CABLES } from './cable-below-minimum';
import { cableName, formatKiloamps, seconds } from './format';
import type { Finding, RuleContext } from './types';

export const CABLE_UNDERRATED = 'cable-underrated';

/** Smallest allowed cable whose rating for this plan covers the duty, or null when none does. */
function smallestSufficient(ctx: RuleContext, dutyKa: number): CableSize | null {
  for (const size of CABLE_SIZES) {
    if (BELOW_MINIMUM_CABLES.has(size)) continue;
    const rating = ctx.cableRatingKa(size);
    if (Number.isFinite(rating) && rating >= dutyKa) return size;
  }
  return null;
}

/**
 * Blocker when a jumper cable's rating for the clearing time is below the fault duty it must carry
 * (OSHA 29 CFR 1910.269(n)(4)(i); ratings from the ASTM F855 grade table, secondhand copy, verify).
 * Cables below the minimum are left to cable-below-minimum. Elements: the jumper.
 */
export function checkCableUnderrated(ctx: RuleContext): Finding[] {
  return ctx.network.jumpers.flatMap((figures) => {
    const jumper = ctx.model.link(figures.link);
    if (!jumper || jumper.kind !== 'jumper' || BELOW_MINIMUM_CABLES.has(jumper.cable)) return [];
    const { dutyKa, cableRatingKa } = figures;
    if (!Number.isFinite(dutyKa) || !Number.isFinite(cableRatingKa) || dutyKa <= cableRatingKa) return [];
    const better = smallestSufficient(ctx, dutyKa);
    const fix = better ? `use ${cableName(better)} or larger` : 'no single cable size in the table covers it: ask a qualified person how to ground this location';
    return [
      {
        rule: CABLE_UNDERRATED,
        severity: 'blocker' as const,
        elements: [jumper.id],
        message:
          `${capitalise(ctx.model.nameOf(jumper.id))} (${cableName(jumper.cable)}) is rated ${formatKiloamps(cableRatingKa)} for ${seconds(ctx.fault.durationS)} ` +
          `but must carry ${formatKiloamps(dutyKa)}; ${fix}.`,
        basis: 'OSHA 29 CFR 1910.269(n)(4)(i); ASTM F855 grade table',
      },
    ];
  });
}

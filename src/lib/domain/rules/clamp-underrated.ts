import { formatKiloamps, seconds } from './format';
import type { Finding, RuleContext } from './types';

export const CLAMP_UNDERRATED = 'clamp-underrated';

/**
 * Blocker when a jumper's clamps, rated by I²t at the clearing time, are below the fault duty: an
 * assembly is only as strong as its weakest part (OSHA 29 CFR 1910.269(n)(4)(i); ASTM F855 scope).
 * Elements: the jumper.
 */
export function checkClampUnderrated(ctx: RuleContext): Finding[] {
  return ctx.network.jumpers.flatMap((figures) => {
    const { dutyKa, clampRatingKa } = figures;
    if (clampRatingKa === null || !Number.isFinite(clampRatingKa) || !Number.isFinite(dutyKa) || dutyKa <= clampRatingKa) return [];
    return [
      {
        rule: CLAMP_UNDERRATED,
        severity: 'blocker' as const,
        elements: [figures.link],
        message:
          `The clamps of ${ctx.model.nameOf(figures.link)} are good for ${formatKiloamps(clampRatingKa)} over ${seconds(ctx.fault.durationS)} ` +
          `but the fault duty is ${formatKiloamps(dutyKa)}; use clamps rated for at least that.`,
        basis: 'OSHA 29 CFR 1910.269(n)(4)(i); an assembly is rated by its weakest part (ASTM F855 scope)',
      },
    ];
  });
}

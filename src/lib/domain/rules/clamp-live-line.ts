import { capitalise } from '@/lib/domain/plan-model';
import type { Finding, RuleContext } from './types';

export const CLAMP_LIVE_LINE = 'clamp-live-line';

/**
 * Blocker for a grounding jumper fitted with a live-line (hot-line) clamp (`clampKind:
 * "live-line"`): such a clamp is made to carry a small current continuously and is neither rated
 * nor tested for fault current (common practice; ASTM F855 covers grounding clamps; OSHA 29 CFR
 * 1910.269(n)(4)(i)). Elements: the jumper.
 */
export function checkClampLiveLine(ctx: RuleContext): Finding[] {
  return ctx.model.linksOf('jumper').flatMap((jumper) =>
    jumper.clampKind !== 'live-line'
      ? []
      : [
          {
            rule: CLAMP_LIVE_LINE,
            severity: 'blocker' as const,
            elements: [jumper.id],
            message: `${capitalise(ctx.model.nameOf(jumper.id))} has a live-line clamp, which is made for a small continuous current and is not rated for fault current; use a grounding clamp rated for the fault.`,
            basis: 'OSHA 29 CFR 1910.269(n)(4)(i); grounding clamps are rated under ASTM F855, live-line clamps are not (common practice)',
          },
        ],
  );
}

import { capitalise } from '@/lib/domain/plan-model';
import { metres } from './format';
import type { Finding, RuleContext } from './types';

export const LEAD_SLACK = 'lead-slack';

/**
 * Allowance for a lead's length over the straight distance between its clamps: more than both
 * 25 % and 0.6 m over the span counts as slack (our own threshold, common practice: keep leads
 * short with no coiled slack, which whips under fault current and adds reactance).
 */
export const SLACK_RATIO = 1.25;
export const SLACK_MARGIN_M = 0.6;

/** Warning when a jumper is much longer than its span (common practice). Elements: the jumper. */
export function checkLeadSlack(ctx: RuleContext): Finding[] {
  return ctx.model.linksOf('jumper').flatMap((jumper) => {
    const { lengthM, spanM } = jumper;
    if (spanM === undefined || lengthM <= spanM * SLACK_RATIO || lengthM - spanM <= SLACK_MARGIN_M) return [];
    return [
      {
        rule: LEAD_SLACK,
        severity: 'warning' as const,
        elements: [jumper.id],
        message:
          `${capitalise(ctx.model.nameOf(jumper.id))} is ${metres(lengthM, ctx.units)} long for a ${metres(spanM, ctx.units)} span; use a shorter lead or route it straight, ` +
          'because coiled slack whips under fault current and adds reactance.',
        basis: 'common practice: keep leads short with no coiled slack',
      },
    ];
  });
}

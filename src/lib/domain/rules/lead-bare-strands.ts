import { BARE_STRANDS_OHMS } from '@/lib/domain/calc/cable';
import { capitalise } from '@/lib/domain/plan-model';
import { milliohms } from './format';
import type { Finding, RuleContext } from './types';

export const LEAD_BARE_STRANDS = 'lead-bare-strands';

/**
 * Warning for a jumper whose cable is stripped and put under an eye bolt or clamp without a
 * compression ferrule (`connection: "bare-strands"`): the strands corrode, break and add
 * resistance; the solve adds BARE_STRANDS_OHMS unless a measured `ohms` is given (common
 * practice; the value is our own assumption, docs/engineering.md §4). Elements: the jumper.
 */
export function checkLeadBareStrands(ctx: RuleContext): Finding[] {
  return ctx.model.linksOf('jumper').flatMap((jumper) =>
    jumper.connection !== 'bare-strands'
      ? []
      : [
          {
            rule: LEAD_BARE_STRANDS,
            severity: 'warning' as const,
            elements: [jumper.id],
            message:
              `${capitalise(ctx.model.nameOf(jumper.id))} has bare strands under its clamps, which corrode, break and add resistance` +
              `${jumper.ohms === undefined ? ` (the check adds ${milliohms(BARE_STRANDS_OHMS)})` : ''}; use a set with compression ferrules.`,
            basis: 'common practice: terminate grounding cable in a compression ferrule; added resistance is a Bondmap assumption',
          },
        ],
  );
}

import { capitalise } from '@/lib/domain/plan-model';
import { cableName } from './format';
import type { Finding, RuleContext } from './types';

export const CABLE_BELOW_MINIMUM = 'cable-below-minimum';

/** Cable sizes smaller than No. 2 AWG copper, the smallest the regulation allows for a protective ground. */
export const BELOW_MINIMUM_CABLES: ReadonlySet<string> = new Set(['4']);

/**
 * Blocker for a jumper smaller than No. 2 AWG copper (OSHA 29 CFR 1910.269(n)(4)(ii), from memory
 * with high confidence; docs/engineering.md §1). Elements: the jumper.
 */
export function checkCableBelowMinimum(ctx: RuleContext): Finding[] {
  return ctx.model
    .linksOf('jumper')
    .filter((jumper) => BELOW_MINIMUM_CABLES.has(jumper.cable))
    .map((jumper) => ({
      rule: CABLE_BELOW_MINIMUM,
      severity: 'blocker' as const,
      elements: [jumper.id],
      message: `${capitalise(ctx.model.nameOf(jumper.id))} is ${cableName(jumper.cable)} copper, smaller than the No. 2 AWG minimum; use a set of #2 or larger that is rated for the fault.`,
      basis: 'OSHA 29 CFR 1910.269(n)(4)(ii) (No. 2 AWG copper minimum; from memory, high confidence)',
    }));
}

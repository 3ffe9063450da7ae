import { capitalise } from '@/lib/domain/plan-model';
import { BOND_DEFAULT_OHMS } from '@/lib/domain/calc/network';
import { formatKiloamps, ohms } from './format';
import type { Finding, RuleContext } from './types';

export const BOND_FAULT_CURRENT = 'bond-fault-current';

/**
 * For every bond (not a span) the network solve puts fault current through (over 1 A): a note
 * with its current, or a warning when the bond has no `ohms`, since its resistance was then taken
 * as 0.0001 Ω and the current it draws may be overstated or the path misjudged (our own rule;
 * OSHA 29 CFR 1910.269(n)(4)(i)). Elements: the bond.
 */
export function checkBondFaultCurrent(ctx: RuleContext): Finding[] {
  return ctx.network.bonds.flatMap((bond) => {
    if (!Number.isFinite(bond.currentKa)) return [];
    const name = capitalise(ctx.model.nameOf(bond.link));
    return [
      bond.ohmsGiven
        ? {
            rule: BOND_FAULT_CURRENT,
            severity: 'note' as const,
            elements: [bond.link],
            message: `${name} carries up to ${formatKiloamps(bond.currentKa)} of fault current in the check; make sure it can, or add a rated jumper beside it.`,
            basis: 'OSHA 29 CFR 1910.269(n)(4)(i); Bondmap network solve',
          }
        : {
            rule: BOND_FAULT_CURRENT,
            severity: 'warning' as const,
            elements: [bond.link],
            message:
              `${name} carries up to ${formatKiloamps(bond.currentKa)} of fault current in the check, with its resistance taken as ${ohms(BOND_DEFAULT_OHMS)} because none was given; ` +
              'measure it and enter it, or add a rated jumper beside it.',
            basis: 'OSHA 29 CFR 1910.269(n)(4)(i); Bondmap plan format (bond default 0.0001 Ω)',
          },
    ];
  });
}

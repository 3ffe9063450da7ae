import { capitalise } from '@/lib/domain/plan-model';
import type { Finding, RuleContext } from './types';

export const EARTH_LINK = 'earth-link';

/**
 * Blocker for every jumper or bond with an end on an `earth` node: nothing can be clamped to
 * remote earth, so the link joins nothing and the checker leaves it out of zones and the solve.
 * Ground is reached through a rod, the neutral, a shield wire, a footing or a truck's given
 * resistance, each with its resistance (docs/plan-format.md; OSHA 29 CFR 1910.269(n)(4)(i)).
 * Elements: the link, then the earth node.
 */
export function checkEarthLink(ctx: RuleContext): Finding[] {
  const { model } = ctx;
  return ctx.plan.links.flatMap((link) => {
    if (!model.isEarthLink(link)) return [];
    const earth = [link.from, link.to].find((end) => model.node(end)?.kind === 'earth') as string;
    return [
      {
        rule: EARTH_LINK,
        severity: 'blocker' as const,
        elements: [link.id, earth],
        message:
          `${capitalise(model.nameOf(link.id))} is drawn to ${model.nameOf(earth)}, but nothing can be clamped to remote earth, so it connects nothing; ` +
          'connect to a driven rod, the neutral, a shield wire or a grounded footing instead, each with its resistance.',
        basis: 'Bondmap plan format: earth is the reference, reached only through a ground source with a resistance; OSHA 29 CFR 1910.269(n)(4)(i)',
      },
    ];
  });
}

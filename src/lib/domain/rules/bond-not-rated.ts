import { capitalise, isConductive, isSpan } from '@/lib/domain/plan-model';
import { listOf } from './format';
import type { Finding, RuleContext } from './types';

export const BOND_NOT_RATED = 'bond-not-rated';

const CONDUCTORS = new Set(['phase', 'neutral', 'shield-wire']);

/**
 * Blocker for a phase, neutral or shield wire joined to the rest of the plan only by bonds (no
 * jumper, no span): a permanent bond has no fault rating, and the conductor's fault current would
 * flow through it (OSHA 29 CFR 1910.269(n)(4)(i): grounding equipment carries the fault current).
 * Spans (plan-model isSpan) are line conductor and are not bonds here. Elements: the conductor,
 * then its bonds.
 */
export function checkBondNotRated(ctx: RuleContext): Finding[] {
  const { model } = ctx;
  const bondsOf = new Map<string, string[]>();
  const jumpered = new Set<string>();
  for (const link of ctx.plan.links) {
    if ((link.kind !== 'jumper' && link.kind !== 'bond') || model.isEarthLink(link)) continue;
    const from = model.node(link.from);
    const to = model.node(link.to);
    if (!from || !to || !isConductive(from) || !isConductive(to)) continue;
    const spanOrJumper = link.kind === 'jumper' || isSpan(link, from, to);
    for (const end of [from, to]) {
      if (!CONDUCTORS.has(end.kind)) continue;
      if (spanOrJumper) jumpered.add(end.id);
      else bondsOf.set(end.id, [...(bondsOf.get(end.id) ?? []), link.id]);
    }
  }
  return [...bondsOf].flatMap(([conductor, bonds]) =>
    jumpered.has(conductor)
      ? []
      : [
          {
            rule: BOND_NOT_RATED,
            severity: 'blocker' as const,
            elements: [conductor, ...bonds],
            message:
              `${capitalise(model.nameOf(conductor))} is joined to the zone only by ${listOf(bonds.map(model.nameOf))}, which has no fault rating; ` +
              'use a rated grounding jumper.',
            basis: 'OSHA 29 CFR 1910.269(n)(4)(i): grounding equipment must carry the fault current; a permanent bond is not rated for it',
          },
        ],
  );
}

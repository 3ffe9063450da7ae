import { capitalise, isNonBonding } from '@/lib/domain/plan-model';
import type { Finding, RuleContext } from './types';

export const LINK_ON_INSULATOR = 'link-on-insulator';

/**
 * Warning when a jumper or bond has an end on a wood, fiberglass or concrete pole or crossarm: a
 * clamp there makes no electrical connection, so the link joins nothing (docs/plan-format.md:
 * these are not bonding paths; on concrete only a brought-out ground wire or reinforcing bar
 * connects). Elements: the link, then the non-bonding node.
 */
export function checkLinkOnInsulator(ctx: RuleContext): Finding[] {
  return ctx.plan.links.flatMap((link) => {
    if (link.kind !== 'jumper' && link.kind !== 'bond') return [];
    return [link.from, link.to].flatMap((end) => {
      const node = ctx.model.node(end);
      if (!node || !isNonBonding(node)) return [];
      const material = 'material' in node ? node.material : '';
      return [
        {
          rule: LINK_ON_INSULATOR,
          severity: 'warning' as const,
          elements: [link.id, node.id],
          message: `${capitalise(ctx.model.nameOf(link.id))} ends on ${ctx.model.nameOf(node.id)}, which is ${material} and makes no electrical connection; clamp it to the cluster bar or to bonded hardware instead${material === 'concrete' ? ' (on concrete, to the brought-out ground wire)' : ''}.`,
          basis: 'Bondmap plan format: wood, fiberglass and concrete are not bonding paths; common practice',
        },
      ];
    });
  });
}

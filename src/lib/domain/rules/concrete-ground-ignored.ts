import { capitalise } from '@/lib/domain/plan-model';
import { ohms } from './format';
import type { Finding, RuleContext } from './types';

export const CONCRETE_GROUND_IGNORED = 'concrete-ground-ignored';

/**
 * Warning for a concrete structure that gives `groundOhms`: a clamp on concrete makes no
 * connection, so the footing is reached only through a ground wire or reinforcing bar brought
 * out of it, drawn as a `hardware` node with that resistance; the value on the structure is not
 * used (docs/plan-format.md; common practice). Elements: the structure.
 */
export function checkConcreteGroundIgnored(ctx: RuleContext): Finding[] {
  return ctx.model.nodesOf('structure').flatMap((node) =>
    node.material !== 'concrete' || node.groundOhms === undefined
      ? []
      : [
          {
            rule: CONCRETE_GROUND_IGNORED,
            severity: 'warning' as const,
            elements: [node.id],
            message:
              `${capitalise(ctx.model.nameOf(node.id))} is concrete, so its footing resistance of ${ohms(node.groundOhms)} was not used: a clamp on concrete connects nothing; ` +
              'draw the brought-out ground wire as hardware with that resistance and jumper to it.',
            basis: 'Bondmap plan format: concrete is not a bonding path; only an embedded ground wire or reinforcing bar brought out connects (common practice)',
          },
        ],
  );
}

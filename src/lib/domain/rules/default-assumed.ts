import type { Finding, RuleContext } from './types';

export const DEFAULT_ASSUMED = 'default-assumed';

/**
 * Note for each value the calculation had to assume because the plan left it out, so the reviewer
 * can replace it with a measured one (basis: the assumption's own source). Elements: the element.
 */
export function checkDefaultAssumed(ctx: RuleContext): Finding[] {
  return ctx.network.assumptions.map((assumption) => ({
    rule: DEFAULT_ASSUMED,
    severity: 'note' as const,
    elements: ctx.model.node(assumption.element) || ctx.model.link(assumption.element) ? [assumption.element] : [],
    message:
      `No ${assumption.field} was given for ${ctx.model.nameOf(assumption.element)}, so the check assumed ${Number.isFinite(assumption.value) ? Number(assumption.value.toPrecision(3)) : 'a default'} ${assumption.unit}; ` +
      'enter a measured or published value if you have one.',
    basis: assumption.basis,
  }));
}

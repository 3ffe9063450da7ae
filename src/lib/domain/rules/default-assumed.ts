import type { Finding, RuleContext } from './types';

export const DEFAULT_ASSUMED = 'default-assumed';

/** What a crew calls each value the calculation may assume (never the plan format's field name). */
const FIELD_WORDS: Readonly<Record<string, string>> = {
  groundOhms: 'resistance to earth',
  clampCycles: 'rating time for the clamps',
};
const UNIT_WORDS: Readonly<Record<string, string>> = { ohm: 'Ω' };

/** Plain words for a field: the table's, else the camelCase name split into lower-case words. */
export const fieldWords = (field: string) => FIELD_WORDS[field] ?? field.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase();

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
      `No ${fieldWords(assumption.field)} was given for ${ctx.model.nameOf(assumption.element)}, so the check assumed ${Number.isFinite(assumption.value) ? Number(assumption.value.toPrecision(3)) : 'a default'} ${UNIT_WORDS[assumption.unit] ?? assumption.unit}; ` +
      'enter a measured or published value if you have one.',
    basis: assumption.basis,
  }));
}

import type { Finding, RuleContext } from './types';

export const SET_UNKNOWN = 'set-unknown';

/**
 * Blocker when a jumper names a set (by tag, in `equipmentId`) that is not in the organisation's
 * inventory: nothing is known of its rating or its tests. Elements: the jumper.
 */
export function checkSetUnknown(ctx: RuleContext): Finding[] {
  return (ctx.sets?.uses ?? [])
    .filter((use) => use.set === null)
    .flatMap((use) =>
      use.jumpers.map((jumper) => ({
        rule: SET_UNKNOWN,
        severity: 'blocker' as const,
        elements: [jumper],
        message: `${ctx.model.nameOf(jumper)} names set "${use.tag}", which is not in the organisation's inventory; pick a set on record or add this one first.`,
        basis: 'OSHA 29 CFR 1910.269(n)(4)(i): grounding equipment must be able to carry the fault; only a set on record has a known rating and test history',
      })),
    );
}

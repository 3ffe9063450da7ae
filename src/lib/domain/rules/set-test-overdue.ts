import type { Finding, RuleContext } from './types';

export const SET_TEST_OVERDUE = 'set-test-overdue';

/**
 * A jumper's set is past its next in-service test date (the organisation's interval). A warning
 * while the plan is a draft; a blocker at submit and in the field record. Elements: the jumper.
 */
export function checkSetTestOverdue(ctx: RuleContext): Finding[] {
  const sets = ctx.sets;
  if (!sets) return [];
  const severity = sets.stage === 'draft' ? ('warning' as const) : ('blocker' as const);
  return sets.uses.flatMap((use) => {
    if (!use.set || use.due !== 'overdue') return [];
    return use.jumpers.map((jumper) => ({
      rule: SET_TEST_OVERDUE,
      severity,
      elements: [jumper],
      message: `Set ${use.set?.tag} on ${ctx.model.nameOf(jumper)} was due for its in-service test on ${use.set?.testDueOn}${sets.today ? ` (today is ${sets.today})` : ''}; test it, or take a set that is in date.`,
      basis: "The organisation's own test interval (the in-service test standard, ASTM F2249 from memory, leaves intervals to the employer)",
    }));
  });
}

import type { Finding, RuleContext } from './types';
import { listOf } from './format';

export const SET_USED_TWICE = 'set-used-twice';

/** Blocker when one set is named on two or more jumpers: one set hangs in one place. Elements: the jumpers. */
export function checkSetUsedTwice(ctx: RuleContext): Finding[] {
  return (ctx.sets?.uses ?? [])
    .filter((use) => use.jumpers.length > 1)
    .map((use) => ({
      rule: SET_USED_TWICE,
      severity: 'blocker' as const,
      elements: use.jumpers,
      message: `Set ${use.tag} is on ${listOf(use.jumpers.map((j) => ctx.model.nameOf(j)))}, but one set can hang in one place only; give each jumper its own set.`,
      basis: 'Physical fact: each jumper in the plan is a separate set in the truck',
    }));
}

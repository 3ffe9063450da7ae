import type { Finding, RuleContext } from './types';

export const SET_NOT_IN_SERVICE = 'set-not-in-service';

/**
 * Blocker when a jumper's set is out of service or retired (for instance after carrying fault
 * current or failing a test). Elements: the jumper.
 */
export function checkSetNotInService(ctx: RuleContext): Finding[] {
  return (ctx.sets?.uses ?? []).flatMap((use) => {
    if (!use.set || use.set.status === 'in-service') return [];
    return use.jumpers.map((jumper) => ({
      rule: SET_NOT_IN_SERVICE,
      severity: 'blocker' as const,
      elements: [jumper],
      message: `Set ${use.set?.tag} on ${ctx.model.nameOf(jumper)} is ${use.set?.status.replace(/-/g, ' ')}; take an in-service set instead.`,
      basis: 'Common practice: a set that carried fault current or failed its in-service test is not used until it passes one (ASTM F2249 in-service tests, from memory; the employer decides)',
    }));
  });
}

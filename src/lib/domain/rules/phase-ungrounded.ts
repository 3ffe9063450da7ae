import { capitalise } from '@/lib/domain/plan-model';
import type { Finding, RuleContext } from './types';

export const PHASE_UNGROUNDED = 'phase-ungrounded';

/**
 * Blocker for every phase that does not reach a ground source through jumpers and bonds (a pole
 * ground does not count): lines are treated as energized until grounded (former OSHA 29 CFR
 * 1926.954; 1910.269(n)(3)). Elements: the phase.
 */
export function checkPhaseUngrounded(ctx: RuleContext): Finding[] {
  return ctx.model
    .nodesOf('phase')
    .filter((phase) => !ctx.zones.isSolidlyGrounded(phase.id))
    .map((phase) => ({
      rule: PHASE_UNGROUNDED,
      severity: 'blocker' as const,
      elements: [phase.id],
      message:
        `${capitalise(ctx.model.nameOf(phase.id))} is not connected to a grounded zone, so treat it as energized; ` +
        'jumper it to the cluster bar and bond the cluster bar to the neutral, a grounded footing or a rod.',
      basis: 'OSHA 29 CFR 1910.269(n)(3); lines are treated as energized until grounded (former 29 CFR 1926.954)',
    }));
}

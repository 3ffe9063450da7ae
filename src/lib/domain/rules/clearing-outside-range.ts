import { DALZIEL_MAX_S, DALZIEL_MIN_S } from '@/lib/domain/calc/index';
import { seconds } from './format';
import type { Finding, RuleContext } from './types';

export const CLEARING_OUTSIDE_RANGE = 'clearing-outside-range';


/**
 * Warning when the clearing time is outside 0.03–3 s, where the Dalziel tolerable-current equation
 * was not established, so the body-current limit is an extrapolation (IEEE Std 80). No elements.
 */
export function checkClearingOutsideRange(ctx: RuleContext): Finding[] {
  const t = ctx.fault.durationS;
  if (!Number.isFinite(t) || (t >= DALZIEL_MIN_S && t <= DALZIEL_MAX_S)) return [];
  return [
    {
      rule: CLEARING_OUTSIDE_RANGE,
      severity: 'warning',
      elements: [],
      message: `The clearing time is ${seconds(t)}, outside the 0.03 s to 3 s range of the body-current limit, so treat that limit as an estimate and confirm the clearing time with the system operator.`,
      basis: 'IEEE Std 80 (Dalziel equation, 0.03 s to 3 s)',
    },
  ];
}

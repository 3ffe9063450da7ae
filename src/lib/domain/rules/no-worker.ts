import type { Finding, RuleContext } from './types';

export const NO_WORKER = 'no-worker';

/**
 * Note when the plan has no worker: zones and ratings were checked, but no touch contact or body
 * current could be (plan-format.md: contacts are per worker reach link). No elements.
 */
export function checkNoWorker(ctx: RuleContext): Finding[] {
  if (ctx.model.nodesOf('worker').length > 0) return [];
  return [
    {
      rule: NO_WORKER,
      severity: 'note',
      elements: [],
      message: 'The plan has no worker, so nothing was checked for what a person can touch; add each worker, what they stand on and what they can reach.',
      basis: 'Bondmap plan format: contacts are checked per worker reach link',
    },
  ];
}

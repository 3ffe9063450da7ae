import { capitalise } from '@/lib/domain/plan-model';
import type { Finding, RuleContext } from './types';

export const WORKER_NO_REACH = 'worker-no-reach';

/**
 * Warning for a worker with no reach line: nothing that worker can touch was checked (contacts are
 * checked per reach line, docs/plan-format.md). Elements: the worker.
 */
export function checkWorkerNoReach(ctx: RuleContext): Finding[] {
  return ctx.model.nodesOf('worker').flatMap((worker) =>
    ctx.model.reachesOf(worker.id).length > 0
      ? []
      : [
          {
            rule: WORKER_NO_REACH,
            severity: 'warning' as const,
            elements: [worker.id],
            message: `${capitalise(ctx.model.nameOf(worker.id))} has no reach line, so nothing this worker can touch was checked; draw a reach line to every surface within reach.`,
            basis: 'Bondmap plan format: contacts are checked per reach line; OSHA 29 CFR 1910.269(n)(3)',
          },
        ],
  );
}

import type { Finding, RuleContext } from './types';

export const WORKER_STANDS_NOWHERE = 'worker-stands-nowhere';

/**
 * Blocker for every worker whose standing surface has not been chosen: what a person touches is
 * only safe relative to what they stand on, so nothing about them can be checked yet.
 * Elements: the worker.
 */
export function checkWorkerStandsNowhere(ctx: RuleContext): Finding[] {
  return ctx.model.nodesOf('worker').flatMap((worker) =>
    worker.standsOn !== undefined
      ? []
      : [
          {
            rule: WORKER_STANDS_NOWHERE,
            severity: 'blocker' as const,
            elements: [worker.id],
            message: `${ctx.model.nameOf(worker.id)} stands on nothing yet, so nothing they touch can be checked; choose what they stand on or in.`,
            basis: 'What a worker touches is safe only relative to where they stand (equipotential zone practice)',
          },
        ],
  );
}

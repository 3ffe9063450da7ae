/**
 * The checker in a worker thread (piscina). `astro build` bundles this file on its own into
 * dist/server/check-worker.mjs (see the integration in astro.config.mjs); check-pool.ts runs it.
 */
import { checkPlan } from '@/lib/domain/checker';
import { proposeRemovals } from '@/lib/domain/practice/propose';
import type { CheckOptions } from '@/lib/domain/sets-in-plan';
import type { PlanDocument } from '@/lib/schemas/plan';

/** A check, or (`propose`) the practice proposals, which run the checker once per candidate change. */
export default function check({ document, options, propose }: { document: PlanDocument; options?: CheckOptions; propose?: boolean }) {
  if (propose) return proposeRemovals(document);
  return checkPlan(document, undefined, options);
}

/**
 * The checker in a worker thread (piscina). `astro build` bundles this file on its own into
 * dist/server/check-worker.mjs (see the integration in astro.config.mjs); check-pool.ts runs it.
 */
import { checkPlan } from '../domain/checker';
import type { CheckOptions } from '../domain/sets-in-plan';
import type { PlanDocument } from '../schemas/plan';

export default function check({ document, options }: { document: PlanDocument; options?: CheckOptions }) {
  return checkPlan(document, undefined, options);
}

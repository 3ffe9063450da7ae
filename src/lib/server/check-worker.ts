/**
 * The checker in a worker thread (piscina). `astro build` bundles this file on its own into
 * dist/server/check-worker.mjs (see the integration in astro.config.mjs); check-pool.ts runs it.
 */
import { checkPlan } from '@/lib/domain/checker';
import type { CheckOptions } from '@/lib/domain/sets-in-plan';
import type { PlanDocument } from '@/lib/schemas/plan';

export default function check({ document, options }: { document: PlanDocument; options?: CheckOptions }) {
  return checkPlan(document, undefined, options);
}

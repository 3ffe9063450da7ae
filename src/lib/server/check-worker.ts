/**
 * The checker in a worker thread (piscina). `astro build` bundles this file on its own into
 * dist/server/check-worker.mjs (see the integration in astro.config.mjs); check-pool.ts runs it.
 */
import { checkPlan } from '../domain/checker';
import type { PlanDocument } from '../schemas/plan';

export default function check({ document }: { document: PlanDocument }) {
  return checkPlan(document);
}

/**
 * Runs the pure checker for the server — off the main thread, in a pool of worker threads
 * (piscina), so one large plan never stalls other requests. Each check has a time budget; past it
 * its worker is stopped and the answer is 422 CHECK_TIMEOUT. A full queue answers 503 CHECK_BUSY.
 */
import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';
import type { Db } from '@db/connection';
import { inventoryFor } from '@db/repositories/equipment';
import { checkPlan } from '@/lib/domain/checker';
import { proposeRemovals, type Proposal } from '@/lib/domain/practice/propose';
import type { CheckReport } from '@/lib/domain/report';
import { setTagsOf, type CheckOptions, type CheckStage } from '@/lib/domain/sets-in-plan';
import type { UnitSystem } from '@/lib/domain/units';
import type { PlanDocument } from '@/lib/schemas/plan';
import { AppError } from './errors';
import { log } from './log';
import { organisationToday } from './organisation';

/**
 * Time budget of one check, queueing included. A plan drawn for one structure checks in
 * milliseconds; a generated 25,000-element plan (near the 2 MiB body limit) takes ~8 s here.
 */
export const CHECK_BUDGET_MS = Number(process.env.BONDMAP_CHECK_BUDGET_MS ?? 15_000);
const MAX_QUEUE = 32;

function workerFile(): string | null {
  const candidates = [
    process.env.BONDMAP_CHECK_WORKER,
    fileURLToPath(new URL('./check-worker.mjs', import.meta.url)),
    fileURLToPath(new URL('../check-worker.mjs', import.meta.url)),
    process.argv[1] ? join(dirname(process.argv[1]), 'check-worker.mjs') : undefined,
  ];
  return candidates.find((c): c is string => !!c && existsSync(c)) ?? null;
}

let pool: Piscina | null | undefined;

function getPool(): Piscina | null {
  if (pool !== undefined) return pool;
  const filename = workerFile();
  if (!filename) {
    // Only in `astro dev` and unit tests, which run the sources; the built server always has it.
    log.warn('check worker not found (not a build?): checks run on the main thread');
    pool = null;
    return pool;
  }
  pool = new Piscina({ filename, minThreads: 1, maxThreads: Math.max(1, Math.min(4, availableParallelism() - 1)), maxQueue: MAX_QUEUE, idleTimeout: 60_000 });
  log.info({ filename, threads: pool.options.maxThreads }, 'check worker pool started');
  return pool;
}

export async function checkDocument(document: PlanDocument, options: CheckOptions = {}): Promise<CheckReport> {
  const workers = getPool();
  if (!workers) return checkPlan(document, undefined, options);
  return (await inPool(workers, document, { document, options })) as CheckReport;
}

/**
 * The practice proposals for an approved plan, in the pool within the same budget: they run the
 * checker once or twice per jumper and bond (seconds for a plan of a thousand elements).
 */
export async function proposeInPool(document: PlanDocument): Promise<Proposal[]> {
  const workers = getPool();
  if (!workers) return proposeRemovals(document);
  return (await inPool(workers, document, { document, propose: true })) as Proposal[];
}

async function inPool(workers: Piscina, document: PlanDocument, task: object): Promise<unknown> {
  if (workers.queueSize >= MAX_QUEUE) throw new AppError('CHECK_BUSY', { headers: { 'retry-after': '5' } });
  try {
    return await workers.run(task, { signal: AbortSignal.timeout(CHECK_BUDGET_MS) });
  } catch (error) {
    const name = (error as Error)?.name;
    if (name === 'AbortError' || name === 'TimeoutError') {
      log.warn({ budgetMs: CHECK_BUDGET_MS, nodes: document.nodes.length, links: document.links.length }, 'check stopped at its time budget');
      throw new AppError('CHECK_TIMEOUT', { extra: { budgetMs: CHECK_BUDGET_MS } });
    }
    if (/queue is at limit/i.test((error as Error)?.message ?? '')) throw new AppError('CHECK_BUSY', { headers: { 'retry-after': '5' } });
    throw error;
  }
}

/**
 * Checks a document against the organisation's grounding sets (only those it names; a plan that
 * names none is checked as before) on the organisation's today, at the given stage.
 */
export async function checkForOrganization(db: Db, organizationId: number, document: PlanDocument, stage: CheckStage = 'draft', units: UnitSystem = 'metric'): Promise<CheckReport> {
  const tags = setTagsOf(document);
  if (tags.length === 0) return checkDocument(document, { units });
  return checkDocument(document, { inventory: await inventoryFor(db, organizationId, tags), today: await organisationToday(organizationId, new Date(), db), stage, units });
}

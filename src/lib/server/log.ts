/**
 * Structured logs (pino, JSON lines on stdout). Every line written while a request is handled
 * carries that request's id (`reqId`), taken from an AsyncLocalStorage the middleware fills, so
 * a 5xx answer's `requestId` leads straight to its log lines.
 */
import { AsyncLocalStorage } from 'node:async_hooks';
import { randomUUID } from 'node:crypto';
import pino from 'pino';

interface RequestContext {
  reqId: string;
  /** Database queries issued while handling this request (for Server-Timing in tests). */
  queries: number;
}

const requestContext = new AsyncLocalStorage<RequestContext>();

export const log = pino({
  level: process.env.BONDMAP_LOG_LEVEL ?? 'info',
  base: { app: 'bondmap' },
  mixin: () => {
    const store = requestContext.getStore();
    return store ? { reqId: store.reqId } : {};
  },
});

export function newRequestId(): string {
  return randomUUID();
}

/** Runs `fn` with `reqId` attached to every log line written inside it. */
export function withRequestId<T>(reqId: string, fn: () => T): T {
  return requestContext.run({ reqId, queries: 0 }, fn);
}

/** Counts one database query against the request being handled. */
export function countQuery(): void {
  const store = requestContext.getStore();
  if (store) store.queries += 1;
}

export function queriesSoFar(): number {
  return requestContext.getStore()?.queries ?? 0;
}

/**
 * Runs `job` after the current request has been answered, outside its context (its queries do not
 * count against the request), logging any failure instead of dropping it.
 */
export function afterResponse(job: () => Promise<unknown>, what: string): void {
  const reqId = currentRequestId();
  requestContext.exit(() => {
    setImmediate(() => {
      job().catch((err: unknown) => log.error({ err, reqId }, `${what} failed`));
    });
  });
}

/** The id of the request being handled, if any. */
export function currentRequestId(): string | undefined {
  return requestContext.getStore()?.reqId;
}

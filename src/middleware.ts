/**
 * Every request: a request id (logged on every line, sent back as X-Request-Id and in 5xx
 * bodies); refuse cross-site writes and bodies over the largest limit before anything reads them;
 * put the signed-in person into locals (signed-out pages redirect to /login); add the security
 * headers and the CSP. Database outages become a 503 here, since the session look-up is the
 * first database touch; anything else thrown is logged and answered with a 500 carrying the id.
 */
import type { MiddlewareHandler } from 'astro';
import { defineMiddleware } from 'astro:middleware';
import { getDb } from '@db/connection';
import { readSession } from './lib/server/auth';
import { AppError, isDbUnavailable } from './lib/server/errors';
import { json, PLAN_BODY_LIMIT, serverErrorJson, tooLarge } from './lib/server/http';
import { countQuery, currentRequestId, log, newRequestId, queriesSoFar, withRequestId } from './lib/server/log';
import { startMailWorker } from './lib/server/mail';
import { startDueSetsMailJob } from './lib/server/due-sets-mail';
import { objectStoreSettings } from './lib/server/object-store';
import { plainPage, unavailablePage } from './lib/server/pages';
import { secureResponse } from './lib/server/security-headers';
import { settings } from './lib/server/settings';

// Each app process drains the mail outbox in the background (see src/lib/server/mail.ts).
startMailWorker();
// And runs the daily due-sets message; a claim row per organisation per day keeps it to one (due-sets-mail.ts).
startDueSetsMailJob();
// A half-set object store configuration stops the app here, naming the variable.
objectStoreSettings();
getDb().sequelize.addHook('beforeQuery', () => countQuery());

/** No route takes more than this; each route's own, smaller limit applies while reading. */
const MAX_BODY_BYTES = PLAN_BODY_LIMIT;
/** Photo uploads (up to 15 MB) are measured by their own route, which refuses them by name (PHOTO_TOO_LARGE). */
const OWN_BODY_LIMIT = /^\/api\/records\/\d+\/photos$/;

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);
const PUBLIC_PAGES = [/^\/login\/?$/, /^\/forgot-password\/?$/, /^\/set-password\/[^/]+\/?$/, /^\/favicon/, /^\/_astro\//, /^\/fonts\//];
const NO_SESSION = [/^\/api\/health\/?$/, /^\/_astro\//, /^\/favicon/];
const FORM_LIKE = ['application/x-www-form-urlencoded', 'multipart/form-data', 'text/plain'];

/**
 * A write from another site. Browsers send Origin on every cross-origin write; bodies a form can
 * send (and bodies without a type) must carry our own Origin, like Astro's own check.
 */
function isCrossSite(request: Request, url: URL): boolean {
  const origin = request.headers.get('origin');
  const type = request.headers.get('content-type')?.toLowerCase();
  const formLike = type === undefined || FORM_LIKE.some((t) => type.includes(t));
  if (origin !== null) return origin !== url.origin;
  if (formLike) return true;
  return request.headers.get('sec-fetch-site') === 'cross-site';
}

export const onRequest = defineMiddleware((ctx, next) => {
  const reqId = newRequestId();
  return withRequestId(reqId, async () => {
    const started = performance.now();
    const { request, url } = ctx;
    const isApi = url.pathname.startsWith('/api/');
    const response = await handle(ctx, next, isApi);
    const extra: Record<string, string> = { 'x-request-id': reqId };
    if (ctx.locals.person && !isApi) extra['cache-control'] = 'no-store';
    if (settings().BONDMAP_SERVER_TIMING === '1') extra['server-timing'] = `db;desc="queries";dur=${queriesSoFar()}`;
    let secured: Response;
    try {
      secured = await secureResponse(response, extra);
    } catch (error) {
      // A page that fails while it streams: logged, and answered as a 500 page with the id.
      log.error({ err: error, path: url.pathname }, 'page failed while rendering');
      secured = await secureResponse(errorPage(reqId), extra);
    }
    const level = secured.status >= 500 ? 'warn' : 'info';
    log[level]({ method: request.method, path: url.pathname, status: secured.status, ms: Math.round(performance.now() - started) }, 'request');
    return secured;
  });
});

type Ctx = Parameters<MiddlewareHandler>[0];
type Next = Parameters<MiddlewareHandler>[1];

async function handle(ctx: Ctx, next: Next, isApi: boolean): Promise<Response> {
  const { request, url } = ctx;
  const path = url.pathname;
  ctx.locals.person = null;
  ctx.locals.sessionId = null;

  if (!SAFE_METHODS.has(request.method)) {
    if (isCrossSite(request, url)) return json(new AppError('ORIGIN_REJECTED').toBody(), 403);
    if (!OWN_BODY_LIMIT.test(path) && Number(request.headers.get('content-length') ?? 0) > MAX_BODY_BYTES) {
      if (!isApi) return plainPage(413, 'Too much sent', 'The request was larger than Bondmap takes, so it was not read and nothing was changed.', { connection: 'close' });
      const error = tooLarge(MAX_BODY_BYTES);
      return json(error.toBody(), 413, error.headers);
    }
  }

  try {
    if (!NO_SESSION.some((re) => re.test(path))) {
      const session = await readSession(ctx);
      ctx.locals.person = session?.person ?? null;
      ctx.locals.sessionId = session?.sessionId ?? null;
    }
    if (!isApi && !ctx.locals.person && !PUBLIC_PAGES.some((re) => re.test(path))) {
      return ctx.redirect(`/login?next=${encodeURIComponent(path + url.search)}`, 303);
    }
    return await next();
  } catch (error) {
    if (isDbUnavailable(error)) {
      log.warn({ err: error }, 'database unreachable');
      return isApi ? serverErrorJson(new AppError('DB_DOWN'), { 'retry-after': '5' }) : unavailablePage();
    }
    log.error({ err: error, path }, 'unexpected error');
    return isApi ? serverErrorJson(new AppError('INTERNAL')) : errorPage(currentRequestId() ?? '');
  }
}

function errorPage(reqId: string): Response {
  return plainPage(500, 'Something went wrong', `Nothing was changed. Try again, and tell your admin if it keeps happening (request ${reqId}).`);
}

/**
 * Every request: refuse cross-site writes (Astro's checkOrigin covers form posts; this covers
 * JSON too), then put the signed-in person into locals. Signed-out pages redirect to /login.
 * Database outages become a 503 here, since the session look-up is the first database touch.
 */
import { defineMiddleware } from 'astro:middleware';
import { readSession } from './lib/server/auth';
import { AppError, isDbUnavailable } from './lib/server/errors';
import { json } from './lib/server/http';
import { startMailWorker } from './lib/server/mail';
import { startDueSetsMailJob } from './lib/server/due-sets-mail';
import { objectStoreSettings } from './lib/server/object-store';
import { unavailablePage } from './lib/server/pages';

// Each app process drains the mail outbox in the background (see src/lib/server/mail.ts).
startMailWorker();
// And runs the daily due-sets message; a claim row per organisation per day keeps it to one (due-sets-mail.ts).
startDueSetsMailJob();
// A half-set object store configuration stops the app here, naming the variable.
objectStoreSettings();

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);
const PUBLIC_PAGES = [/^\/login\/?$/, /^\/forgot-password\/?$/, /^\/set-password\/[^/]+\/?$/, /^\/favicon/, /^\/_astro\//, /^\/fonts\//];
const NO_SESSION = [/^\/api\/health\/?$/, /^\/_astro\//, /^\/favicon/];

function isCrossSite(request: Request, url: URL): boolean {
  const origin = request.headers.get('origin');
  if (origin !== null) return origin !== url.origin;
  return request.headers.get('sec-fetch-site') === 'cross-site';
}

export const onRequest = defineMiddleware(async (ctx, next) => {
  const { request, url } = ctx;
  const path = url.pathname;
  const isApi = path.startsWith('/api/');
  ctx.locals.person = null;
  ctx.locals.sessionId = null;

  if (!SAFE_METHODS.has(request.method) && isCrossSite(request, url)) {
    const error = new AppError('ORIGIN_REJECTED');
    return json(error.toBody(), error.status);
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
    if (!isDbUnavailable(error)) throw error;
    return isApi ? json(new AppError('DB_DOWN').toBody(), 503, { 'retry-after': '5' }) : unavailablePage();
  }
});

/** Helpers shared by every endpoint: one JSON error shape, body parsing with size limits. */
import type { APIContext, APIRoute } from 'astro';
import type { z } from 'zod';
import { idParam } from '@/lib/schemas/api';
import { formatIssuePath } from '@/lib/schemas/plan';
import { AppError, isDbUnavailable } from './errors';
import { currentRequestId, log } from './log';

export function json(body: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(body), {
    status,
    headers: { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store', ...headers },
  });
}

/** Turns anything thrown into the one error shape `{ error: { code, message, issues? } }`. */
export function errorResponse(error: unknown): Response {
  if (error instanceof Response) return error;
  if (error instanceof AppError) return json(error.toBody(), error.status, error.headers);
  if (isDbUnavailable(error)) {
    log.warn({ err: error }, 'database unreachable');
    return serverErrorJson(new AppError('DB_DOWN'), { 'retry-after': '5' });
  }
  log.error({ err: error }, 'unexpected error');
  return serverErrorJson(new AppError('INTERNAL'));
}

/** A 5xx JSON answer carrying the request id, so the log lines of this request can be found. */
export function serverErrorJson(error: AppError, headers: Record<string, string> = {}): Response {
  const body = error.toBody();
  return json({ error: { ...body.error, requestId: currentRequestId() } }, error.status, headers);
}

/** Wraps an endpoint so that every thrown error (guards, validation, database) becomes JSON. */
export function endpoint(handler: (ctx: APIContext) => Promise<Response> | Response): APIRoute {
  return async (ctx) => {
    try {
      return await handler(ctx);
    } catch (error) {
      return errorResponse(error);
    }
  };
}

/** Plan documents (create, save, check): far above anything drawn for one structure (README "Security"). */
export const PLAN_BODY_LIMIT = 2 * 1024 * 1024;
/** Every other JSON body. */
export const DEFAULT_BODY_LIMIT = 64 * 1024;

/** Reads a JSON body, refusing non-JSON, oversized bodies and schema failures with the paths. */
export async function readJson<S extends z.ZodTypeAny>(ctx: APIContext, schema: S, limitBytes = DEFAULT_BODY_LIMIT): Promise<z.infer<S>> {
  const type = ctx.request.headers.get('content-type') ?? '';
  if (!/^application\/([\w.+-]+\+)?json\b/i.test(type)) throw new AppError('UNSUPPORTED_MEDIA');
  const text = new TextDecoder().decode(await readLimitedBytes(ctx.request, limitBytes));
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (e) {
    throw new AppError('NOT_JSON', { issues: [{ path: '(body)', message: (e as Error).message }] });
  }
  return parseWith(schema, value);
}

/**
 * Parses a value with a zod schema, throwing VALIDATION with every issue by path; `field` names
 * a single value (a path parameter) in its issues.
 */
export function parseWith<S extends z.ZodTypeAny>(schema: S, value: unknown, field?: string): z.infer<S> {
  const result = schema.safeParse(value);
  if (!result.success) {
    throw new AppError('VALIDATION', {
      issues: result.error.issues.map((i) => ({ path: formatIssuePath(field ? [field, ...i.path] : i.path), message: i.message })),
    });
  }
  return result.data;
}

/** 413; the connection is closed after it, so the rest of the body is never read. */
export function tooLarge(limitBytes: number): AppError {
  return new AppError('BODY_TOO_LARGE', { extra: { limitBytes }, headers: { connection: 'close' } });
}

/**
 * Reads a body up to `limitBytes`: refuses a larger Content-Length before reading anything, and
 * stops reading (BODY_TOO_LARGE) as soon as a body without one streams past the limit.
 */
export async function readLimitedBytes(request: Request, limitBytes: number): Promise<Buffer> {
  const declared = Number(request.headers.get('content-length') ?? 0);
  if (declared > limitBytes) throw tooLarge(limitBytes);
  if (!request.body) return Buffer.alloc(0);
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limitBytes) {
      // Stop reading, but do not cancel: cancelling destroys the socket before the 413 can be sent.
      // The answer carries Connection: close, so the rest of the body is never read.
      reader.releaseLock();
      throw tooLarge(limitBytes);
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks);
}

/** Reads a body as UTF-8 text up to `limitBytes` (see readLimitedBytes). */
export async function readLimited(request: Request, limitBytes: number): Promise<string> {
  return (await readLimitedBytes(request, limitBytes)).toString('utf8');
}

/**
 * A number from the request path, read as written in the address: Astro decodes `%31` to `1` in
 * `params` and `url`, so the raw segment at the parameter's place in the route pattern is parsed.
 */
export function pathId(ctx: Pick<APIContext, 'params' | 'request' | 'routePattern'>, name: string, field = name): number {
  const index = ctx.routePattern.split('/').indexOf(`[${name}]`);
  // ctx.url.pathname is decoded too; the request's own URL is as sent.
  const raw = index >= 0 ? new URL(ctx.request.url).pathname.split('/')[index] : ctx.params[name];
  return parseWith(idParam, raw, field);
}

/** Reads query-string parameters through a zod schema (unknown keys are ignored). */
export function readQuery<S extends z.ZodTypeAny>(url: URL, schema: S): z.infer<S> {
  return parseWith(schema, Object.fromEntries(url.searchParams.entries()));
}

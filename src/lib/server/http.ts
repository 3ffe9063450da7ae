/** Helpers shared by every endpoint: one JSON error shape, body parsing with size limits. */
import type { APIContext, APIRoute } from 'astro';
import type { z } from 'zod';
import { idParam } from '../schemas/api';
import { formatIssuePath } from '../schemas/plan';
import { AppError, isDbUnavailable } from './errors';

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
  if (isDbUnavailable(error)) return json(new AppError('DB_DOWN').toBody(), 503, { 'retry-after': '5' });
  console.error('[bondmap] unexpected error', error);
  return json(new AppError('INTERNAL').toBody(), 500);
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

export const DEFAULT_BODY_LIMIT = 2 * 1024 * 1024;

/** Reads a JSON body, refusing non-JSON, oversized bodies and schema failures with the paths. */
export async function readJson<S extends z.ZodTypeAny>(ctx: APIContext, schema: S, limitBytes = DEFAULT_BODY_LIMIT): Promise<z.infer<S>> {
  const type = ctx.request.headers.get('content-type') ?? '';
  if (!/^application\/([\w.+-]+\+)?json\b/i.test(type)) throw new AppError('UNSUPPORTED_MEDIA');
  const declared = Number(ctx.request.headers.get('content-length') ?? 0);
  if (declared > limitBytes) throw new AppError('BODY_TOO_LARGE', { extra: { limitBytes } });
  const text = await readLimited(ctx.request, limitBytes);
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

/** Reads the raw body as text, refusing it past the limit. */
export async function readLimited(request: Request, limitBytes: number): Promise<string> {
  if (!request.body) return '';
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limitBytes) {
      await reader.cancel();
      throw new AppError('BODY_TOO_LARGE', { extra: { limitBytes } });
    }
    chunks.push(value);
  }
  return new TextDecoder().decode(Buffer.concat(chunks));
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

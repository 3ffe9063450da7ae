/**
 * Response headers every answer carries, and the Content-Security-Policy of HTML pages. Scripts
 * run only from this origin or when their exact text is hashed into the policy (Astro's own
 * inline island loader); no 'unsafe-inline' for scripts. Styles allow inline because React Flow
 * positions nodes with style attributes.
 */
import { createHash } from 'node:crypto';
import { settings } from './settings';

const INLINE_SCRIPT = /<script\b([^>]*)>([\s\S]*?)<\/script>/gi;

/** SHA-256 sources for every inline script in `html` (scripts with a src need none). */
export function inlineScriptHashes(html: string): string[] {
  const hashes = new Set<string>();
  for (const match of html.matchAll(INLINE_SCRIPT)) {
    if (/\bsrc\s*=/i.test(match[1])) continue;
    hashes.add(`'sha256-${createHash('sha256').update(match[2], 'utf8').digest('base64')}'`);
  }
  return [...hashes];
}

export function contentSecurityPolicy(scriptHashes: string[]): string {
  return [
    "default-src 'self'",
    `script-src 'self' ${scriptHashes.join(' ')}`.trim(),
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self' data:",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join('; ');
}

export const PERMISSIONS_POLICY = 'camera=(), microphone=(), geolocation=(), payment=(), usb=(), serial=(), bluetooth=()';

/** Headers for every answer (HTML, JSON, files). */
export function commonHeaders(): Record<string, string> {
  const headers: Record<string, string> = {
    'x-content-type-options': 'nosniff',
    'referrer-policy': 'same-origin',
    'permissions-policy': PERMISSIONS_POLICY,
    'x-frame-options': 'DENY',
  };
  if (settings().BONDMAP_PUBLIC_URL?.startsWith('https:')) headers['strict-transport-security'] = 'max-age=31536000; includeSubDomains';
  return headers;
}

/** Adds the headers to a response, copying it first when its headers are immutable (redirects). */
export async function secureResponse(response: Response, extra: Record<string, string>): Promise<Response> {
  let out = response;
  const type = response.headers.get('content-type') ?? '';
  const headers: Record<string, string> = { ...commonHeaders(), ...extra };
  if (type.startsWith('text/html') && response.body) {
    const html = await response.text();
    headers['content-security-policy'] = contentSecurityPolicy(inlineScriptHashes(html));
    out = new Response(html, { status: response.status, statusText: response.statusText, headers: response.headers });
  }
  try {
    for (const [k, v] of Object.entries(headers)) out.headers.set(k, v);
    return out;
  } catch {
    const copy = new Response(out.body, { status: out.status, statusText: out.statusText, headers: out.headers });
    for (const [k, v] of Object.entries(headers)) copy.headers.set(k, v);
    return copy;
  }
}

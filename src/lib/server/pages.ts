/** Small helpers for .astro pages: role checks that answer with a page, the outage page. */
import type { AstroGlobal } from 'astro';
import { can, rolesFor, type Action } from '@/lib/domain/permissions';
import type { Role } from '@/lib/domain/roles';
import { roleMessage } from './guards';
import { currentRequestId } from './log';
import { escapeHtml } from './html';

/**
 * For a page only some roles may open: null when the person's role allows `action`, else the 403
 * page naming the roles that do, in the app's shell for a signed-in person
 * (src/pages/not-for-your-role.astro).
 */
export async function pageRefusal(Astro: AstroGlobal, action: Action): Promise<Response | null> {
  const person = Astro.locals.person;
  return person && can(person.role, action) ? null : refusalPage(Astro, rolesFor(action));
}

function refusalPage(Astro: AstroGlobal, roles: readonly Role[]): Response | Promise<Response> {
  if (!Astro.locals.person) return plainPage(403, 'Not for your role', roleMessage(roles));
  return Astro.rewrite(`/not-for-your-role?need=${roles.join(',')}`);
}

export function unavailablePage(): Response {
  const id = currentRequestId();
  return plainPage(503, 'Bondmap cannot reach its database', `Nothing was changed. This page will work again as soon as the database is back; reload in a moment.${id ? ` (request ${id})` : ''}`, { 'retry-after': '5' });
}

export function plainPage(status: number, title: string, message: string, headers: Record<string, string> = {}): Response {
  const body = `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>${escapeHtml(title)} · Bondmap</title>
<style>body{font-family:"Source Sans 3",system-ui,sans-serif;background:#f7f7f4;color:#1b2330;max-width:40rem;margin:4rem auto;padding:0 1rem;line-height:1.5}a{color:#0f766e}</style></head>
<body><h1>${escapeHtml(title)}</h1><p>${escapeHtml(message)}</p><p><a href="/">Back to the start page</a></p></body></html>`;
  return new Response(body, { status, headers: { 'content-type': 'text/html; charset=utf-8', ...headers } });
}

/**
 * The role matrix, generated: every route of the route list (tests/helpers/route-list.ts), asked
 * signed out, as each role, and by an allowed role of another organisation, must answer what the
 * permissions table (src/lib/domain/permissions.ts) says. A 403 must name exactly the table's
 * roles. The list itself is checked against the files under src/pages, so a new route cannot be
 * left out. Each cell makes the fixtures it changes (tests/helpers/matrix-world.ts), so the cells
 * pass in any order.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { can, rolesFor } from '@/lib/domain/permissions';
import { ROLES, type Role } from '@/lib/domain/roles';
import { Client } from '../helpers/api';
import { closeTestDb } from '../helpers/factories';
import { World, type Outcome } from '../helpers/matrix-world';
import { outcomeOf, routeName, ROUTES, type RouteCase } from '../helpers/route-list';

afterAll(closeTestDb);

type Caller = Role | 'anonymous' | 'elsewhere';
const CALLERS: Caller[] = ['anonymous', ...ROLES, 'elsewhere'];

/** Another organisation's caller holds the first role the action allows. */
const elsewhereRole = (route: RouteCase): Role => (route.action === 'public' || route.action === 'signed-in' ? 'crew_lead' : rolesFor(route.action)[0]);

function expected(route: RouteCase, caller: Caller): Outcome {
  if (route.action === 'public') return route.ok;
  if (caller === 'anonymous') return route.form ? '303 sign-in' : 401;
  if (caller === 'elsewhere') return route.elsewhere ?? route.ok;
  if (route.action === 'signed-in' || can(caller, route.action)) return route.ok;
  return route.refused ?? 403;
}

describe.each(ROUTES.map((route) => [routeName(route), route] as const))('%s', (_name, route) => {
  it.each(CALLERS)('answers %s as the permissions table says', async (caller) => {
    const world = await World.get();
    const role = caller === 'elsewhere' ? elsewhereRole(route) : caller;
    const client = role === 'anonymous' ? new Client() : await world.client(role, caller === 'elsewhere' ? 'theirs' : 'ours');
    const who = role === 'anonymous' ? null : { role, other: caller === 'elsewhere' };
    const { outcome, body } = await outcomeOf(route, await route.call(client, world, who));
    expect(outcome, JSON.stringify(body)?.slice(0, 400)).toBe(expected(route, caller));
    const error = (body as { error?: { code: string; requiredRoles?: string[] } } | null)?.error;
    if (!route.form && outcome === 403 && route.action !== 'public' && route.action !== 'signed-in') {
      expect(error).toMatchObject({ code: 'ROLE_REQUIRED', requiredRoles: [...rolesFor(route.action)] });
    }
    if (!route.form && outcome === 401 && route.action !== 'public' && body !== null) expect(error?.code).toBe('AUTH_REQUIRED');
  });
});

const PAGES = join(__dirname, '../../src/pages');
const METHOD = /export\s+(?:const|async\s+function|function)\s+(GET|POST|PUT|PATCH|DELETE|ALL)\b/g;
const FORM = /Astro\.request\.method\s*===\s*'(POST|PUT|PATCH|DELETE)'/g;

/** "METHOD /path" for every endpoint under src/pages and every page that handles a form. */
function routesOnDisk(dir = PAGES): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const file = join(dir, entry.name);
    if (entry.isDirectory()) return routesOnDisk(file);
    const pattern = entry.name.endsWith('.ts') ? METHOD : entry.name.endsWith('.astro') ? FORM : null;
    if (!pattern) return [];
    const path = `/${relative(PAGES, file)}`.replace(/\.(ts|astro)$/, '').replace(/\/index$/, '') || '/';
    return [...new Set([...readFileSync(file, 'utf8').matchAll(pattern)].map((m) => `${m[1]} ${path}`))];
  });
}

describe('the route list', () => {
  it('holds every route the files under src/pages answer, and no route without a file', () => {
    const onDisk = new Set(routesOnDisk());
    const listed = new Set(ROUTES.map((r) => `${r.method} ${r.path}`));
    expect(onDisk.size).toBeGreaterThan(60);
    expect([...onDisk].filter((r) => !listed.has(r)), 'add these to tests/helpers/route-list.ts').toEqual([]);
    expect([...listed].filter((r) => !onDisk.has(r)), 'no file answers these').toEqual([]);
  });

  it('lists each route and variant once', () => {
    const names = ROUTES.map(routeName);
    expect(names.length).toBe(new Set(names).size);
  });
});

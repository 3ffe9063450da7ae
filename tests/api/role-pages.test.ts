/**
 * Pages and the main menu follow the permissions table: a page only some roles may open answers
 * 200 to them and 403 to the rest, in the app's shell and naming the table's roles; the menu lists
 * an entry exactly when the role may do what the entry's page is for.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { canAny, can, rolesFor, type Action } from '@/lib/domain/permissions';
import { ROLE_LABELS, ROLES } from '@/lib/domain/roles';
import { closeTestDb } from '../helpers/factories';
import { World } from '../helpers/matrix-world';

afterAll(closeTestDb);

const PAGES: { path: string; action: Action }[] = [
  { path: '/review', action: 'plan.review' },
  { path: '/practice/new', action: 'practice.manage' },
  { path: '/practice/progress', action: 'practice.manage' },
  { path: '/admin/mail', action: 'mail.read' },
  { path: '/plans/new', action: 'plan.create' },
  { path: '/admin/users', action: 'people.manage' },
  { path: '/settings', action: 'settings.edit' },
  { path: '/equipment/settings', action: 'settings.edit' },
];

describe.each(PAGES)('$path', ({ path, action }) => {
  it.each(ROLES)('opens for %s exactly when the table allows it', async (role) => {
    const page = await (await (await World.get()).client(role)).get(path);
    if (can(role, action)) {
      expect(page.status).toBe(200);
      return;
    }
    expect(page.status).toBe(403);
    expect(page.text).toContain('data-testid="refused"');
    expect(page.text).toContain(`This needs the ${rolesFor(action).map((r) => ROLE_LABELS[r]).join(' or ')} role`);
    expect(page.text).toContain('<nav aria-label="Main"');
  });
});

// The menu in order; an entry without actions is for everyone signed in. The mail entry shows
// while the local mail catcher runs, as it does under `npm test`.
const MENU: { href: string; for?: Action[] }[] = [
  { href: '/' },
  { href: '/plans', for: ['plan.view'] },
  { href: '/plans/new', for: ['plan.create'] },
  { href: '/review', for: ['plan.review'] },
  { href: '/records', for: ['records.view'] },
  { href: '/library', for: ['library.view'] },
  { href: '/practice', for: ['practice.take', 'practice.manage'] },
  { href: '/equipment', for: ['sets.view'] },
  { href: '/admin/users', for: ['people.manage'] },
  { href: '/settings', for: ['settings.edit'] },
  { href: '/admin/mail', for: ['mail.read'] },
];

describe('the main menu', () => {
  it.each(ROLES)('lists for %s the entries the table allows, in order', async (role) => {
    const home = await (await (await World.get()).client(role)).get('/');
    expect(home.status).toBe(200);
    const nav = home.text.slice(home.text.indexOf('<nav aria-label="Main"'), home.text.indexOf('</nav>'));
    const hrefs = [...nav.matchAll(/<a href="([^"]+)"/g)].map((m) => m[1]);
    expect(hrefs).toEqual(MENU.filter((item) => !item.for || canAny(role, item.for)).map((item) => item.href));
  });
});

describe('/not-for-your-role opened directly', () => {
  it('is a 403 in the shell that names only real roles from `need`, and a generic line without them', async () => {
    const lead = await (await World.get()).client('crew_lead');
    const named = await lead.get('/not-for-your-role?need=admin,<script>,reviewer');
    expect(named.status).toBe(403);
    expect(named.text).toContain('<nav aria-label="Main"');
    expect(named.text).toContain(`This needs the ${ROLE_LABELS.admin} or ${ROLE_LABELS.reviewer} role`);
    expect(named.text).not.toContain('<script>,');
    const bare = await lead.get('/not-for-your-role');
    expect(bare.status).toBe(403);
    expect(bare.text).toContain('Your role does not allow this page.');
  });
});

/** The equipment pages as served: table with due badges by word, the set page, admin home counts, 404 across organisations. */
import { afterAll, beforeAll, expect, it } from 'vitest';
import type { Client } from '../helpers/api';
import { signedIn } from '../helpers/api';
import { monthsAgo, setBody } from '../helpers/equipment';
import { closeTestDb, makePerson, makeTeam, PASSWORD } from '../helpers/factories';

let admin: Client;
let apprentice: Client;
let stranger: Client;
const ids: Record<string, number> = {};
beforeAll(async () => {
  const team = await makeTeam();
  admin = await signedIn(team.admin.email, PASSWORD);
  apprentice = await signedIn(team.apprentice.email, PASSWORD);
  stranger = await signedIn((await makePerson((await makeTeam()).organizationId, 'admin')).email, PASSWORD);
  for (const [tag, last] of [['P-OVER', monthsAgo(13)], ['P-SOON', monthsAgo(12, 5)], ['P-SOON2', monthsAgo(12, 25)], ['P-FINE', monthsAgo(2)]] as const) {
    ids[tag] = (await admin.post('/api/equipment', setBody({ tag, lastTestedOn: last }))).body.set.id;
  }
});
afterAll(closeTestDb);

const row = (html: string, tag: string) => html.match(new RegExp(`<tr[^>]*data-tag="${tag}"[\\s\\S]*?</tr>`))?.[0] ?? '';

it('lists the sets with due badges by word and shape', async () => {
  const page = await apprentice.get('/equipment');
  expect(page.status).toBe(200);
  expect(row(page.text, 'P-OVER')).toMatch(/data-due="overdue"[\s\S]*<svg[\s\S]*Overdue/);
  expect(row(page.text, 'P-SOON')).toMatch(/data-due="soon"[\s\S]*Due soon/);
  expect(row(page.text, 'P-FINE')).not.toMatch(/data-due/);
  expect(page.text).toMatch(/aria-current="page"[^>]*>\s*Grounding sets/);
  expect(page.text).not.toContain('Import from CSV');
  const overdue = await apprentice.get('/equipment?due=overdue');
  expect(row(overdue.text, 'P-OVER')).not.toBe('');
  expect(row(overdue.text, 'P-FINE')).toBe('');
});

it('shows a set with its tests and events, and 404 to another organisation', async () => {
  const page = await apprentice.get(`/equipment/${ids['P-OVER']}`);
  expect(page.status).toBe(200);
  expect(page.text).toContain('Set P-OVER');
  expect(page.text).toMatch(/data-testid="set-events"[\s\S]*Added/);
  expect(page.text).not.toContain('Add a test');
  expect((await stranger.get(`/equipment/${ids['P-OVER']}`)).status).toBe(404);
});

it("tells a set's history in plain words: no field names or status codes", async () => {
  const id = (await admin.post('/api/equipment', setBody())).body.set.id as number;
  expect((await admin.patch(`/api/equipment/${id}`, { lengthM: 2.4, clampKa: 31, inServiceOn: monthsAgo(30) })).status).toBe(200);
  expect((await admin.patch(`/api/equipment/${id}`, { status: 'out-of-service', statusReason: 'Invented: ferrule cracked' })).status).toBe(200);
  const html = (await apprentice.get(`/equipment/${id}`)).text;
  const events = (html.match(/<ol[^>]*data-testid="set-events"[\s\S]*?<\/ol>/)?.[0] ?? '').replace(/<[^>]+>/g, '');
  expect(events).toContain('Changed the length, the clamp rating (kA), the date it went into service');
  expect(events).toContain('Out of service: Invented: ferrule cracked');
  expect(events).toContain('Added');
  for (const code of ['lengthM', 'clampKa', 'inServiceOn', 'out-of-service', 'in-service', 'edited', 'created']) expect(events, code).not.toContain(code);
});

it('shows the admin the counts of overdue and due-soon sets on the home page', async () => {
  const home = await admin.get('/');
  expect(home.text).toMatch(/data-count="overdue">1</);
  expect(home.text).toMatch(/data-count="soon">2</);
  expect((await apprentice.get('/')).text).not.toContain('data-testid="sets-due"');
});

it('keeps the settings page for admins', async () => {
  expect((await apprentice.get('/equipment/settings')).status).toBe(403);
  const page = await admin.get('/equipment/settings');
  expect(page.status).toBe(200);
  expect(page.text).toContain('Not chosen yet');
});

it('adds a set from the page form, naming each bad field and saving nothing on a bad one', async () => {
  const form = (fields: Record<string, string>) => admin.request('POST', '/equipment', { body: new URLSearchParams({ action: 'add', ...fields }).toString(), headers: { 'content-type': 'application/x-www-form-urlencoded', origin: new URL(admin.baseUrl).origin } });
  const good = { tag: 'P-FORM', description: 'From the form', cable: '2/0', lengthM: '2.4', clampKind: 'grounding', clampKa: '27', clampCycles: '15', connection: 'ferrule', inServiceOn: '2025-03-01', lastTestedOn: '' };
  const bad = await form({ ...good, lengthM: 'long', inServiceOn: '2025-02-30' });
  expect(bad.status).toBe(200);
  expect(bad.text).toContain('Nothing was saved; fix the fields marked below.');
  expect(bad.text).toContain('must be a real date written YYYY-MM-DD');
  expect((await admin.get('/api/equipment?q=P-FORM')).body.total).toBe(0);
  const ok = await form(good);
  expect(ok.status).toBe(303);
  expect(ok.headers.get('location')).toMatch(/^\/equipment\/\d+$/);
  expect((await admin.get('/api/equipment?q=P-FORM')).body.items[0]).toMatchObject({ lengthM: 2.4, testDueOn: '2026-03-01' });
});

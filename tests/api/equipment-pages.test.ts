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
  const good = { tag: 'P-FORM', description: 'From the form', cable: '2/0', lengthM: '2.4 m', clampKind: 'grounding', clampKa: '27', clampCycles: '15', connection: 'ferrule', inServiceOn: '2025-03-01', lastTestedOn: '' };
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

it('reads and shows set lengths and limit lengths in feet for an organisation in feet, and names bad limit cells in words', async () => {
  // A new organisation reads feet (the default units).
  const team = await makeTeam();
  const own = await signedIn(team.admin.email, PASSWORD);
  const headers = { 'content-type': 'application/x-www-form-urlencoded', origin: new URL(own.baseUrl).origin };
  const post = (path: string, fields: Record<string, string>) => own.request('POST', path, { body: new URLSearchParams(fields).toString(), headers });
  const form = await own.get('/equipment');
  expect(form.text).toContain('Length (ft in)');
  const added = await post('/equipment', { action: 'add', tag: 'F-FEET', cable: '2/0', lengthM: '10 ft 6 in', clampKind: 'grounding', clampKa: '27', clampCycles: '15', connection: 'ferrule', inServiceOn: '2025-03-01' });
  expect(added.status).toBe(303);
  const stored = (await own.get('/api/equipment?q=F-FEET')).body.items[0];
  expect(stored.lengthM).toBeCloseTo(10.5 * 0.3048, 9); // 1 ft = 0.3048 m exactly (international foot)
  expect(row((await own.get('/equipment')).text, 'F-FEET')).toContain('10 ft 6 in');
  expect((await own.get(added.headers.get('location')!)).text).toContain('2/0 copper, 10 ft 6 in');
  const badLength = await post('/equipment', { action: 'add', tag: 'F-BAD', cable: '2/0', lengthM: 'ten feet', clampKind: 'grounding', clampKa: '27', clampCycles: '15', connection: 'ferrule', inServiceOn: '2025-03-01' });
  expect(badLength.text).toContain('must be a length in feet and inches');
  expect((await own.get('/api/equipment?q=F-BAD')).body.total).toBe(0);

  const settings = (limits: string) => post('/equipment/settings', { testIntervalMonths: '12', limits });
  const bad = await settings('2/0, 10 ft, 1.2\n4/0, far, x');
  expect(bad.text).toContain('Nothing was saved');
  expect(bad.text).toContain('Limit row 2, length, must be a length in feet and inches');
  expect(bad.text).toContain('Limit row 2, limit, must be a number');
  expect(bad.text).not.toMatch(/maxLengthM|limitMilliohms|resistanceLimits/);
  expect((await settings('2/0, 10 ft, 1.2\n4/0, 3.05 m, 0.9')).text).toContain('Saved');
  expect((await own.get('/api/equipment/settings')).body.settings.resistanceLimits).toEqual([
    { cable: '2/0', maxLengthM: 3.048, limitMilliohms: 1.2 },
    { cable: '4/0', maxLengthM: 3.05, limitMilliohms: 0.9 },
  ]);
  // Shown again as typed: feet where they were feet, metres kept exact where they were not whole inches.
  const page = (await own.get('/equipment/settings')).text;
  expect(page).toContain('2/0, 10 ft 0 in, 1.2');
  expect(page).toContain('4/0, 3.05 m, 0.9');
});

/**
 * The role matrix of the equipment routes: anonymous, each role, and a crew lead and an admin of
 * another organisation (another organisation's set is 404, never 403 once the role allows the call).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { CSV_HEADER, postCsv, setBody, today, uniqueTag } from '../helpers/equipment';
import { closeTestDb, makeOrganization, makePerson, makeTeam, PASSWORD } from '../helpers/factories';

type Caller = 'anonymous' | 'admin' | 'reviewer' | 'crew_lead' | 'apprentice' | 'other_lead' | 'other_admin';
const CALLERS: Caller[] = ['anonymous', 'admin', 'reviewer', 'crew_lead', 'apprentice', 'other_lead', 'other_admin'];
const clients = {} as Record<Caller, Client>;
let setId: number;

beforeAll(async () => {
  const team = await makeTeam();
  const otherOrg = await makeOrganization('Another Invented Co-operative');
  clients.anonymous = new Client();
  clients.admin = await signedIn(team.admin.email, PASSWORD);
  clients.reviewer = await signedIn(team.reviewer.email, PASSWORD);
  clients.crew_lead = await signedIn(team.lead.email, PASSWORD);
  clients.apprentice = await signedIn(team.apprentice.email, PASSWORD);
  clients.other_lead = await signedIn((await makePerson(otherOrg, 'crew_lead')).email, PASSWORD);
  clients.other_admin = await signedIn((await makePerson(otherOrg, 'admin')).email, PASSWORD);
  const created = await clients.admin.post('/api/equipment', setBody());
  expect(created.status).toBe(201);
  setId = created.body.set.id;
});
afterAll(closeTestDb);

const csv = () => `${CSV_HEADER}\n${uniqueTag('IMP')},,2/0,3,grounding,27,15,ferrule,2024-01-02,,,\n`;
const all = (status: number, anonymous = 401) => Object.fromEntries(CALLERS.map((c) => [c, c === 'anonymous' ? anonymous : status])) as Record<Caller, number>;

const routes: { name: string; call: (c: Client) => Promise<{ status: number; body: any }>; expect: Record<Caller, number> }[] = [
  { name: 'GET /api/equipment', call: (c) => c.get('/api/equipment'), expect: all(200) },
  { name: 'POST /api/equipment', call: (c) => c.post('/api/equipment', setBody()), expect: { anonymous: 401, admin: 201, reviewer: 403, crew_lead: 403, apprentice: 403, other_lead: 403, other_admin: 201 } },
  { name: 'GET /api/equipment/:id', call: (c) => c.get(`/api/equipment/${setId}`), expect: { ...all(200), other_lead: 404, other_admin: 404 } },
  { name: 'PATCH /api/equipment/:id', call: (c) => c.patch(`/api/equipment/${setId}`, { notes: 'Checked the ferrules.' }), expect: { anonymous: 401, admin: 200, reviewer: 403, crew_lead: 403, apprentice: 403, other_lead: 403, other_admin: 404 } },
  {
    name: 'POST /api/equipment/:id/tests',
    call: (c) => c.post(`/api/equipment/${setId}/tests`, { testedOn: today(), resistanceMilliohms: 0.8, limitMilliohms: 1.5 }),
    expect: { anonymous: 401, admin: 201, reviewer: 403, crew_lead: 201, apprentice: 403, other_lead: 404, other_admin: 404 },
  },
  { name: 'POST /api/equipment/import', call: (c) => postCsv(c, csv()), expect: { anonymous: 401, admin: 200, reviewer: 403, crew_lead: 403, apprentice: 403, other_lead: 403, other_admin: 200 } },
  { name: 'GET /api/equipment/export.csv', call: (c) => c.get('/api/equipment/export.csv'), expect: all(200) },
  { name: 'GET /api/equipment/settings', call: (c) => c.get('/api/equipment/settings'), expect: all(200) },
  { name: 'PUT /api/equipment/settings', call: (c) => c.put('/api/equipment/settings', { testIntervalMonths: 12 }), expect: { anonymous: 401, admin: 200, reviewer: 403, crew_lead: 403, apprentice: 403, other_lead: 403, other_admin: 200 } },
];

describe.each(routes)('$name', (route) => {
  it.each(CALLERS)('answers %s with the expected status', async (caller) => {
    const response = await route.call(clients[caller]);
    expect(response.status, JSON.stringify(response.body)).toBe(route.expect[caller]);
    if (response.status >= 400) expect(typeof response.body.error.code).toBe('string');
    if (response.status === 403) expect(response.body.error.message).toMatch(/needs the .* role/);
  });
});

it("never shows another organisation's sets in a list or an export", async () => {
  const mine = await clients.admin.get('/api/equipment?pageSize=500');
  const theirs = await clients.other_admin.get('/api/equipment?pageSize=500');
  const tags = new Set(mine.body.items.map((s: { tag: string }) => s.tag));
  expect(tags.size).toBeGreaterThan(0);
  expect(theirs.body.items.some((s: { tag: string }) => tags.has(s.tag))).toBe(false);
  const exported = await clients.other_admin.get('/api/equipment/export.csv');
  for (const tag of tags) expect(exported.text).not.toContain(tag);
});

/**
 * Who may do what with field records, route by route: crew leads and admins write; reviewers
 * read; apprentices read closed records only; another organisation's crew lead gets 404.
 */
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeOrganization, makePerson, makeTeam, PASSWORD } from '../helpers/factories';
import { approvedPlan, entry } from '../helpers/records';

type Caller = 'anonymous' | 'admin' | 'reviewer' | 'crew_lead' | 'apprentice' | 'other';
const CALLERS: Caller[] = ['anonymous', 'admin', 'reviewer', 'crew_lead', 'apprentice', 'other'];
const clients = {} as Record<Caller, Client>;
let planId: number;
let openId: number;
let closedId: number;
let closedPhoto: string;
let png: Buffer;

async function photoUpload(c: Client, id: number) {
  const form = new FormData();
  form.set('photo', new Blob([new Uint8Array(png)], { type: 'image/png' }), 'p.png');
  const request = new Request('http://x/', { method: 'POST', body: form });
  return c.request('POST', `/api/records/${id}/photos`, { body: new Uint8Array(await request.arrayBuffer()), headers: { ...Object.fromEntries(request.headers.entries()), origin: c.baseUrl } });
}

beforeAll(async () => {
  const team = await makeTeam();
  clients.anonymous = new Client();
  clients.admin = await signedIn(team.admin.email, PASSWORD);
  clients.reviewer = await signedIn(team.reviewer.email, PASSWORD);
  clients.crew_lead = await signedIn(team.lead.email, PASSWORD);
  clients.apprentice = await signedIn(team.apprentice.email, PASSWORD);
  clients.other = await signedIn((await makePerson(await makeOrganization('Matrix Elsewhere Co-operative'), 'crew_lead')).email, PASSWORD);
  png = await sharp({ create: { width: 40, height: 30, channels: 3, background: '#446' } }).png().toBuffer();
  planId = await approvedPlan(clients.crew_lead, clients.reviewer);
  openId = (await clients.crew_lead.post(`/api/plans/${planId}/records`)).body.id;
  closedId = (await clients.crew_lead.post(`/api/plans/${planId}/records`)).body.id;
  closedPhoto = (await photoUpload(clients.crew_lead, closedId)).body.url;
  expect((await clients.crew_lead.post(`/api/records/${closedId}/close`)).status).toBe(200);
});
afterAll(closeTestDb);

const fresh = async () => (await clients.crew_lead.post(`/api/plans/${planId}/records`)).body.id as number;

const routes: { name: string; call: (c: Client) => Promise<{ status: number }>; expect: Record<Caller, number> }[] = [
  { name: 'POST /api/plans/:id/records', call: (c) => c.post(`/api/plans/${planId}/records`), expect: { anonymous: 401, admin: 201, reviewer: 403, crew_lead: 201, apprentice: 403, other: 404 } },
  { name: 'GET /api/records', call: (c) => c.get('/api/records'), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 200, other: 200 } },
  { name: 'GET /api/records/:id (open)', call: (c) => c.get(`/api/records/${openId}`), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 403, other: 404 } },
  { name: 'GET /api/records/:id (closed)', call: (c) => c.get(`/api/records/${closedId}`), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 200, other: 404 } },
  { name: 'POST /api/records/:id/entries', call: (c) => c.post(`/api/records/${openId}/entries`, entry('note', { text: 'matrix' })), expect: { anonymous: 401, admin: 201, reviewer: 403, crew_lead: 201, apprentice: 403, other: 404 } },
  { name: 'POST /api/records/:id/photos', call: (c) => photoUpload(c, openId), expect: { anonymous: 401, admin: 201, reviewer: 403, crew_lead: 201, apprentice: 403, other: 404 } },
  { name: 'GET /api/records/:id/photos/:photoId (closed)', call: (c) => c.getRaw(closedPhoto), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 200, other: 404 } },
  { name: 'GET /api/records/:id/pdf (closed)', call: (c) => c.getRaw(`/api/records/${closedId}/pdf`), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 200, other: 404 } },
  { name: 'POST /api/records/:id/close', call: async (c) => c.post(`/api/records/${await fresh()}/close`), expect: { anonymous: 401, admin: 200, reviewer: 403, crew_lead: 200, apprentice: 403, other: 404 } },
];

describe('field record role matrix', () => {
  for (const route of routes) {
    for (const caller of CALLERS) {
      it(`${route.name} as ${caller} → ${route.expect[caller]}`, async () => {
        expect((await route.call(clients[caller])).status).toBe(route.expect[caller]);
      });
    }
  }

  it('apprentices are listed closed records only', async () => {
    const items = (await clients.apprentice.get('/api/records?pageSize=100')).body.items as { id: number; status: string }[];
    expect(items.map((r) => r.id)).toContain(closedId);
    expect(items.every((r) => r.status === 'closed')).toBe(true);
  });
});

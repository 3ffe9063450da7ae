/**
 * The role-by-route matrix: every API route, every kind of caller, the exact status expected.
 * "other" is a crew lead of another organisation: the plan is 404 to them, never 403.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeOrganization, makePerson, makeTeam, planDocument, PASSWORD } from '../helpers/factories';

type Caller = 'anonymous' | 'admin' | 'reviewer' | 'crew_lead' | 'apprentice' | 'other';
const CALLERS: Caller[] = ['anonymous', 'admin', 'reviewer', 'crew_lead', 'apprentice', 'other'];

const clients = {} as Record<Caller, Client>;
let planId: number;
let submittedId: number;
let approvedId: number;
let targetUserId: string;

beforeAll(async () => {
  const team = await makeTeam();
  const otherOrg = await makeOrganization('Another Invented Co-operative');
  const other = await makePerson(otherOrg, 'crew_lead');
  clients.anonymous = new Client();
  clients.admin = await signedIn(team.admin.email, PASSWORD);
  clients.reviewer = await signedIn(team.reviewer.email, PASSWORD);
  clients.crew_lead = await signedIn(team.lead.email, PASSWORD);
  clients.apprentice = await signedIn(team.apprentice.email, PASSWORD);
  clients.other = await signedIn(other.email, PASSWORD);
  const created = await clients.crew_lead.post('/api/plans', { title: 'Matrix pole', document: planDocument() });
  expect(created.status).toBe(201);
  planId = created.body.plan.id;
  targetUserId = (await makePerson(team.organizationId, 'apprentice')).id;
  const submitted = await clients.crew_lead.post('/api/plans', { title: 'Matrix review pole', document: planDocument() });
  submittedId = submitted.body.plan.id;
  expect((await clients.crew_lead.post(`/api/plans/${submittedId}/submit`)).status).toBe(200);
  const approved = await clients.crew_lead.post('/api/plans', { title: 'Matrix approved pole', document: planDocument() });
  approvedId = approved.body.plan.id;
  expect((await clients.crew_lead.post(`/api/plans/${approvedId}/submit`)).status).toBe(200);
  expect((await clients.reviewer.post(`/api/plans/${approvedId}/review`, { decision: 'approve' })).status).toBe(200);
});
afterAll(closeTestDb);

interface Route {
  name: string;
  call: (c: Client) => Promise<{ status: number; body: any }>;
  expect: Record<Caller, number>;
}

const doc = () => planDocument();
// Writes that succeed change state; each caller gets its own fresh object where that matters.
const routes: Route[] = [
  { name: 'GET /api/health', call: (c) => c.get('/api/health'), expect: { anonymous: 200, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 200, other: 200 } },
  { name: 'GET /api/me', call: (c) => c.get('/api/me'), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 200, other: 200 } },
  { name: 'GET /api/plans', call: (c) => c.get('/api/plans'), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 200, other: 200 } },
  { name: 'POST /api/plans', call: (c) => c.post('/api/plans', { title: 'New one', document: doc() }), expect: { anonymous: 401, admin: 201, reviewer: 403, crew_lead: 201, apprentice: 403, other: 201 } },
  { name: 'GET /api/plans/:id', call: (c) => c.get(`/api/plans/${planId}`), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 200, other: 404 } },
  {
    name: 'PUT /api/plans/:id',
    // Each caller saves from the revision that is current right then, so success is 200 in turn.
    call: async (c) => {
      const current = await clients.admin.get(`/api/plans/${planId}`);
      return c.put(`/api/plans/${planId}`, { expectedRevision: current.body.plan.currentRevision, document: doc() });
    },
    expect: { anonymous: 401, admin: 200, reviewer: 403, crew_lead: 200, apprentice: 403, other: 404 },
  },
  { name: 'POST /api/plans/:id/check', call: (c) => c.post(`/api/plans/${planId}/check`), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 200, other: 404 } },
  { name: 'POST /api/check', call: (c) => c.post('/api/check', doc()), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 200, other: 200 } },
  { name: 'GET /api/admin/users', call: (c) => c.get('/api/admin/users'), expect: { anonymous: 401, admin: 200, reviewer: 403, crew_lead: 403, apprentice: 403, other: 403 } },
  {
    name: 'POST /api/admin/users',
    call: (c) => c.post('/api/admin/users', { email: `invited-${Math.random().toString(36).slice(2)}@example.test`, name: 'Invited Person', role: 'apprentice' }),
    expect: { anonymous: 401, admin: 201, reviewer: 403, crew_lead: 403, apprentice: 403, other: 403 },
  },
  { name: 'PATCH /api/admin/users/:id', call: (c) => c.patch(`/api/admin/users/${targetUserId}`, { role: 'reviewer' }), expect: { anonymous: 401, admin: 200, reviewer: 403, crew_lead: 403, apprentice: 403, other: 403 } },
  // Callers run in the order of CALLERS, so a state change by one shows in the next one's answer.
  { name: 'POST /api/plans/:id/submit', call: (c) => c.post(`/api/plans/${planId}/submit`), expect: { anonymous: 401, admin: 200, reviewer: 403, crew_lead: 409, apprentice: 403, other: 404 } },
  { name: 'POST /api/plans/:id/review', call: (c) => c.post(`/api/plans/${submittedId}/review`, { decision: 'return', comment: 'Show the neutral bond.' }), expect: { anonymous: 401, admin: 200, reviewer: 409, crew_lead: 403, apprentice: 403, other: 403 } },
  { name: 'POST /api/plans/:id/reopen', call: (c) => c.post(`/api/plans/${approvedId}/reopen`), expect: { anonymous: 401, admin: 201, reviewer: 403, crew_lead: 409, apprentice: 403, other: 404 } },
  { name: 'GET /api/plans/:id/revisions', call: (c) => c.get(`/api/plans/${planId}/revisions`), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 200, other: 404 } },
  { name: 'GET /api/plans/:id/revisions/:n', call: (c) => c.get(`/api/plans/${planId}/revisions/1`), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 200, other: 404 } },
  { name: 'GET /api/plans/:id/comments', call: (c) => c.get(`/api/plans/${planId}/comments`), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 200, other: 404 } },
  { name: 'POST /api/plans/:id/comments', call: (c) => c.post(`/api/plans/${planId}/comments`, { elementId: 'A', body: 'Check this clamp.' }), expect: { anonymous: 401, admin: 201, reviewer: 201, crew_lead: 201, apprentice: 403, other: 404 } },
  { name: 'GET /api/plans/:id/history', call: (c) => c.get(`/api/plans/${planId}/history`), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 200, other: 404 } },
  { name: 'GET /api/plans/:id/diff', call: (c) => c.get(`/api/plans/${planId}/diff?from=1&to=2`), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 200, other: 404 } },
  { name: 'GET /api/dev/mail', call: (c) => c.get('/api/dev/mail'), expect: { anonymous: 401, admin: 200, reviewer: 403, crew_lead: 403, apprentice: 403, other: 403 } },
  { name: 'POST /api/auth/forgot', call: (c) => c.post('/api/auth/forgot', { email: `nobody-${Math.random().toString(36).slice(2)}@example.test` } /* one e-mail a call: reset requests are throttled per e-mail */), expect: { anonymous: 200, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 200, other: 200 } },
  { name: 'POST /api/auth/set-password', call: (c) => c.post('/api/auth/set-password', { token: 'not-a-real-token-at-all', password: 'long enough password' }), expect: { anonymous: 400, admin: 400, reviewer: 400, crew_lead: 400, apprentice: 400, other: 400 } },
];

describe.each(routes)('$name', (route) => {
  it.each(CALLERS)('answers %s with the expected status', async (caller) => {
    const response = await route.call(clients[caller]);
    expect(response.status, JSON.stringify(response.body)).toBe(route.expect[caller]);
    if (response.status >= 400) {
      expect(typeof response.body.error.code).toBe('string');
      expect(typeof response.body.error.message).toBe('string');
    }
    if (response.status === 403) expect(response.body.error.message).toMatch(/needs the .* role/);
  });
});

it('names the role needed in a 403', async () => {
  const response = await clients.apprentice.post('/api/plans', { title: 'x', document: doc() });
  expect(response.body.error).toMatchObject({ code: 'ROLE_REQUIRED', requiredRoles: ['crew_lead', 'admin'] });
});

it('lists only the caller\'s own organisation\'s plans', async () => {
  const mine = await clients.crew_lead.get('/api/plans?pageSize=100');
  const theirs = await clients.other.get('/api/plans?pageSize=100');
  const mineIds = new Set(mine.body.items.map((p: { id: number }) => p.id));
  expect(mineIds.has(planId)).toBe(true);
  expect(theirs.body.items.some((p: { id: number }) => mineIds.has(p.id))).toBe(false);
});

it('redirects a signed-out page to /login and back', async () => {
  const response = await new Client().get('/plans?status=draft');
  expect(response.status).toBe(303);
  expect(response.headers.get('location')).toBe('/login?next=%2Fplans%3Fstatus%3Ddraft');
});

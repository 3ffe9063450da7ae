/**
 * The role-by-route matrix: every API route, every kind of caller, the exact status expected.
 * "other" is a crew lead of another organisation: the plan is 404 to them, never 403.
 * Every cell that moves a plan gets a plan of its own in the state it needs, made in the cell, so
 * no cell's answer depends on which cells ran before it (the suite passes shuffled).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeOrganization, makePerson, makeTeam, planDocument, testDb, PASSWORD } from '../helpers/factories';

type Caller = 'anonymous' | 'admin' | 'reviewer' | 'crew_lead' | 'apprentice' | 'other';
const CALLERS: Caller[] = ['anonymous', 'admin', 'reviewer', 'crew_lead', 'apprentice', 'other'];

const clients = {} as Record<Caller, Client>;
let planId: number;
let targetUserId: string;
let commentId: number;
let otherPlanId: number;
// For the form routes' comments, on a plan of its own.
const form = { draftId: 0, submittedId: 0, commentId: 0 };

/** A fresh plan of the crew lead's, moved to the state a cell needs. */
async function draftPlan(): Promise<number> {
  const created = await clients.crew_lead.post('/api/plans', { title: 'Matrix cell pole', document: planDocument() });
  expect(created.status).toBe(201);
  return created.body.plan.id;
}
async function submittedPlan(): Promise<number> {
  const id = await draftPlan();
  expect((await clients.crew_lead.post(`/api/plans/${id}/submit`)).status).toBe(200);
  return id;
}
async function decidedPlan(decision: 'approve' | 'return'): Promise<number> {
  const id = await submittedPlan();
  expect((await clients.reviewer.post(`/api/plans/${id}/review`, { decision, ...(decision === 'return' ? { comment: 'Matrix return.' } : {}) })).status).toBe(200);
  return id;
}

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
  planId = await draftPlan();
  // A second revision, for the diff row.
  expect((await clients.crew_lead.put(`/api/plans/${planId}`, { expectedRevision: 1, document: planDocument() })).status).toBe(200);
  targetUserId = (await makePerson(team.organizationId, 'apprentice')).id;
  commentId = (await clients.reviewer.post(`/api/plans/${planId}/comments`, { body: 'Matrix comment.' })).body.comment.id;
  otherPlanId = (await clients.other.post('/api/plans', { title: 'Their own pole', document: planDocument() })).body.plan.id;
  form.draftId = await draftPlan();
  form.submittedId = await submittedPlan();
  form.commentId = (await clients.reviewer.post(`/api/plans/${form.draftId}/comments`, { body: 'Form matrix comment.' })).body.comment.id;
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
    call: async (c) => c.put(`/api/plans/${await draftPlan()}`, { expectedRevision: 1, document: doc() }),
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
  { name: 'POST /api/plans/:id/submit', call: async (c) => c.post(`/api/plans/${await draftPlan()}/submit`), expect: { anonymous: 401, admin: 200, reviewer: 403, crew_lead: 200, apprentice: 403, other: 404 } },
  { name: 'POST /api/plans/:id/submit (already submitted)', call: async (c) => c.post(`/api/plans/${await submittedPlan()}/submit`), expect: { anonymous: 401, admin: 409, reviewer: 403, crew_lead: 409, apprentice: 403, other: 404 } },
  { name: 'POST /api/plans/:id/review', call: async (c) => c.post(`/api/plans/${await submittedPlan()}/review`, { decision: 'return', comment: 'Show the neutral bond.' }), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 403, apprentice: 403, other: 403 } },
  { name: 'POST /api/plans/:id/review (already decided)', call: async (c) => c.post(`/api/plans/${await decidedPlan('return')}/review`, { decision: 'return', comment: 'Again.' }), expect: { anonymous: 401, admin: 409, reviewer: 409, crew_lead: 403, apprentice: 403, other: 403 } },
  { name: 'POST /api/plans/:id/reopen', call: async (c) => c.post(`/api/plans/${await decidedPlan('approve')}/reopen`), expect: { anonymous: 401, admin: 201, reviewer: 403, crew_lead: 201, apprentice: 403, other: 404 } },
  { name: 'POST /api/plans/:id/reopen (a draft)', call: async (c) => c.post(`/api/plans/${await draftPlan()}/reopen`), expect: { anonymous: 401, admin: 409, reviewer: 403, crew_lead: 409, apprentice: 403, other: 404 } },
  { name: 'POST /api/plans/:id/withdraw', call: async (c) => c.post(`/api/plans/${await submittedPlan()}/withdraw`), expect: { anonymous: 401, admin: 200, reviewer: 403, crew_lead: 200, apprentice: 403, other: 404 } },
  { name: 'POST /api/plans/:id/withdraw (a draft)', call: async (c) => c.post(`/api/plans/${await draftPlan()}/withdraw`), expect: { anonymous: 401, admin: 409, reviewer: 403, crew_lead: 409, apprentice: 403, other: 404 } },
  { name: 'GET /api/plans/:id/revisions', call: (c) => c.get(`/api/plans/${planId}/revisions`), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 200, other: 404 } },
  { name: 'GET /api/plans/:id/revisions/:n', call: (c) => c.get(`/api/plans/${planId}/revisions/1`), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 200, other: 404 } },
  { name: 'GET /api/plans/:id/comments', call: (c) => c.get(`/api/plans/${planId}/comments`), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 200, other: 404 } },
  { name: 'POST /api/plans/:id/comments', call: (c) => c.post(`/api/plans/${planId}/comments`, { elementId: 'A', body: 'Check this clamp.' }), expect: { anonymous: 401, admin: 201, reviewer: 201, crew_lead: 201, apprentice: 403, other: 404 } },
  { name: 'POST /api/plans/:id/comments (a reply)', call: (c) => c.post(`/api/plans/${planId}/comments`, { replyTo: commentId, body: 'Rated for 43 kA.' }), expect: { anonymous: 401, admin: 201, reviewer: 201, crew_lead: 201, apprentice: 403, other: 404 } },
  { name: 'PATCH /api/plans/:id/comments/:cid', call: (c) => c.patch(`/api/plans/${planId}/comments/${commentId}`, { resolved: true }), expect: { anonymous: 401, admin: 200, reviewer: 200, crew_lead: 200, apprentice: 403, other: 404 } },
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

/**
 * The plan page's form routes: they answer with a redirect carrying what happened (or a page), so
 * each cell is the status and, for a redirect, the notice, the problem or the sign-in page.
 */
interface FormRoute {
  name: string;
  call: (c: Client) => Promise<{ status: number; headers: Headers }>;
  expect: Record<Caller, string>;
}

function outcome(response: { status: number; headers: Headers }): string {
  if (response.status !== 303) return String(response.status);
  const location = new URL(response.headers.get('location') ?? '', 'http://app.test');
  if (location.pathname === '/login') return '303 sign-in';
  return `303 ${location.search.slice(1) || location.pathname}`;
}

const workflow = (id: () => number | Promise<number>, fields: Record<string, string>) => async (c: Client) => c.form(`/plans/${await id()}/workflow`, fields);
const formRoutes: FormRoute[] = [
  {
    name: 'POST /plans/:id/workflow resolve',
    call: (c) => workflow(() => form.draftId, { action: 'resolve', commentId: String(form.commentId) })(c),
    expect: { anonymous: '303 sign-in', admin: '303 notice=resolved', reviewer: '303 notice=resolved', crew_lead: '303 notice=resolved', apprentice: '303 problem=ROLE_REQUIRED', other: '303 problem=NOT_FOUND' },
  },
  {
    name: 'POST /plans/:id/workflow unresolve',
    call: (c) => workflow(() => form.draftId, { action: 'unresolve', commentId: String(form.commentId) })(c),
    expect: { anonymous: '303 sign-in', admin: '303 notice=reopened-comment', reviewer: '303 notice=reopened-comment', crew_lead: '303 notice=reopened-comment', apprentice: '303 problem=ROLE_REQUIRED', other: '303 problem=NOT_FOUND' },
  },
  {
    name: 'POST /plans/:id/workflow reply',
    call: (c) => workflow(() => form.draftId, { action: 'reply', replyTo: String(form.commentId), body: 'A form reply.' })(c),
    expect: { anonymous: '303 sign-in', admin: '303 notice=replied', reviewer: '303 notice=replied', crew_lead: '303 notice=replied', apprentice: '303 problem=ROLE_REQUIRED', other: '303 problem=NOT_FOUND' },
  },
  {
    name: 'POST /plans/:id/review reply',
    call: (c) => c.form(`/plans/${form.draftId}/review`, { action: 'reply', replyTo: String(form.commentId), body: 'A review-page reply.' }),
    expect: { anonymous: '303 sign-in', admin: '200', reviewer: '200', crew_lead: '403', apprentice: '403', other: '403' },
  },
  {
    name: 'POST /plans/:id/workflow submit',
    call: (c) => workflow(draftPlan, { action: 'submit' })(c),
    expect: { anonymous: '303 sign-in', admin: '303 notice=submitted', reviewer: '303 problem=ROLE_REQUIRED', crew_lead: '303 notice=submitted', apprentice: '303 problem=ROLE_REQUIRED', other: '303 problem=NOT_FOUND' },
  },
  {
    name: 'POST /plans/:id/workflow submit (already submitted)',
    call: (c) => workflow(submittedPlan, { action: 'submit' })(c),
    expect: { anonymous: '303 sign-in', admin: '303 problem=NOT_SUBMITTABLE', reviewer: '303 problem=ROLE_REQUIRED', crew_lead: '303 problem=NOT_SUBMITTABLE', apprentice: '303 problem=ROLE_REQUIRED', other: '303 problem=NOT_FOUND' },
  },
  {
    name: 'POST /plans/:id/workflow reopen',
    call: (c) => workflow(() => decidedPlan('approve'), { action: 'reopen' })(c),
    expect: { anonymous: '303 sign-in', admin: '303 notice=reopened', reviewer: '303 problem=ROLE_REQUIRED', crew_lead: '303 notice=reopened', apprentice: '303 problem=ROLE_REQUIRED', other: '303 problem=NOT_FOUND' },
  },
  {
    name: 'POST /plans/:id/workflow reopen (a draft)',
    call: (c) => workflow(draftPlan, { action: 'reopen' })(c),
    expect: { anonymous: '303 sign-in', admin: '303 problem=NOT_APPROVED', reviewer: '303 problem=ROLE_REQUIRED', crew_lead: '303 problem=NOT_APPROVED', apprentice: '303 problem=ROLE_REQUIRED', other: '303 problem=NOT_FOUND' },
  },
  {
    name: 'POST /plans/:id/workflow withdraw',
    call: (c) => workflow(submittedPlan, { action: 'withdraw' })(c),
    expect: { anonymous: '303 sign-in', admin: '303 notice=withdrawn', reviewer: '303 problem=ROLE_REQUIRED', crew_lead: '303 notice=withdrawn', apprentice: '303 problem=ROLE_REQUIRED', other: '303 problem=NOT_FOUND' },
  },
  {
    name: 'POST /plans/:id/review comment',
    call: (c) => c.form(`/plans/${form.submittedId}/review`, { action: 'comment', body: 'A form comment.' }),
    // "other" is a crew lead: refused for the role before the plan is looked up.
    expect: { anonymous: '303 sign-in', admin: '200', reviewer: '200', crew_lead: '403', apprentice: '403', other: '403' },
  },
  {
    name: 'POST /plans/:id/review decide',
    call: async (c) => c.form(`/plans/${await submittedPlan()}/review`, { action: 'decide', decision: 'return', comment: 'Form return.', revision: '1' }),
    expect: { anonymous: '303 sign-in', admin: '303 /review', reviewer: '303 /review', crew_lead: '403', apprentice: '403', other: '403' },
  },
  {
    name: 'POST /plans/:id/review decide (already decided)',
    call: async (c) => c.form(`/plans/${await decidedPlan('return')}/review`, { action: 'decide', decision: 'return', comment: 'Form return.', revision: '1' }),
    expect: { anonymous: '303 sign-in', admin: '409', reviewer: '409', crew_lead: '403', apprentice: '403', other: '403' },
  },
];

describe.each(formRoutes)('$name (form)', (route) => {
  it.each(CALLERS)('answers %s with the expected outcome', async (caller) => {
    expect(outcome(await route.call(clients[caller]))).toBe(route.expect[caller]);
  });
});

describe('comments of another organisation', () => {
  it('cannot be resolved or opened again through either route, by plan id or by comment id', async () => {
    const row = () => testDb().models.PlanComment.findByPk(commentId);
    await testDb().models.PlanComment.update({ resolvedAt: null, resolvedBy: null }, { where: { id: commentId } });
    for (const via of [planId, otherPlanId]) {
      expect(outcome(await clients.other.form(`/plans/${via}/workflow`, { action: 'resolve', commentId: String(commentId) }))).toBe('303 problem=NOT_FOUND');
      expect((await clients.other.patch(`/api/plans/${via}/comments/${commentId}`, { resolved: true })).status).toBe(404);
    }
    expect((await row())!.resolvedAt).toBeNull();
    await clients.reviewer.patch(`/api/plans/${planId}/comments/${commentId}`, { resolved: true });
    for (const via of [planId, otherPlanId]) {
      await clients.other.form(`/plans/${via}/workflow`, { action: 'unresolve', commentId: String(commentId) });
      await clients.other.patch(`/api/plans/${via}/comments/${commentId}`, { resolved: false });
    }
    expect((await row())!.resolvedAt).not.toBeNull();
  });
});

it('keeps another organisation\'s reviewer out of the review form (404) and changes nothing', async () => {
  const outsider = await signedIn((await makeTeam()).reviewer.email, PASSWORD);
  const before = await testDb().models.PlanComment.count({ where: { planId: form.submittedId } });
  expect((await outsider.form(`/plans/${form.submittedId}/review`, { action: 'comment', body: 'From outside.' })).status).toBe(404);
  expect((await outsider.form(`/plans/${form.submittedId}/review`, { action: 'decide', decision: 'approve', revision: '1' })).status).toBe(404);
  expect(await testDb().models.PlanComment.count({ where: { planId: form.submittedId } })).toBe(before);
});

it('names the role needed in a 403', async () => {
  const response = await clients.apprentice.post('/api/plans', { title: 'x', document: doc() });
  expect(response.body.error).toMatchObject({ code: 'ROLE_REQUIRED', requiredRoles: ['crew_lead', 'admin'] });
});

it('lists only the caller\'s own organisation\'s plans', async () => {
  // Oldest first: the matrix cells make more than a page of plans after planId.
  const mine = await clients.crew_lead.get('/api/plans?pageSize=100&sort=created&dir=asc');
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

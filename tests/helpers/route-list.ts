/**
 * Every route that answers a request other than a page view: the JSON routes under src/pages/api
 * and the pages that accept a form POST. Each names the action of the permissions table it needs
 * ('public' for sign-in and the like, 'signed-in' for anyone signed in) and makes its own
 * fixtures. The role-matrix test asks each as every role and checks the list against the files.
 */
import type { Action } from '@/lib/domain/permissions';
import type { Role } from '@/lib/domain/roles';
import type { ApiResponse, Client } from './api';
import { CSV_HEADER, postCsv, setBody, today, uniqueTag } from './equipment';
import { planDocument } from './factories';
import { upload } from './photos';
import { entry } from './records';
import { formOutcome, pngBytes, type Outcome, type World } from './matrix-world';

export interface RouteCase {
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  /** As the file under src/pages names it: `/api/plans/[id]/submit`, `/equipment/[id]`. */
  path: string;
  /** One form route serving several actions gets a case for each. */
  variant?: string;
  action: Action | 'public' | 'signed-in';
  /** A page answering a form: outcomes are where it went (`formOutcome`), not JSON statuses. */
  form?: boolean;
  /** The answer to a caller whose role allows the action. */
  ok: Outcome;
  /** The answer to a caller whose role does not (default 403). */
  refused?: Outcome;
  /** The answer to an allowed caller of another organisation (default `ok`: the route names nothing of ours). */
  elsewhere?: Outcome;
  /** Makes what it needs and sends the request; `who` is null for the signed-out caller. */
  call: (c: Client, w: World, who: { role: Role; other: boolean } | null) => Promise<ApiResponse | Response>;
  /** Reads the outcome; default: the status, or `formOutcome` for a form. */
  read?: (r: ApiResponse) => Outcome;
}

const doc = () => planDocument();
const random = () => Math.random().toString(36).slice(2);
const csv = () => `${CSV_HEADER}\n${uniqueTag('MX')},,2/0,3,grounding,27,15,ferrule,2024-01-02,,,\n`;
const form = (c: Client, path: string, fields: Record<string, string>) => c.form(path, fields);
const workflow = async (c: Client, id: number | Promise<number>, fields: Record<string, string>) => form(c, `/plans/${await id}/workflow`, fields);
/** A 200 page that did the work says so; one that ignored the post does not. */
const said = (words: string) => (r: ApiResponse) => (r.status === 200 && r.text.includes(words) ? '200 done' : formOutcome(r));

export const ROUTES: RouteCase[] = [
  // Signing in and out, and the health check: the same answer for everyone.
  { method: 'GET', path: '/api/health', action: 'public', ok: 200, call: (c) => c.get('/api/health') },
  { method: 'POST', path: '/api/auth/login', action: 'public', ok: 401, call: (c) => c.post('/api/auth/login', { email: `nobody-${random()}@example.test`, password: 'not the password at all' }) },
  { method: 'POST', path: '/api/auth/logout', action: 'public', ok: 200, call: async (c, w, who) => (who ? await w.freshClient(who.role, who.other ? 'theirs' : 'ours') : c).post('/api/auth/logout') },
  { method: 'POST', path: '/api/auth/forgot', action: 'public', ok: 200, call: (c) => c.post('/api/auth/forgot', { email: `nobody-${random()}@example.test` }) },
  { method: 'POST', path: '/api/auth/set-password', action: 'public', ok: 400, call: (c) => c.post('/api/auth/set-password', { token: 'not-a-real-token-at-all', password: 'long enough password' }) },
  { method: 'POST', path: '/login', action: 'public', form: true, ok: '401', call: (c) => form(c, '/login', { email: `nobody-${random()}@example.test`, password: 'not the password at all' }) },
  { method: 'POST', path: '/logout', action: 'public', form: true, ok: '303 sign-in', call: async (c, w, who) => form(who ? await w.freshClient(who.role, who.other ? 'theirs' : 'ours') : c, '/logout', {}) },
  { method: 'POST', path: '/forgot-password', action: 'public', form: true, ok: '200', call: (c) => form(c, '/forgot-password', { email: `nobody-${random()}@example.test` }) },
  { method: 'POST', path: '/set-password/[token]', action: 'public', form: true, ok: '400', call: (c) => form(c, `/set-password/not-a-token-${random()}`, { password: 'long enough password', confirm: 'long enough password' }) },
  { method: 'GET', path: '/api/me', action: 'signed-in', ok: 200, call: (c) => c.get('/api/me') },
  { method: 'GET', path: '/api/organisation/settings', action: 'signed-in', ok: 200, call: (c) => c.get('/api/organisation/settings') },
  { method: 'PUT', path: '/api/organisation/settings', action: 'settings.edit', ok: 200, call: (c) => c.put('/api/organisation/settings', { timeZone: 'UTC', paperSize: 'a4', units: 'metric' }) },
  { method: 'POST', path: '/settings', action: 'settings.edit', form: true, ok: '200 done', refused: '403', read: said('Saved.'), call: (c) => form(c, '/settings', { timeZone: 'UTC', paperSize: 'a4', units: 'metric' }) },

  // Plans.
  { method: 'POST', path: '/api/check', action: 'plan.check', ok: 200, call: (c) => c.post('/api/check', doc()) },
  { method: 'GET', path: '/api/plans', action: 'plan.view', ok: 200, call: (c) => c.get('/api/plans') },
  { method: 'POST', path: '/api/plans', action: 'plan.create', ok: 201, call: (c) => c.post('/api/plans', { title: 'Invented new pole', document: doc() }) },
  { method: 'POST', path: '/plans/new', action: 'plan.create', form: true, ok: '303 /plans/:id', refused: '403', call: (c) => form(c, '/plans/new', { starter: 'empty', title: 'Invented form pole', structure: 'Pole 7', nominalKv: '12.47', frequencyHz: '60', phaseSpacingM: '0.9' }) },
  { method: 'GET', path: '/api/plans/[id]', action: 'plan.view', ok: 200, elsewhere: 404, call: async (c, w) => c.get(`/api/plans/${await w.readable()}`) },
  { method: 'PUT', path: '/api/plans/[id]', action: 'plan.edit', ok: 200, elsewhere: 404, call: async (c, w) => c.put(`/api/plans/${await w.draft()}`, { expectedRevision: 1, document: doc() }) },
  { method: 'POST', path: '/api/plans/[id]/check', action: 'plan.check', ok: 200, elsewhere: 404, call: async (c, w) => c.post(`/api/plans/${await w.readable()}/check`) },
  { method: 'GET', path: '/api/plans/[id]/revisions', action: 'plan.view', ok: 200, elsewhere: 404, call: async (c, w) => c.get(`/api/plans/${await w.readable()}/revisions`) },
  { method: 'GET', path: '/api/plans/[id]/revisions/[n]', action: 'plan.view', ok: 200, elsewhere: 404, call: async (c, w) => c.get(`/api/plans/${await w.readable()}/revisions/1`) },
  { method: 'GET', path: '/api/plans/[id]/history', action: 'plan.view', ok: 200, elsewhere: 404, call: async (c, w) => c.get(`/api/plans/${await w.readable()}/history`) },
  { method: 'GET', path: '/api/plans/[id]/diff', action: 'plan.view', ok: 200, elsewhere: 404, call: async (c, w) => c.get(`/api/plans/${await w.readable()}/diff?from=1&to=2`) },
  { method: 'GET', path: '/api/plans/[id]/comments', action: 'plan.view', ok: 200, elsewhere: 404, call: async (c, w) => c.get(`/api/plans/${await w.readable()}/comments`) },
  { method: 'POST', path: '/api/plans/[id]/comments', action: 'plan.comment', ok: 201, elsewhere: 404, call: async (c, w) => c.post(`/api/plans/${await w.draft()}/comments`, { elementId: 'A', body: 'Check this clamp.' }) },
  {
    method: 'PATCH', path: '/api/plans/[id]/comments/[cid]', action: 'comment.resolve', ok: 200, elsewhere: 404,
    call: async (c, w) => {
      const { planId, commentId } = await w.comment();
      return c.patch(`/api/plans/${planId}/comments/${commentId}`, { resolved: true });
    },
  },
  { method: 'POST', path: '/api/plans/[id]/submit', action: 'plan.submit', ok: 200, elsewhere: 404, call: async (c, w) => c.post(`/api/plans/${await w.draft()}/submit`) },
  { method: 'POST', path: '/api/plans/[id]/withdraw', action: 'plan.withdraw', ok: 200, elsewhere: 404, call: async (c, w) => c.post(`/api/plans/${await w.submitted()}/withdraw`) },
  { method: 'POST', path: '/api/plans/[id]/review', action: 'plan.review', ok: 200, elsewhere: 404, call: async (c, w) => c.post(`/api/plans/${await w.submitted()}/review`, { decision: 'return', comment: 'Show the neutral bond.' }) },
  { method: 'POST', path: '/api/plans/[id]/reopen', action: 'plan.reopen', ok: 201, elsewhere: 404, call: async (c, w) => c.post(`/api/plans/${(await w.approved()).id}/reopen`) },
  { method: 'POST', path: '/plans/[id]/workflow', variant: 'submit', action: 'plan.submit', form: true, ok: '303 notice=submitted', refused: '303 problem=ROLE_REQUIRED', elsewhere: '303 problem=NOT_FOUND', call: (c, w) => workflow(c, w.draft(), { action: 'submit' }) },
  { method: 'POST', path: '/plans/[id]/workflow', variant: 'withdraw', action: 'plan.withdraw', form: true, ok: '303 notice=withdrawn', refused: '303 problem=ROLE_REQUIRED', elsewhere: '303 problem=NOT_FOUND', call: (c, w) => workflow(c, w.submitted(), { action: 'withdraw' }) },
  { method: 'POST', path: '/plans/[id]/workflow', variant: 'reopen', action: 'plan.reopen', form: true, ok: '303 notice=reopened', refused: '303 problem=ROLE_REQUIRED', elsewhere: '303 problem=NOT_FOUND', call: async (c, w) => workflow(c, (await w.approved()).id, { action: 'reopen' }) },
  {
    method: 'POST', path: '/plans/[id]/workflow', variant: 'resolve', action: 'comment.resolve', form: true, ok: '303 notice=resolved', refused: '303 problem=ROLE_REQUIRED', elsewhere: '303 problem=NOT_FOUND',
    call: async (c, w) => {
      const { planId, commentId } = await w.comment();
      return workflow(c, planId, { action: 'resolve', commentId: String(commentId) });
    },
  },
  {
    method: 'POST', path: '/plans/[id]/workflow', variant: 'unresolve', action: 'comment.resolve', form: true, ok: '303 notice=reopened-comment', refused: '303 problem=ROLE_REQUIRED', elsewhere: '303 problem=NOT_FOUND',
    call: async (c, w) => {
      const { planId, commentId } = await w.comment();
      return workflow(c, planId, { action: 'unresolve', commentId: String(commentId) });
    },
  },
  { method: 'POST', path: '/plans/[id]/review', variant: 'comment', action: 'plan.review', form: true, ok: '200', refused: '403', elsewhere: '404', call: async (c, w) => form(c, `/plans/${await w.submitted()}/review`, { action: 'comment', body: 'A form comment.' }) },
  { method: 'POST', path: '/plans/[id]/review', variant: 'decide', action: 'plan.review', form: true, ok: '303 /review', refused: '403', elsewhere: '404', call: async (c, w) => form(c, `/plans/${await w.submitted()}/review`, { action: 'decide', decision: 'return', comment: 'Form return.', revision: '1' }) },

  // People, and the local mail catcher.
  { method: 'GET', path: '/api/admin/users', action: 'people.manage', ok: 200, call: (c) => c.get('/api/admin/users') },
  { method: 'POST', path: '/api/admin/users', action: 'people.manage', ok: 201, call: (c) => c.post('/api/admin/users', { email: `invited-${random()}@example.test`, name: 'Invited Person', role: 'apprentice' }) },
  { method: 'PATCH', path: '/api/admin/users/[id]', action: 'people.manage', ok: 200, elsewhere: 404, call: async (c, w) => c.patch(`/api/admin/users/${await w.spareApprentice()}`, { role: 'reviewer' }) },
  { method: 'POST', path: '/admin/users', variant: 'invite', action: 'people.manage', form: true, ok: '200 done', refused: '403', read: said('An invitation was sent'), call: (c) => form(c, '/admin/users', { action: 'invite', email: `invited-${random()}@example.test`, name: 'Invited Person', role: 'apprentice' }) },
  { method: 'POST', path: '/admin/users', variant: 'role', action: 'people.manage', form: true, ok: '200', refused: '403', elsewhere: '404', call: async (c, w) => form(c, '/admin/users', { action: 'role', id: await w.spareApprentice(), role: 'reviewer' }) },
  { method: 'GET', path: '/api/dev/mail', action: 'mail.read', ok: 200, call: (c) => c.get('/api/dev/mail') },

  // Grounding sets.
  { method: 'GET', path: '/api/equipment', action: 'sets.view', ok: 200, call: (c) => c.get('/api/equipment') },
  { method: 'POST', path: '/api/equipment', action: 'sets.manage', ok: 201, call: (c) => c.post('/api/equipment', setBody()) },
  { method: 'GET', path: '/api/equipment/[id]', action: 'sets.view', ok: 200, elsewhere: 404, call: async (c, w) => c.get(`/api/equipment/${await w.set()}`) },
  { method: 'PATCH', path: '/api/equipment/[id]', action: 'sets.manage', ok: 200, elsewhere: 404, call: async (c, w) => c.patch(`/api/equipment/${await w.set()}`, { notes: 'Checked the ferrules.' }) },
  { method: 'POST', path: '/api/equipment/[id]/tests', action: 'sets.test', ok: 201, elsewhere: 404, call: async (c, w) => c.post(`/api/equipment/${await w.set()}/tests`, { testedOn: today(), resistanceMilliohms: 0.8, limitMilliohms: 1.5 }) },
  { method: 'POST', path: '/api/equipment/import', action: 'sets.manage', ok: 200, call: (c) => postCsv(c, csv()) },
  { method: 'GET', path: '/api/equipment/export.csv', action: 'sets.view', ok: 200, call: (c) => c.get('/api/equipment/export.csv') },
  { method: 'GET', path: '/api/equipment/settings', action: 'sets.view', ok: 200, call: (c) => c.get('/api/equipment/settings') },
  { method: 'PUT', path: '/api/equipment/settings', action: 'settings.edit', ok: 200, call: (c) => c.put('/api/equipment/settings', { testIntervalMonths: 12 }) },
  { method: 'POST', path: '/equipment', action: 'sets.manage', form: true, ok: '303 /equipment/:id', refused: '403', call: (c) => form(c, '/equipment', { action: 'add', ...Object.fromEntries(Object.entries(setBody()).map(([k, v]) => [k, String(v)])) }) },
  { method: 'POST', path: '/equipment/[id]', variant: 'test', action: 'sets.test', form: true, ok: '200 done', refused: '403', elsewhere: '404', read: said('Test recorded'), call: async (c, w) => form(c, `/equipment/${await w.set()}`, { action: 'test', testedOn: today(), resistanceMilliohms: '0.8', limitMilliohms: '1.5' }) },
  { method: 'POST', path: '/equipment/[id]', variant: 'status', action: 'sets.manage', form: true, ok: '200 done', refused: '403', elsewhere: '404', read: said('Status changed'), call: async (c, w) => form(c, `/equipment/${await w.set()}`, { action: 'status', status: 'out-of-service', statusReason: 'Invented reason' }) },
  { method: 'POST', path: '/equipment/settings', action: 'settings.edit', form: true, ok: '200 done', refused: '403', read: said('Saved'), call: (c) => form(c, '/equipment/settings', { testIntervalMonths: '12', limits: '' }) },

  // Field records.
  { method: 'POST', path: '/api/plans/[id]/records', action: 'records.write', ok: 201, elsewhere: 404, call: async (c, w) => c.post(`/api/plans/${await w.recordPlan()}/records`) },
  { method: 'POST', path: '/records/start', action: 'records.write', form: true, ok: '303 /records/:id', refused: '303 problem=ROLE_REQUIRED', elsewhere: '303 problem=NOT_FOUND', call: async (c, w) => form(c, '/records/start', { planId: String(await w.recordPlan()) }) },
  { method: 'GET', path: '/api/records', action: 'records.view', ok: 200, call: (c) => c.get('/api/records') },
  { method: 'GET', path: '/api/records/[id]', variant: 'open', action: 'records.view-open', ok: 200, elsewhere: 404, call: async (c, w) => c.get(`/api/records/${await w.openRecord()}`) },
  { method: 'GET', path: '/api/records/[id]', variant: 'closed', action: 'records.view', ok: 200, elsewhere: 404, call: async (c, w) => c.get(`/api/records/${(await w.closedRecord()).id}`) },
  { method: 'GET', path: '/api/records/[id]/pdf', action: 'records.view', ok: 200, elsewhere: 404, call: async (c, w) => c.getRaw(`/api/records/${(await w.closedRecord()).id}/pdf`) },
  { method: 'GET', path: '/api/records/[id]/photos/[photoId]', action: 'records.view', ok: 200, elsewhere: 404, call: async (c, w) => c.getRaw((await w.closedRecord()).photoUrl) },
  { method: 'POST', path: '/api/records/[id]/photos', action: 'records.write', ok: 201, elsewhere: 404, call: async (c, w) => upload(c, await w.openRecord(), await pngBytes(), 'p.png', 'image/png') },
  { method: 'POST', path: '/api/records/[id]/entries', action: 'records.write', ok: 201, elsewhere: 404, call: async (c, w) => c.post(`/api/records/${await w.openRecord()}/entries`, entry('note', { text: 'matrix' })) },
  { method: 'POST', path: '/api/records/[id]/close', action: 'records.write', ok: 200, elsewhere: 404, call: async (c, w) => c.post(`/api/records/${await w.openRecord()}/close`) },

  // Practice.
  { method: 'GET', path: '/api/exercises', action: 'practice.view', ok: 200, call: (c) => c.get('/api/exercises') },
  {
    method: 'POST', path: '/api/exercises', action: 'practice.manage', ok: 201, elsewhere: 404,
    call: async (c, w) => {
      const plan = await w.practicePlan();
      return c.post('/api/exercises', { planId: plan.id, revision: plan.revision, kind: 'find', prompt: 'Find the gap', removeLinks: ['jC'] });
    },
  },
  { method: 'POST', path: '/api/exercises/propose', action: 'practice.manage', ok: 200, elsewhere: 404, call: async (c, w) => c.post('/api/exercises/propose', { planId: (await w.practicePlan()).id }) },
  { method: 'GET', path: '/api/exercises/[id]', action: 'practice.view', ok: 200, elsewhere: 404, call: async (c, w) => c.get(`/api/exercises/${await w.exercise()}`) },
  { method: 'PATCH', path: '/api/exercises/[id]', action: 'practice.manage', ok: 200, elsewhere: 404, call: async (c, w) => c.patch(`/api/exercises/${await w.exercise()}`, { published: true }) },
  { method: 'POST', path: '/api/exercises/[id]/attempts', action: 'practice.take', ok: 201, elsewhere: 404, call: async (c, w) => c.post(`/api/exercises/${await w.exercise()}/attempts`, { answer: { elements: ['B'] } }) },
  { method: 'GET', path: '/api/exercises/progress', action: 'practice.manage', ok: 200, call: (c) => c.get('/api/exercises/progress') },
  { method: 'GET', path: '/api/exercises/progress.csv', action: 'practice.manage', ok: 200, call: (c) => c.get('/api/exercises/progress.csv') },
];

/** The name a cell is listed under. */
export const routeName = (r: RouteCase) => `${r.method} ${r.path}${r.variant ? ` (${r.variant})` : ''}`;

/** What the route's answer was, for comparison with the expected outcome. */
export async function outcomeOf(route: RouteCase, answer: ApiResponse | Response): Promise<{ outcome: Outcome; body: unknown }> {
  if (answer instanceof Response) return { outcome: answer.status, body: null };
  if (route.read) return { outcome: route.read(answer), body: answer.body };
  return { outcome: route.form ? formOutcome(answer) : answer.status, body: answer.body };
}

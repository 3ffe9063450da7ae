/**
 * Generated bodies over real HTTP (fast-check): FUZZ_RUNS bodies for every mutating route, API
 * and form pages alike, sent in turn from anonymous and from every role. Holds: no 5xx, no hang,
 * and the database unchanged (row counts, and a checksum of plans and revisions) across every
 * batch in which no answer was a 2xx or a form's redirect onward.
 */
import { randomBytes } from 'node:crypto';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, Client, signedIn } from '../helpers/api';
import { closeTestDb, makePerson, makeTeam, PASSWORD, planDocument, testDb } from '../helpers/factories';
import { setBody, uniqueTag } from '../helpers/equipment';
import { documents, formBodies, jsonBodies, photoBodies, type FuzzBody } from '../helpers/fuzz-bodies';
import { approvedPlan } from '../helpers/practice';
import { waitForSteady } from '../helpers/wait';

const RUNS = Number(process.env.FUZZ_RUNS ?? 1000);
const BATCH = 50;
const CONCURRENCY = 16;
const HANG_MS = 15_000;
// A route's 1,000 bodies took about 8 s on this machine under a load average of 10. A route that
// overran would leave requests running into the next route's database snapshots.
const ROUTE_TIMEOUT_MS = 180_000;
const SEED = Number(process.env.FUZZ_SEED ?? Date.now() % 2 ** 31);
const ORIGIN = new URL(BASE_URL).origin;

type Role = 'anonymous' | 'apprentice' | 'lead' | 'reviewer' | 'admin';
const ROLES: Role[] = ['anonymous', 'apprentice', 'lead', 'reviewer', 'admin'];
let clients: Record<Role, Client>;
let ids: { draft: number; submitted: number; comment: number; spare: string; approved: number; set: number; record: number; exercise: number };

beforeAll(async () => {
  const team = await makeTeam();
  clients = {
    anonymous: new Client(),
    apprentice: await signedIn(team.apprentice.email, PASSWORD),
    lead: await signedIn(team.lead.email, PASSWORD),
    reviewer: await signedIn(team.reviewer.email, PASSWORD),
    admin: await signedIn(team.admin.email, PASSWORD),
  };
  const draft = (await clients.lead.post('/api/plans', { title: 'Invented fuzz draft', document: planDocument() })).body.plan.id;
  const submitted = (await clients.lead.post('/api/plans', { title: 'Invented fuzz submitted', document: planDocument() })).body.plan.id;
  await clients.lead.post(`/api/plans/${submitted}/submit`);
  const comment = (await clients.reviewer.post(`/api/plans/${submitted}/comments`, { body: 'Invented comment' })).body.comment?.id ?? 1;
  const spare = (await makePerson(team.organizationId, 'apprentice')).id;
  // The later routes: a grounding set, an open field record on an approved plan, a published exercise.
  const set = (await clients.admin.post('/api/equipment', setBody({ tag: uniqueTag('FZ') }))).body.set?.id ?? (await clients.admin.get('/api/equipment')).body.items[0]?.id ?? 1;
  const approved = await approvedPlan(clients.lead, clients.reviewer);
  const record = (await clients.lead.post(`/api/plans/${approved.id}/records`, {})).body.id ?? 1;
  const exercise = (await clients.reviewer.post('/api/exercises', { planId: approved.id, revision: approved.revision, kind: 'find', prompt: 'Invented fuzz exercise', removeLinks: ['jBK'] })).body.exercise?.id ?? 1;
  ids = { draft, submitted, comment, spare, approved: approved.id, set, record, exercise };
});
afterAll(closeTestDb);

interface Route {
  method: string;
  path: () => string;
  bodies: () => fc.Arbitrary<FuzzBody>;
  /** Roles that must not send it (it would end their session for the rest of the test). */
  skip?: Role[];
  /** The route does work after answering (a reset link), which must settle before the next snapshot. */
  afterAnswer?: boolean;
}

const planKeys = { document: documents, expectedRevision: fc.integer({ min: 0, max: 4 }) };
const routes: Record<string, Route> = {
  'POST /api/auth/login': { method: 'POST', path: () => '/api/auth/login', bodies: () => jsonBodies(['email', 'password']) },
  'POST /api/auth/logout': { method: 'POST', path: () => '/api/auth/logout', bodies: () => jsonBodies([]), skip: ['apprentice', 'lead', 'reviewer', 'admin'] },
  'POST /api/auth/forgot': { method: 'POST', path: () => '/api/auth/forgot', bodies: () => jsonBodies(['email']), afterAnswer: true },
  'POST /api/auth/set-password': { method: 'POST', path: () => '/api/auth/set-password', bodies: () => jsonBodies(['token', 'password']) },
  'POST /api/plans': { method: 'POST', path: () => '/api/plans', bodies: () => jsonBodies(['title', 'structure', 'document'], planKeys) },
  'PUT /api/plans/:id': { method: 'PUT', path: () => `/api/plans/${ids.draft}`, bodies: () => jsonBodies(['expectedRevision', 'title', 'structure', 'document'], planKeys) },
  'POST /api/check': { method: 'POST', path: () => '/api/check', bodies: () => fc.oneof(documents.map((d) => ({ contentType: 'application/json', body: JSON.stringify(d) })), jsonBodies(['format', 'version', 'title', 'system', 'criteria', 'nodes', 'links'])) },
  'POST /api/plans/:id/check': { method: 'POST', path: () => `/api/plans/${ids.draft}/check`, bodies: () => jsonBodies([]) },
  'POST /api/plans/:id/submit': { method: 'POST', path: () => `/api/plans/${ids.draft}/submit`, bodies: () => jsonBodies([]) },
  'POST /api/plans/:id/review': { method: 'POST', path: () => `/api/plans/${ids.submitted}/review`, bodies: () => jsonBodies(['decision', 'comment', 'teachingNote', 'revision']) },
  'POST /api/plans/:id/reopen': { method: 'POST', path: () => `/api/plans/${ids.submitted}/reopen`, bodies: () => jsonBodies([]) },
  'POST /api/plans/:id/comments': { method: 'POST', path: () => `/api/plans/${ids.submitted}/comments`, bodies: () => jsonBodies(['body', 'elementId', 'replyTo'], { replyTo: fc.oneof(fc.constant(ids?.comment ?? 1), fc.integer()) }) },
  'PATCH /api/plans/:id/comments/:cid': { method: 'PATCH', path: () => `/api/plans/${ids.submitted}/comments/${ids.comment}`, bodies: () => jsonBodies(['resolved']) },
  'POST /api/admin/users': { method: 'POST', path: () => '/api/admin/users', bodies: () => jsonBodies(['email', 'name', 'role']) },
  'PATCH /api/admin/users/:id': { method: 'PATCH', path: () => `/api/admin/users/${ids.spare}`, bodies: () => jsonBodies(['role', 'disabled']) },
  'POST /login': { method: 'POST', path: () => '/login?next=/plans', bodies: () => formBodies(['email', 'password']) },
  'POST /forgot-password': { method: 'POST', path: () => '/forgot-password', bodies: () => formBodies(['email']), afterAnswer: true },
  'POST /set-password/:t': { method: 'POST', path: () => `/set-password/${randomBytes(12).toString('base64url')}`, bodies: () => formBodies(['password', 'confirm']) },
  'POST /plans/new': { method: 'POST', path: () => '/plans/new', bodies: () => formBodies(['starter', 'title', 'structure', 'nominalKv', 'frequencyHz', 'faultKa', 'clearingCycles', 'xOverR', 'phaseSpacingM'], { starter: fc.constantFrom('empty', 'x') }) },
  'POST /plans/:id/review': { method: 'POST', path: () => `/plans/${ids.submitted}/review`, bodies: () => formBodies(['action', 'decision', 'comment', 'teachingNote', 'revision', 'body', 'elementId', 'replyTo'], { action: fc.constantFrom('decide', 'comment', 'reply'), replyTo: fc.constant(String(ids?.comment ?? 1)) }) },
  'POST /plans/:id/workflow': { method: 'POST', path: () => `/plans/${ids.draft}/workflow`, bodies: () => formBodies(['action', 'commentId', 'replyTo', 'body'], { action: fc.constantFrom('submit', 'reopen', 'resolve', 'unresolve', 'reply'), commentId: fc.constant(String(ids?.comment ?? 1)), replyTo: fc.constant(String(ids?.comment ?? 1)) }) },
  'POST /admin/users': { method: 'POST', path: () => '/admin/users', bodies: () => formBodies(['action', 'email', 'name', 'role', 'id'], { action: fc.constantFrom('invite', 'role', 'disable', 'enable'), id: fc.constant(ids?.spare ?? 'x') }) },
  'POST /logout': { method: 'POST', path: () => '/logout', bodies: () => formBodies([]), skip: ['apprentice', 'lead', 'reviewer', 'admin'] },
  'POST /settings': { method: 'POST', path: () => '/settings', bodies: () => formBodies(['timeZone', 'paperSize', 'units'], { timeZone: fc.constantFrom('UTC', 'America/Chicago', 'Nowhere/Invented'), paperSize: fc.constantFrom('letter', 'a4', 'x'), units: fc.constantFrom('imperial', 'metric', 'x') }) },
  'POST /equipment': { method: 'POST', path: () => '/equipment', bodies: () => formBodies(['action', 'tag', 'description', 'cable', 'lengthM', 'clampKind', 'clampKa', 'connection', 'inServiceOn', 'csv'], { action: fc.constantFrom('add', 'import', 'x') }) },
  'POST /equipment/:id': { method: 'POST', path: () => `/equipment/${ids.set}`, bodies: () => formBodies(['action', 'testedOn', 'resistanceMilliohms', 'limitMilliohms', 'status', 'statusReason', 'faultOn'], { action: fc.constantFrom('test', 'status', 'fault', 'x') }) },
  'POST /equipment/settings': { method: 'POST', path: () => '/equipment/settings', bodies: () => formBodies(['testIntervalMonths', 'limits']) },
  'POST /records/start': { method: 'POST', path: () => '/records/start', bodies: () => formBodies(['planId'], { planId: fc.constantFrom(String(ids?.draft ?? 1), String(ids?.approved ?? 1), '0', 'x') }) },
  'POST /api/equipment': { method: 'POST', path: () => '/api/equipment', bodies: () => jsonBodies(['tag', 'description', 'cable', 'lengthM', 'clampKind', 'clampKa', 'clampCycles', 'connection', 'inServiceOn', 'status', 'notes']) },
  'PATCH /api/equipment/:id': { method: 'PATCH', path: () => `/api/equipment/${ids.set}`, bodies: () => jsonBodies(['description', 'status', 'statusReason', 'faultOn', 'notes']) },
  'POST /api/equipment/:id/tests': { method: 'POST', path: () => `/api/equipment/${ids.set}/tests`, bodies: () => jsonBodies(['testedOn', 'resistanceMilliohms', 'limitMilliohms', 'passed', 'notes']) },
  'POST /api/equipment/import': { method: 'POST', path: () => '/api/equipment/import', bodies: () => fc.oneof(fc.string({ maxLength: 400 }).map((t) => ({ contentType: 'text/csv', body: `tag,cable\n${t}` })), jsonBodies(['tag'])) },
  'PUT /api/equipment/settings': { method: 'PUT', path: () => '/api/equipment/settings', bodies: () => jsonBodies(['testIntervalMonths', 'limits']) },
  'POST /api/plans/:id/records': { method: 'POST', path: () => `/api/plans/${ids.draft}/records`, bodies: () => jsonBodies(['workDate', 'location', 'clearanceRef', 'detector']) },
  'POST /api/records/:id/entries': { method: 'POST', path: () => `/api/records/${ids.record}/entries`, bodies: () => jsonBodies(['clientId', 'at', 'type', 'people', 'visitors', 'item', 'by', 'detector', 'phases', 'link', 'setTag', 'groundEndFirst', 'text'], { type: fc.constantFrom('sign-on', 'briefing', 'voltage-test', 'install', 'remove', 'deviation', 'note', 'x') }) },
  'POST /api/records/:id/photos': { method: 'POST', path: () => `/api/records/${ids.record}/photos`, bodies: photoBodies },
  'POST /api/records/:id/close': { method: 'POST', path: () => `/api/records/${ids.record}/close`, bodies: () => jsonBodies([]) },
  'POST /api/exercises': { method: 'POST', path: () => '/api/exercises', bodies: () => jsonBodies(['planId', 'revision', 'kind', 'removeLinks', 'changeLinks', 'prompt', 'teachingNote', 'published']) },
  'POST /api/exercises/propose': { method: 'POST', path: () => '/api/exercises/propose', bodies: () => jsonBodies(['planId', 'revision']) },
  'PATCH /api/exercises/:id': { method: 'PATCH', path: () => `/api/exercises/${ids.exercise}`, bodies: () => jsonBodies(['published']) },
  'PUT /api/organisation/settings': { method: 'PUT', path: () => '/api/organisation/settings', bodies: () => jsonBodies(['timeZone', 'paperSize', 'units']) },
  'POST /api/plans/:id/withdraw': { method: 'POST', path: () => `/api/plans/${ids.submitted}/withdraw`, bodies: () => jsonBodies([]) },
  'POST /api/exercises/:id/attempts': { method: 'POST', path: () => `/api/exercises/${ids.exercise}/attempts`, bodies: () => jsonBodies(['answer']) },
};

const COUNTED = ['organizations', 'users', 'plans', 'plan_revisions', 'plan_comments', 'plan_decisions', 'password_tokens', 'grounding_sets', 'set_tests', 'set_events', 'organization_settings', 'field_records', 'field_record_entries', 'field_record_photos', 'practice_exercises', 'practice_attempts'];

/** Row counts and a checksum of the plans and revisions, as one comparable string. */
async function snapshot(): Promise<string> {
  const db = testDb().sequelize;
  const counts = await Promise.all(COUNTED.map(async (t) => `${t}=${((await db.query(`SELECT COUNT(*) AS n FROM \`${t}\``, { plain: true })) as { n: number }).n}`));
  const sums = (await db.query('CHECKSUM TABLE plans, plan_revisions', { type: 'SELECT' })) as Array<{ Checksum: string }>;
  return [...counts, ...sums.map((s) => s.Checksum)].join(' ');
}

/**
 * Whether an answer may have changed the database: a 2xx, or a form page's redirect onward (a
 * redirect to sign-in, or back with `problem=`, is a refusal).
 */
function mayChange(status: number, location: string | null): boolean {
  if (status >= 200 && status < 300) return true;
  if (status >= 300 && status < 400) return !!location && !location.startsWith('/login') && !location.includes('problem=');
  return false;
}

async function send(role: Role, route: Route, body: FuzzBody, n: number): Promise<{ status: number; location: string | null }> {
  const headers: Record<string, string> = { origin: ORIGIN, 'x-forwarded-for': `203.0.113.${n % 200}` };
  if (body.contentType) headers['content-type'] = body.contentType;
  const started = Date.now();
  try {
    const r = await Promise.race([
      clients[role].request(route.method, route.path(), { body: body.body, headers }),
      new Promise<never>((_, reject) => setTimeout(() => reject(new Error(`hang: no answer in ${HANG_MS} ms`)), HANG_MS)),
    ]);
    return { status: r.status, location: r.headers.get('location') };
  } catch (error) {
    throw new Error(`${role} ${route.method} ${route.path()} after ${Date.now() - started} ms: ${(error as Error).message}\nbody (${body.contentType}): ${body.body.slice(0, 300)}`);
  }
}

describe(`generated bodies over HTTP (${RUNS} a route, seed ${SEED})`, () => {
  for (const [name, route] of Object.entries(routes)) {
    it(name, async () => {
      const samples = fc.sample(route.bodies(), { numRuns: RUNS, seed: SEED });
      const roles = ROLES.filter((r) => !route.skip?.includes(r));
      const failures: string[] = [];
      const statuses = new Map<number, number>();
      for (let start = 0; start < samples.length; start += BATCH) {
        const before = await snapshot();
        const batch = samples.slice(start, start + BATCH);
        let changing = 0;
        let next = 0;
        await Promise.all(
          Array.from({ length: CONCURRENCY }, async () => {
            while (next < batch.length) {
              const i = next++;
              const role = roles[(start + i) % roles.length];
              const { status, location } = await send(role, route, batch[i], start + i);
              statuses.set(status, (statuses.get(status) ?? 0) + 1);
              if (status >= 500) failures.push(`${status} from ${role}: (${batch[i].contentType}) ${batch[i].body.slice(0, 300)}`);
              if (mayChange(status, location)) changing += 1;
            }
          }),
        );
        if (changing === 0) {
          expect(await snapshot(), `${name}: the database changed in a batch with no 2xx answer or redirect onward`).toBe(before);
        } else if (route.afterAnswer) {
          await waitForSteady(snapshot, { quiet: 200, what: 'work done after the answer (reset links)' });
        }
      }
      console.info(`${name}: ${[...statuses].sort((a, b) => a[0] - b[0]).map(([s, n]) => `${n}×${s}`).join(' ')}`);
      expect(failures.slice(0, 5), `${failures.length} × 5xx; statuses ${JSON.stringify([...statuses])}`).toEqual([]);
    }, ROUTE_TIMEOUT_MS);
  }
});

/**
 * API benchmark: Bondmap's `GET /api/plans` (400 plans, one signed-in session) against a bare
 * `node:http` + `mariadb` server that answers the same page for the same session with the same
 * queries and byte-identical JSON, both driven by autocannon on loopback, alternated A B A B so
 * a noisy neighbour on the shared machine hits both alike. Also `/api/health` against a bare
 * `SELECT 1`, and the p99 of one plan (`GET /api/plans/:id`). Prints figures; asserts nothing.
 *
 *   BONDMAP_TEST_URL=http://127.0.0.1:4395 BONDMAP_DB_…=… npx tsx bench/api.ts
 */
import autocannon from 'autocannon';
import { hash } from '@node-rs/argon2';
import { createHash, randomBytes } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { createPool, type Pool } from 'mariadb';
import { createDb } from '@db/connection';
import { readDbConfig } from '@db/config';
import { generatePlan } from './generate-plan';

export interface ApiBenchResult {
  apiPlansRps: number;
  baselinePlansRps: number;
  apiPlansRatio: number;
  apiPlansP50Ms: number;
  apiPlansP99Ms: number;
  baselinePlansP50Ms: number;
  baselinePlansP99Ms: number;
  apiHealthRps: number;
  baselineHealthRps: number;
  planPageRps: number;
  planPageP99Ms: number;
}

const PLANS = 400;
const CONNECTIONS = 50;
const SECONDS = Number(process.env.BONDMAP_BENCH_API_SECONDS ?? 8);

/** Seeds an organisation with a signed-in crew lead and 400 plans; returns the cookie and one plan id. */
async function seed(baseUrl: string): Promise<{ cookie: string; planId: number }> {
  const db = createDb({ ...readDbConfig(), poolMax: 2 });
  try {
    const tag = randomBytes(4).toString('hex');
    const org = await db.models.Organization.create({ name: `Bench organisation ${tag}`, slug: `bench-${tag}` });
    const email = `bench-lead-${tag}@example.test`;
    const password = `bench-password-${tag}`;
    await db.models.User.create({ id: `bench${tag}`, organizationId: org.id, email, name: 'Invented bench lead', role: 'crew_lead', passwordHash: await hash(password, { memoryCost: 19456, timeCost: 2, parallelism: 1 }) });
    const login = await fetch(`${baseUrl}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) });
    if (!login.ok) throw new Error(`bench sign-in failed: ${login.status}`);
    const cookie = login.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
    const created = await fetch(`${baseUrl}/api/plans`, { method: 'POST', headers: { 'content-type': 'application/json', cookie }, body: JSON.stringify({ title: 'Bench plan 1', document: generatePlan({ elements: 60, seed: 7 }) }) });
    if (created.status !== 201) throw new Error(`creating the bench plan failed: ${created.status}`);
    const first = (await created.json()).plan as { id: number };
    const plan = await db.models.Plan.findByPk(first.id);
    const revision = await db.models.PlanRevision.findOne({ where: { planId: first.id } });
    if (!plan || !revision) throw new Error('the bench plan was not stored');
    const base = plan.get({ plain: true }) as unknown as Record<string, unknown>;
    const rows = Array.from({ length: PLANS - 1 }, (_, k) => {
      const { id: _id, ...rest } = base;
      void _id;
      return { ...rest, title: `Bench plan ${k + 2}`, updatedAt: new Date(Date.now() - (k + 1) * 60_000), createdAt: new Date(Date.now() - (k + 1) * 60_000) };
    });
    const made = await db.models.Plan.bulkCreate(rows as never[]);
    const rev = revision.get({ plain: true }) as unknown as Record<string, unknown>;
    await db.models.PlanRevision.bulkCreate(made.map((p) => ({ ...rev, id: undefined, planId: p.id })) as never[]);
    return { cookie, planId: first.id };
  } finally {
    await db.sequelize.close();
  }
}

const SESSION_SQL = `SELECT s.user_id AS userId, UNIX_TIMESTAMP(s.expires_at) * 1000 AS expiresMs, u.organization_id AS organizationId, u.disabled
  FROM sessions s JOIN users u ON u.id = s.user_id LEFT JOIN organizations o ON o.id = u.organization_id WHERE s.id = ?`;
const LIST_SQL = `SELECT p.id, p.title, p.structure, p.status, p.blockers, p.warnings, p.author_id AS authorId, u.name AS authorName,
  p.current_revision AS currentRevision, p.submitted_at AS submittedAt, p.created_at AS createdAt, p.updated_at AS updatedAt, COUNT(*) OVER () AS total
  FROM plans p LEFT JOIN users u ON u.id = p.author_id WHERE p.organization_id = ? ORDER BY p.updated_at DESC, p.id DESC LIMIT 20 OFFSET 0`;

/** The bare server: the session look-up and the page, no framework. */
async function startBaseline(pool: Pool): Promise<Server> {
  const server = createServer((req, res) => {
    const send = (status: number, body: string) => {
      res.writeHead(status, { 'content-type': 'application/json' });
      res.end(body);
    };
    (async () => {
      if (req.url === '/api/health') {
        await pool.query('SELECT 1 AS up');
        return send(200, JSON.stringify({ ok: true, db: 'up' }));
      }
      const token = /(?:^|;\s*)bondmap_session=([^;]+)/.exec(req.headers.cookie ?? '')?.[1];
      if (!token) return send(401, '{}');
      const [session] = await pool.query(SESSION_SQL, [createHash('sha256').update(token).digest('hex')]);
      if (!session || Number(session.expiresMs) <= Date.now() || Number(session.disabled)) return send(401, '{}');
      const rows = await pool.query(LIST_SQL, [session.organizationId]);
      const total = rows.length ? Number(rows[0].total) : 0;
      const items = rows.map((r: Record<string, never>) => ({
        id: r.id, title: r.title, structure: r.structure, status: r.status, blockers: r.blockers, warnings: r.warnings,
        author: { id: r.authorId, name: r.authorName ?? '' }, currentRevision: r.currentRevision,
        submittedAt: r.submittedAt ? (r.submittedAt as Date).toISOString() : null, createdAt: (r.createdAt as Date).toISOString(), updatedAt: (r.updatedAt as Date).toISOString(),
      }));
      send(200, JSON.stringify({ items, total, page: 1, pageSize: 20, pages: Math.max(1, Math.ceil(total / 20)) }));
    })().catch((error) => send(500, JSON.stringify({ error: String(error) })));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return server;
}

interface Load { rps: number; p50: number; p99: number }

async function load(url: string, cookie: string, seconds: number): Promise<Load> {
  const result = await autocannon({ url, connections: CONNECTIONS, duration: seconds, headers: { cookie } });
  if (result.non2xx || result.errors) throw new Error(`${url}: ${result.non2xx} non-2xx answers, ${result.errors} errors under load`);
  return { rps: result.requests.average, p50: result.latency.p50, p99: result.latency.p99 };
}

const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;

/** A then B, twice over; each side's figures are the means of its two runs. */
async function alternate(a: string, b: string, cookie: string, seconds: number): Promise<[Load, Load]> {
  const runs: Load[][] = [[], []];
  for (let round = 0; round < 2; round++) {
    runs[0].push(await load(a, cookie, seconds));
    runs[1].push(await load(b, cookie, seconds));
  }
  return runs.map((r) => ({ rps: mean(r.map((x) => x.rps)), p50: mean(r.map((x) => x.p50)), p99: mean(r.map((x) => x.p99)) })) as [Load, Load];
}

export async function runApiBench(baseUrl: string): Promise<ApiBenchResult> {
  const { cookie, planId } = await seed(baseUrl);
  const config = readDbConfig();
  const pool = createPool({ host: config.host, port: config.port, user: config.user, password: config.password, database: config.database, connectionLimit: config.poolMax, timezone: 'Z' });
  const server = await startBaseline(pool);
  try {
    const bare = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    const [mine, theirs] = await Promise.all([`${baseUrl}/api/plans`, `${bare}/api/plans`].map((u) => fetch(u, { headers: { cookie } }).then((r) => r.text())));
    if (mine !== theirs) throw new Error(`the baseline's page differs from Bondmap's:\n${mine.slice(0, 300)}\n${theirs.slice(0, 300)}`);
    await load(`${baseUrl}/api/plans`, cookie, 2); // warm both before timing either
    await load(`${bare}/api/plans`, cookie, 2);
    const [app, baseline] = await alternate(`${baseUrl}/api/plans`, `${bare}/api/plans`, cookie, SECONDS);
    const [appHealth, bareHealth] = await alternate(`${baseUrl}/api/health`, `${bare}/api/health`, '', Math.max(2, Math.round(SECONDS / 2)));
    const planPage = await load(`${baseUrl}/api/plans/${planId}`, cookie, SECONDS);
    const r1 = (x: number) => Math.round(x * 10) / 10;
    return {
      apiPlansRps: r1(app.rps), baselinePlansRps: r1(baseline.rps), apiPlansRatio: Math.round((app.rps / baseline.rps) * 100) / 100,
      apiPlansP50Ms: r1(app.p50), apiPlansP99Ms: r1(app.p99), baselinePlansP50Ms: r1(baseline.p50), baselinePlansP99Ms: r1(baseline.p99),
      apiHealthRps: r1(appHealth.rps), baselineHealthRps: r1(bareHealth.rps), planPageRps: r1(planPage.rps), planPageP99Ms: r1(planPage.p99),
    };
  } finally {
    server.close();
    await pool.end();
  }
}

export function printApiBench(r: ApiBenchResult): void {
  console.log(`API under autocannon, ${CONNECTIONS} connections, ${SECONDS} s a run, A B A B (means of two runs each):`);
  console.log(`  GET /api/plans (${PLANS} plans)  Bondmap ${r.apiPlansRps} req/s, p50 ${r.apiPlansP50Ms} ms, p99 ${r.apiPlansP99Ms} ms   (goal p99 < 50 ms)`);
  console.log(`  bare node:http + mariadb        ${r.baselinePlansRps} req/s, p50 ${r.baselinePlansP50Ms} ms, p99 ${r.baselinePlansP99Ms} ms`);
  console.log(`  ratio                           ${r.apiPlansRatio}×   (goal ≥ 0.5×)`);
  console.log(`  GET /api/health                 Bondmap ${r.apiHealthRps} req/s, bare SELECT 1 ${r.baselineHealthRps} req/s: ${(r.apiHealthRps / r.baselineHealthRps).toFixed(2)}×`);
  console.log(`  GET /api/plans/:id (60 elements) ${r.planPageRps} req/s, p99 ${r.planPageP99Ms} ms   (goal p99 < 50 ms)`);
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const base = process.env.BONDMAP_TEST_URL;
  if (!base) {
    console.error('Set BONDMAP_TEST_URL to a running Bondmap server and BONDMAP_DB_* to its database.');
    process.exit(2);
  }
  runApiBench(base).then(async (r) => {
    printApiBench(r);
    if (process.env.BONDMAP_BENCH_OUT) (await import('node:fs')).writeFileSync(process.env.BONDMAP_BENCH_OUT, JSON.stringify(r));
  }, (err) => {
    console.error(err);
    process.exit(1);
  });
}

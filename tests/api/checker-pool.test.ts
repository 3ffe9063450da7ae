/**
 * The checker runs in worker threads of the built server: a large check never stalls other
 * requests, a check past its time budget is stopped with 422 CHECK_TIMEOUT, and a stale save is
 * refused before any check is spent on it.
 */
import type { ChildProcess } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { generatePlan } from '../../bench/generate-plan';
import { freePort, startServer } from '../../scripts/lib.mjs';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeTeam, PASSWORD, planDocument } from '../helpers/factories';
import { healthWhile } from '../helpers/wait';

let team: Awaited<ReturnType<typeof makeTeam>>;
let lead: Client;
// About 12,000 elements: a check of a second or two on this machine.
const large = generatePlan({ elements: 12_000, seed: 7 });
// About 25,000 elements: under the 2 MiB body limit, and a check of several seconds.
const big = generatePlan({ elements: 25_000, seed: 7 });

beforeAll(async () => {
  team = await makeTeam();
  lead = await signedIn(team.lead.email, PASSWORD);
});
afterAll(closeTestDb);

describe('the checker off the main thread', () => {
  it('answers health requests while a large check runs', async () => {
    expect(JSON.stringify(big).length).toBeLessThan(2 * 1024 * 1024);
    // On a free event loop each health request answers at once; a check on the main thread would hold one for the check's length.
    const { answer: report, latencies, tookMs: checkMs } = await healthWhile(lead.post('/api/check', large), () => new Client().get('/api/health'));
    expect(report.status).toBe(200);
    expect(report.body.summary).toBeDefined();
    expect(latencies.length).toBeGreaterThanOrEqual(3);
    expect(Math.max(...latencies)).toBeLessThan(checkMs / 2);
  });

  it('stops a check past its time budget with 422 CHECK_TIMEOUT, and keeps serving', async () => {
    const env = Object.fromEntries(Object.entries(process.env).filter(([k]) => k.startsWith('BONDMAP_DB_'))) as Record<string, string>;
    const port = await freePort();
    const second = (await startServer({ port, env: { ...env, BONDMAP_CHECK_BUDGET_MS: '300', BONDMAP_LOG_LEVEL: 'error' }, stdio: 'ignore' })) as { child: ChildProcess; url: string };
    try {
      const client = await new Client(second.url).signIn(team.lead.email, PASSWORD);
      const r = await client.post('/api/check', big);
      expect(r.status).toBe(422);
      expect(r.body.error.code).toBe('CHECK_TIMEOUT');
      expect(r.body.error.budgetMs).toBe(300);
      expect((await client.post('/api/check', planDocument())).status).toBe(200);
      expect((await new Client(second.url).get('/api/health')).status).toBe(200);

      // A stale save and a save of a plan under review are refused before any check is spent on
      // them: with this budget, checking the large plan first would answer 422 instead of 409.
      const created = await client.post('/api/plans', { title: 'Invented stale pole', document: planDocument() });
      const id = created.body.plan.id;
      const saved = await client.put(`/api/plans/${id}`, { expectedRevision: 1, document: planDocument({ title: 'Invented stale pole, second' }) });
      expect(saved.status).toBe(200);
      const stale = await client.put(`/api/plans/${id}`, { expectedRevision: 1, document: big });
      expect(stale.status).toBe(409);
      expect(stale.body.error.code).toBe('STALE_REVISION');
      const current = (await client.get(`/api/plans/${id}`)).body.plan.currentRevision;
      const locked = await client.put(`/api/plans/${id}`, { expectedRevision: current + 5, document: big });
      expect(locked.status).toBe(409);
    } finally {
      second.child.kill('SIGTERM');
    }
  });
});

/**
 * The database goes away and comes back: every endpoint answers 503 JSON meanwhile (pages a 503
 * page), and the running server recovers by itself, with sessions intact, without a restart.
 */
import { afterAll, expect, it } from 'vitest';
import { startDatabase, stopDatabase } from '@db/lifecycle';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeOrganization, makePerson, PASSWORD } from '../helpers/factories';
import { waitFor } from '../helpers/wait';

afterAll(async () => {
  await startDatabase('test'); // never leave the suite without its database
  await closeTestDb();
});

it('answers 503 while the database is down and recovers when it is back', async () => {
  const person = await makePerson(await makeOrganization(), 'crew_lead');
  await closeTestDb();
  const client = await signedIn(person.email, PASSWORD);
  expect((await client.get('/api/plans')).status).toBe(200);

  expect(await stopDatabase('test')).toBe(true);
  try {
    const health = await new Client().get('/api/health');
    expect(health.status).toBe(503);
    expect(health.body).toEqual({ ok: false, db: 'down' });

    const api = await client.get('/api/plans');
    expect(api.status).toBe(503);
    expect(api.body.error.code).toBe('DB_DOWN');
    expect(api.body.error.requestId).toBe(api.headers.get('x-request-id')); // the id leads to its log lines
    const write = await client.post('/api/check', {});
    expect(write.status).toBe(503);

    const page = await client.get('/plans');
    expect(page.status).toBe(503);
    expect(page.text).toContain('cannot reach its database');
    expect(page.text).toContain(`request ${page.headers.get('x-request-id')}`);
  } finally {
    await startDatabase('test');
  }

  await waitFor(async () => (await new Client().get('/api/health')).status === 200, { deadline: 20_000, every: 250, what: 'the health check to pass again' });
  const again = await client.get('/api/plans');
  expect(again.status).toBe(200);
  expect((await client.get('/api/me')).body.person.id).toBe(person.id);
});

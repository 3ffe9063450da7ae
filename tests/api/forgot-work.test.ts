/**
 * "Forgot password" does the same work for a known and an unknown e-mail before it answers: the
 * look-up, the link and the mail happen after the answer. Compared by the database queries each
 * request made before answering (the test server's Server-Timing header counts them), not by
 * wall-clock time.
 */
import { randomBytes } from 'node:crypto';
import { afterAll, expect, it } from 'vitest';
import { BASE_URL, Client } from '../helpers/api';
import { closeTestDb, makeOrganization, makePerson, testDb } from '../helpers/factories';
import { waitFor } from '../helpers/wait';

afterAll(closeTestDb);

function queriesOf(response: { headers: Headers }): number {
  const timing = response.headers.get('server-timing') ?? '';
  const match = /db;desc="queries";dur=(\d+)/.exec(timing);
  if (!match) throw new Error(`no query count in Server-Timing: "${timing}"`);
  return Number(match[1]);
}

const address = () => `192.0.2.${1 + randomBytes(1)[0] % 250}`;

it('answers a known and an unknown e-mail after the same work, and still sends the known one its link', async () => {
  const person = await makePerson(await makeOrganization(), 'crew_lead');
  const unknownEmail = `nobody-${randomBytes(4).toString('hex')}@example.test`;
  for (const via of ['api', 'page'] as const) {
    const ask = (email: string) =>
      via === 'api'
        ? new Client().request('POST', '/api/auth/forgot', { json: { email }, headers: { 'x-forwarded-for': address() } })
        : new Client().request('POST', '/forgot-password', { body: new URLSearchParams({ email }).toString(), headers: { 'content-type': 'application/x-www-form-urlencoded', origin: new URL(BASE_URL).origin, 'x-forwarded-for': address() } });
    const known = await ask(person.email);
    const unknown = await ask(unknownEmail);
    expect(known.status, via).toBe(200);
    expect(unknown.status, via).toBe(200);
    expect(queriesOf(known), via).toBe(queriesOf(unknown));
    expect(known.text.replace(/[\w-]{36}/g, '')).toBe(unknown.text.replace(/[\w-]{36}/g, ''));
  }
  // After the answer, the known person's two links were made.
  const tokens = () => testDb().models.PasswordToken.count({ where: { userId: person.id, purpose: 'reset' } });
  await waitFor(async () => (await tokens()) >= 2, { deadline: 5000, what: 'two reset links' });
  expect(await tokens()).toBe(2);
});

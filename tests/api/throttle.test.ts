/**
 * Throttling of sign-in, reset requests and set-password links (src/lib/server/throttle.ts). The
 * test server trusts X-Forwarded-For, so each test acts from addresses of its own (RFC 5737
 * documentation ranges) and never shares a bucket with the rest of the suite.
 */
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client } from '../helpers/api';
import { closeTestDb, makeOrganization, makePerson, PASSWORD, testDb } from '../helpers/factories';
import { waitFor, waitRetryAfter } from '../helpers/wait';
import { ADDRESS_FREE, EMAIL_FREE, RESETS_PER_HOUR } from '@/lib/server/throttle';

let organizationId: number;
beforeAll(async () => {
  organizationId = await makeOrganization();
});
afterAll(closeTestDb);

let next = 0;
/** A client address no other test uses. */
function freshAddress(): string {
  next += 1;
  return `198.51.${randomBytes(1)[0]}.${next % 250}`;
}

function signIn(email: string, password: string, address: string) {
  return new Client().request('POST', '/api/auth/login', { json: { email, password }, headers: { 'x-forwarded-for': address } });
}

describe('sign-in throttling', () => {
  it('counts 20 parallel wrong attempts as 20: exactly the free ones are checked, the rest wait', async () => {
    const person = await makePerson(organizationId, 'crew_lead');
    const address = freshAddress();
    const answers = await Promise.all(Array.from({ length: 20 }, (_, i) => signIn(person.email, `wrong ${i}`, address)));
    const statuses = answers.map((a) => a.status).sort();
    expect(statuses.filter((s) => s === 401)).toHaveLength(EMAIL_FREE);
    expect(statuses.filter((s) => s === 429)).toHaveLength(20 - EMAIL_FREE);
    const refused = answers.find((a) => a.status === 429)!;
    expect(refused.body.error.code).toBe('AUTH_THROTTLED');
    expect(Number(refused.headers.get('retry-after'))).toBeGreaterThanOrEqual(1);
  });

  it('a stranger cannot lock the owner out: past the free failures the owner waits seconds, not minutes', async () => {
    const person = await makePerson(organizationId, 'crew_lead');
    const stranger = freshAddress();
    for (let i = 0; i < EMAIL_FREE; i += 1) expect((await signIn(person.email, `guess ${i}`, stranger)).status).toBe(401);
    const owner = freshAddress();
    const waiting = await signIn(person.email, PASSWORD, owner);
    expect(waiting.status).toBe(429);
    const retryAfter = Number(waiting.headers.get('retry-after'));
    expect(retryAfter).toBeGreaterThanOrEqual(1);
    expect(retryAfter).toBeLessThanOrEqual(60);
    await waitRetryAfter(retryAfter);
    expect((await signIn(person.email, PASSWORD, owner)).status).toBe(200);
    // The right password cleared the e-mail's failures.
    expect((await signIn(person.email, 'wrong again', stranger)).status).toBe(401);
  });

  it('stops a sprayer: one address trying many e-mails is blocked, another address is not', async () => {
    const sprayer = freshAddress();
    const answers = [];
    for (let i = 0; i < 40; i += 1) answers.push((await signIn(`sprayed-${randomBytes(4).toString('hex')}@example.test`, 'Winter2026!', sprayer)).status);
    expect(answers.filter((s) => s === 401)).toHaveLength(ADDRESS_FREE);
    expect(answers.filter((s) => s === 429)).toHaveLength(40 - ADDRESS_FREE);
    const blocked = await signIn('another-one@example.test', 'x', sprayer);
    expect(Number(blocked.headers.get('retry-after'))).toBeGreaterThan(13 * 60);
    const person = await makePerson(organizationId, 'reviewer');
    expect((await signIn(person.email, PASSWORD, freshAddress())).status).toBe(200);
  });

  it('a successful sign-in does not count against its address', async () => {
    const person = await makePerson(organizationId, 'apprentice');
    const address = freshAddress();
    for (let i = 0; i < ADDRESS_FREE + 5; i += 1) expect((await signIn(person.email, PASSWORD, address)).status).toBe(200);
  });

  it('counts only the current window: a window that ended frees the e-mail', async () => {
    const person = await makePerson(organizationId, 'crew_lead');
    const address = freshAddress();
    for (let i = 0; i < EMAIL_FREE; i += 1) await signIn(person.email, 'wrong', address);
    expect((await signIn(person.email, PASSWORD, address)).status).toBe(429);
    await testDb().sequelize.query('UPDATE throttle_buckets SET window_started = ? WHERE bucket LIKE ?', { replacements: [new Date(Date.now() - 16 * 60_000), 'signin:%'] });
    expect((await signIn(person.email, PASSWORD, address)).status).toBe(200);
  });

  it('the sign-in page is throttled the same way', async () => {
    const person = await makePerson(organizationId, 'crew_lead');
    const address = freshAddress();
    const post = (password: string) =>
      new Client().request('POST', '/login', {
        body: new URLSearchParams({ email: person.email, password }).toString(),
        headers: { 'content-type': 'application/x-www-form-urlencoded', origin: new URL(process.env.BONDMAP_TEST_URL!).origin, 'x-forwarded-for': address },
      });
    const statuses = await Promise.all(Array.from({ length: 8 }, (_, i) => post(`wrong ${i}`).then((r) => r.status)));
    expect(statuses.filter((s) => s === 401)).toHaveLength(EMAIL_FREE);
    const page = await post(PASSWORD);
    expect(page.status).toBe(429);
    expect(page.text).toContain('Too many failed sign-ins');
  });
});

describe('reset and set-password throttling', () => {
  it(`sends at most ${RESETS_PER_HOUR} reset links an hour for one e-mail, and answers the same for an unknown one`, async () => {
    const person = await makePerson(organizationId, 'crew_lead');
    const forgot = (email: string) => new Client().request('POST', '/api/auth/forgot', { json: { email }, headers: { 'x-forwarded-for': freshAddress() } });
    const known = await Promise.all(Array.from({ length: 10 }, () => forgot(person.email).then((r) => r.status)));
    const unknown = await Promise.all(Array.from({ length: 10 }, () => forgot(`nobody-${randomBytes(3).toString('hex')}@example.test`).then((r) => r.status)));
    expect(known.filter((s) => s === 200)).toHaveLength(RESETS_PER_HOUR);
    expect(known.filter((s) => s === 429)).toHaveLength(10 - RESETS_PER_HOUR);
    expect(unknown.every((s) => s === 200)).toBe(true); // ten different e-mails
    // The links are made after the answer (a refused request schedules nothing); wait for them, then count.
    const tokens = () => testDb().models.PasswordToken.count({ where: { userId: person.id, purpose: 'reset' } });
    await waitFor(async () => (await tokens()) >= RESETS_PER_HOUR, { deadline: 5000, what: `${RESETS_PER_HOUR} reset links` });
    expect(await tokens()).toBe(RESETS_PER_HOUR);
  });

  it('blocks an address that keeps trying set-password links', async () => {
    const address = freshAddress();
    const statuses = [];
    for (let i = 0; i < ADDRESS_FREE + 3; i += 1) {
      const r = await new Client().request('POST', '/api/auth/set-password', { json: { token: `guess-${i}-${randomBytes(8).toString('hex')}`, password: `${randomBytes(12).toString('base64url')} Quill-9 ridge` }, headers: { 'x-forwarded-for': address } });
      statuses.push(r.status);
    }
    expect(statuses.slice(0, ADDRESS_FREE).every((s) => s === 400)).toBe(true);
    expect(statuses.slice(ADDRESS_FREE).every((s) => s === 429)).toBe(true);
  });
});

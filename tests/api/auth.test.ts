import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeOrganization, makePerson, PASSWORD } from '../helpers/factories';
import type { ChildProcess } from 'node:child_process';
import { freePort, startServer } from '../../scripts/lib.mjs';
import { ADDRESS_FREE } from '@/lib/server/throttle';

let organizationId: number;
beforeAll(async () => {
  organizationId = await makeOrganization();
});
afterAll(closeTestDb);

describe('sign-in', () => {
  it('signs in with the right password and sets an HttpOnly, SameSite=Lax session cookie', async () => {
    const person = await makePerson(organizationId, 'crew_lead');
    const client = new Client();
    const response = await client.post('/api/auth/login', { email: person.email.toUpperCase(), password: PASSWORD });
    expect(response.status).toBe(200);
    expect(response.body.person).toMatchObject({ id: person.id, role: 'crew_lead', email: person.email });
    const cookie = response.headers.getSetCookie().find((c) => c.startsWith('bondmap_session='));
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i); // served over plain http on 127.0.0.1
    const me = await client.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body.person.id).toBe(person.id);
    expect(me.body.person).not.toHaveProperty('passwordHash');
  });

  it('answers a wrong password and an unknown e-mail with the same message', async () => {
    const person = await makePerson(organizationId, 'crew_lead');
    const wrong = await new Client().post('/api/auth/login', { email: person.email, password: 'not the password' });
    const unknown = await new Client().post('/api/auth/login', { email: 'nobody-here@example.test', password: 'not the password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error.code).toBe('AUTH_INVALID');
    expect(unknown.body.error).toEqual(wrong.body.error);
    expect(wrong.headers.getSetCookie().some((c) => /bondmap_session=[^;]+/.test(c) && !/bondmap_session=;/.test(c))).toBe(false);
  });

  it('refuses a disabled person with the same message', async () => {
    const person = await makePerson(organizationId, 'reviewer', { disabled: true });
    const response = await new Client().post('/api/auth/login', { email: person.email, password: PASSWORD });
    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('AUTH_INVALID');
  });

  it('answers 401 JSON to /api/me when signed out, and signs out', async () => {
    const person = await makePerson(organizationId, 'apprentice');
    const client = await signedIn(person.email, PASSWORD);
    expect((await client.get('/api/me')).status).toBe(200);
    expect((await client.post('/api/auth/logout')).status).toBe(200);
    const after = await client.get('/api/me');
    expect(after.status).toBe(401);
    expect(after.body.error.code).toBe('AUTH_REQUIRED');
  });

  it('validates the body and names the field', async () => {
    const response = await new Client().post('/api/auth/login', { email: 'not-an-email' });
    expect(response.status).toBe(400);
    expect(response.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual(['email', 'password']);
  });
});

describe('throttling', () => {
  it('holds across server instances, because the failures are in the database', async () => {
    const person = await makePerson(organizationId, 'crew_lead');
    const env = Object.fromEntries(Object.entries(process.env).filter(([k]) => k.startsWith('BONDMAP_DB_'))) as Record<string, string>;
    const port = await freePort();
    const second = (await startServer({ port, env: { ...env, BONDMAP_TRUST_PROXY: '1' }, stdio: 'ignore' })) as { child: ChildProcess; url: string };
    try {
      // An address that failed ADDRESS_FREE times on this instance is blocked on the other one too.
      const address = { 'x-forwarded-for': `198.18.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}` };
      for (let i = 0; i < ADDRESS_FREE; i += 1) {
        const r = await new Client().request('POST', '/api/auth/login', { json: { email: `guess-${i}-${person.email}`, password: 'wrong' }, headers: address });
        expect(r.status).toBe(401);
      }
      const response = await new Client(second.url).request('POST', '/api/auth/login', { json: { email: person.email, password: PASSWORD }, headers: address });
      expect(response.status).toBe(429);
      expect(response.body.error.code).toBe('AUTH_THROTTLED');
    } finally {
      second.child.kill('SIGTERM');
    }
  });
});

describe('origin check', () => {
  it('refuses a cross-site write, JSON or form', async () => {
    const person = await makePerson(organizationId, 'crew_lead');
    const json = await new Client().request('POST', '/api/auth/login', { json: { email: person.email, password: PASSWORD }, headers: { origin: 'http://elsewhere.example.test' } });
    expect(json.status).toBe(403);
    expect(json.body.error.code).toBe('ORIGIN_REJECTED');
    const form = await new Client().request('POST', '/login', {
      body: new URLSearchParams({ email: person.email, password: PASSWORD }).toString(),
      headers: { origin: 'http://elsewhere.example.test', 'content-type': 'application/x-www-form-urlencoded' },
    });
    expect(form.status).toBe(403);
  });
});

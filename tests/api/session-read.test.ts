/**
 * Reading the session on every request (src/lib/server/auth.ts readSession): one query for the
 * session and its person, and the session is written back only when it is extended (past half of
 * its 12 hours), as Lucia's own validation did. Expired and disabled sessions sign the person out.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeOrganization, makePerson, testDb, PASSWORD } from '../helpers/factories';

afterAll(closeTestDb);

const HOUR = 3600_000;

async function freshSession() {
  const person = await makePerson(await makeOrganization(), 'crew_lead', { name: 'Invented session tester' });
  const client: Client = await signedIn(person.email, PASSWORD);
  const session = await testDb().models.Session.findOne({ where: { userId: person.id } });
  if (!session) throw new Error('no session row after signing in');
  return { person, client, session };
}

describe('reading the session', () => {
  it('answers the person and their organisation, and writes nothing back in the first half of the session', async () => {
    const { person, client, session } = await freshSession();
    const expiresAt = new Date(Date.now() + 11 * HOUR);
    await session.update({ expiresAt });
    const me = await client.get('/api/me');
    expect(me.status).toBe(200);
    expect(JSON.stringify(me.body)).toContain(person.id);
    expect(JSON.stringify(me.body)).toContain(person.organizationName);
    expect(me.headers.getSetCookie()).toEqual([]);
    await session.reload();
    expect(session.expiresAt.getTime()).toBe(expiresAt.getTime());
  });

  it('extends a session past half its time and refreshes the cookie', async () => {
    const { client, session } = await freshSession();
    await session.update({ expiresAt: new Date(Date.now() + HOUR) });
    const before = Date.now();
    const me = await client.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.headers.getSetCookie().join(';')).toMatch(/bondmap_session=[^;]+/);
    await session.reload();
    expect(session.expiresAt.getTime()).toBeGreaterThanOrEqual(before + 12 * HOUR - 1000);
    expect((await client.get('/api/me')).status).toBe(200);
  });

  it('signs out an expired session and deletes it', async () => {
    const { client, session } = await freshSession();
    await session.update({ expiresAt: new Date(Date.now() - 1000) });
    expect((await client.get('/api/me')).status).toBe(401);
    expect(await testDb().models.Session.findByPk(session.id)).toBeNull();
  });

  it('signs out a disabled person and ends their sessions', async () => {
    const { person, client } = await freshSession();
    await testDb().models.User.update({ disabled: true }, { where: { id: person.id } });
    expect((await client.get('/api/me')).status).toBe(401);
    expect(await testDb().models.Session.count({ where: { userId: person.id } })).toBe(0);
  });
});

/**
 * People and passwords under attack: invitation links go by mail only, a second account of the
 * author cannot approve, another organisation's people are not revealed, racing admin changes and
 * invitations keep their rules, a new password ends every other link and session, weak passwords
 * are refused, and the sessions table holds no usable token.
 */
import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makePerson, makeTeam, planDocument, testDb, PASSWORD } from '../helpers/factories';
import { mailTo, waitFor } from '../helpers/wait';

let team: Awaited<ReturnType<typeof makeTeam>>;
let admin: Client;
beforeAll(async () => {
  team = await makeTeam();
  admin = await signedIn(team.admin.email, PASSWORD);
});
afterAll(closeTestDb);

const unique = () => Math.random().toString(36).slice(2, 9);

async function linkMailedTo(address: string, subjectPart: string, as: Client = admin): Promise<string> {
  return (await mailTo(as, address, subjectPart)).text.match(/\/set-password\/([\w-]+)/)![1];
}

const STRONG = 'violet ladder across the creek';

describe('invitations', () => {
  it('answer that a mail was sent, never with the link (API and page)', async () => {
    const email = `invitee-${unique()}@example.test`;
    const response = await admin.post('/api/admin/users', { email, name: 'In Vitee', role: 'reviewer' });
    expect(response.status).toBe(201);
    expect(response.body.invitation).toMatchObject({ email, role: 'reviewer', message: expect.stringContaining('invitation was sent') });
    expect(response.text).not.toMatch(/set-password/);
    const token = await linkMailedTo(email, 'You are invited');
    expect(response.text).not.toContain(token);

    const page = await admin.form('/admin/users', { action: 'invite', email: `page-${unique()}@example.test`, name: 'Page Invitee', role: 'apprentice' });
    expect(page.status).toBe(200);
    expect(page.text).toContain('An invitation was sent');
    expect(page.text).not.toMatch(/set-password\//);
  });

  it('answer an address of another organisation exactly like a new one, and create nobody', async () => {
    const other = await makeTeam();
    const before = await testDb().models.User.count();
    const taken = await admin.post('/api/admin/users', { email: other.lead.email, name: 'Someone Else', role: 'crew_lead' });
    const fresh = await admin.post('/api/admin/users', { email: `fresh-${unique()}@example.test`, name: 'Someone Else', role: 'crew_lead' });
    expect(taken.status).toBe(fresh.status);
    expect(Object.keys(taken.body.invitation).sort()).toEqual(Object.keys(fresh.body.invitation).sort());
    expect(taken.body.invitation.message.replace(other.lead.email, 'X')).toBe(fresh.body.invitation.message.replace(fresh.body.invitation.email, 'X'));
    expect(taken.text).not.toMatch(/EMAIL_TAKEN|already|organisation/i);
    expect(await testDb().models.User.count()).toBe(before + 1);
    const holder = await testDb().models.User.findOne({ where: { email: other.lead.email } });
    expect(holder!.organizationId).toBe(other.organizationId);
  });

  it('still refuses an address of the admin\'s own organisation, naming the field', async () => {
    const response = await admin.post('/api/admin/users', { email: team.apprentice.email, name: 'Copy', role: 'apprentice' });
    expect(response.status).toBe(409);
    expect(response.body.error).toMatchObject({ code: 'EMAIL_TAKEN', issues: [{ path: 'email' }] });
  });

  it('of one address in parallel create one person, never a 500', async () => {
    const email = `racer-${unique()}@example.test`;
    const results = await Promise.all(Array.from({ length: 8 }, () => admin.post('/api/admin/users', { email, name: 'Race Runner', role: 'apprentice' })));
    expect(results.map((r) => r.status).sort()).toEqual([201, 409, 409, 409, 409, 409, 409, 409]);
    expect(await testDb().models.User.count({ where: { email } })).toBe(1);
  });
});

describe('approving through a second account', () => {
  it('is refused when the approver was invited by the author, or through them, or shares a mailbox', async () => {
    const sock = `sock-${unique()}@example.test`;
    expect((await admin.post('/api/admin/users', { email: sock, name: 'Second Self', role: 'admin' })).status).toBe(201);
    await new Client().post('/api/auth/set-password', { token: await linkMailedTo(sock, 'You are invited'), password: STRONG });
    const second = await signedIn(sock, STRONG);
    // The second account invites a third: still the author's chain.
    const third = `third-${unique()}@example.test`;
    expect((await second.post('/api/admin/users', { email: third, name: 'Third Self', role: 'reviewer' })).status).toBe(201);
    await new Client().post('/api/auth/set-password', { token: await linkMailedTo(third, 'You are invited'), password: STRONG });
    const thirdClient = await signedIn(third, STRONG);
    // A mailbox alias of the author's own address, made without an invitation.
    const [local, host] = team.admin.email.split('@');
    const alias = await makePerson(team.organizationId, 'reviewer', { email: `${local}+review@${host}` });
    const aliasClient = await signedIn(alias.email, PASSWORD);

    const plan = (await admin.post('/api/plans', { title: 'Own pole', document: planDocument() })).body.plan;
    expect((await admin.post(`/api/plans/${plan.id}/submit`)).status).toBe(200);
    for (const approver of [second, thirdClient, aliasClient]) {
      const response = await approver.post(`/api/plans/${plan.id}/review`, { decision: 'approve' });
      expect(response.status).toBe(403);
      expect(response.body.error.code).toBe('RELATED_REVIEWER');
    }
    expect((await admin.get(`/api/plans/${plan.id}`)).body.plan.status).toBe('submitted');
    // Someone outside the chain approves.
    const outsider = await signedIn(team.reviewer.email, PASSWORD);
    expect((await outsider.post(`/api/plans/${plan.id}/review`, { decision: 'approve' })).status).toBe(200);
  });
});

describe('the last admin', () => {
  it('is kept when two admins demote each other at the same moment', async () => {
    const t = await makeTeam();
    const other = await makePerson(t.organizationId, 'admin');
    const [a, b] = await Promise.all([signedIn(t.admin.email, PASSWORD), signedIn(other.email, PASSWORD)]);
    const results = await Promise.all([a.patch(`/api/admin/users/${other.id}`, { role: 'reviewer' }), b.patch(`/api/admin/users/${t.admin.id}`, { role: 'reviewer' })]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 403]);
    expect(await testDb().models.User.count({ where: { organizationId: t.organizationId, role: 'admin', disabled: false } })).toBe(1);
  });

  it('is kept when two admins disable each other at the same moment', async () => {
    const t = await makeTeam();
    const other = await makePerson(t.organizationId, 'admin');
    const [a, b] = await Promise.all([signedIn(t.admin.email, PASSWORD), signedIn(other.email, PASSWORD)]);
    await Promise.all([a.patch(`/api/admin/users/${other.id}`, { disabled: true }), b.patch(`/api/admin/users/${t.admin.id}`, { disabled: true })]);
    expect(await testDb().models.User.count({ where: { organizationId: t.organizationId, role: 'admin', disabled: false } })).toBe(1);
  });
});

describe('setting a password', () => {
  it('ends every other reset or invitation link and every session of that person', async () => {
    const person = await makePerson(team.organizationId, 'crew_lead');
    const elsewhere = await signedIn(person.email, PASSWORD);
    await new Client().post('/api/auth/forgot', { email: person.email });
    const older = await linkMailedTo(person.email, 'Reset your Bondmap password');
    await new Client().post('/api/auth/forgot', { email: person.email });
    const newer = await waitFor(async () => {
      const texts: string[] = (await admin.get(`/api/dev/mail?to=${encodeURIComponent(person.email)}`)).body.messages.map((m: { text: string }) => m.text);
      return texts.map((t) => t.match(/\/set-password\/([\w-]+)/)![1]).find((t) => t !== older);
    }, { what: 'a second reset link' });
    expect(newer).not.toBe(older);
    expect((await new Client().post('/api/auth/set-password', { token: newer, password: STRONG })).status).toBe(200);
    const stale = await new Client().post('/api/auth/set-password', { token: older, password: 'another violet ladder entirely' });
    expect(stale.status).toBe(400);
    expect(stale.body.error.code).toBe('TOKEN_INVALID');
    expect((await elsewhere.get('/api/me')).status).toBe(401);
    expect((await new Client().post('/api/auth/login', { email: person.email, password: STRONG })).status).toBe(200);
  });

  it('refuses weak passwords by a strength estimate, naming the field', async () => {
    const person = await makePerson(team.organizationId, 'apprentice');
    await new Client().post('/api/auth/forgot', { email: person.email });
    const token = await linkMailedTo(person.email, 'Reset your Bondmap password');
    for (const weak of [' '.repeat(10), '\u0000'.repeat(10), 'aaaaaaaaaa', 'password12', 'qwertyuiop', '💡'.repeat(6)]) {
      const response = await new Client().post('/api/auth/set-password', { token, password: weak });
      expect(response.status, JSON.stringify(weak)).toBe(400);
      expect(response.body.error.issues[0].path).toBe('password');
    }
    // Six emoji are twelve UTF-16 units but six characters: too short.
    const emoji = await new Client().post('/api/auth/set-password', { token, password: '💡'.repeat(6) });
    expect(emoji.body.error.issues[0].message).toMatch(/at least 10 characters/);
    expect((await new Client().post('/api/auth/set-password', { token, password: STRONG })).status).toBe(200);
  });
});

describe('sessions at rest', () => {
  it('stores only the SHA-256 of each session token, so a read of the table signs nobody in', async () => {
    const person = await makePerson(team.organizationId, 'apprentice');
    const response = await new Client().post('/api/auth/login', { email: person.email, password: PASSWORD });
    const token = response.headers.getSetCookie().map((c) => c.match(/^bondmap_session=([^;]+)/)?.[1]).find(Boolean)!;
    const rows = await testDb().models.Session.findAll({ where: { userId: person.id } });
    expect(rows).toHaveLength(1);
    expect(rows[0].id).not.toBe(token);
    expect(rows[0].id).toBe(createHash('sha256').update(token).digest('hex'));
    const stolen = await new Client().request('GET', '/api/me', { headers: { cookie: `bondmap_session=${rows[0].id}` } });
    expect(stolen.status).toBe(401);
    const real = await new Client().request('GET', '/api/me', { headers: { cookie: `bondmap_session=${token}` } });
    expect(real.status).toBe(200);
  });
});

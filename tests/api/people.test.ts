import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeTeam, PASSWORD } from '../helpers/factories';
import { mailTo as mailToAs } from '../helpers/wait';

let team: Awaited<ReturnType<typeof makeTeam>>;
let admin: Client;
beforeAll(async () => {
  team = await makeTeam();
  admin = await signedIn(team.admin.email, PASSWORD);
});
afterAll(closeTestDb);

const mailTo = (address: string, subjectPart: string) => mailToAs(admin, address, subjectPart);

describe('admin: people', () => {
  it('lists only the organisation\'s people, without password hashes', async () => {
    const response = await admin.get('/api/admin/users');
    expect(response.status).toBe(200);
    const emails = response.body.people.map((p: { email: string }) => p.email).sort();
    expect(emails).toEqual([team.admin.email, team.reviewer.email, team.lead.email, team.apprentice.email].sort());
    expect(response.text).not.toMatch(/argon2|passwordHash/);
  });

  it('invites a person with a one-time link that sets the password once', async () => {
    const email = `newcomer-${Date.now()}@example.test`;
    const invited = await admin.post('/api/admin/users', { email, name: 'New Comer', role: 'apprentice' });
    expect(invited.status).toBe(201);
    expect(invited.body.invitation).toMatchObject({ email, role: 'apprentice' });
    const listed = (await admin.get('/api/admin/users')).body.people.find((p: { email: string }) => p.email === email);
    expect(listed).toMatchObject({ role: 'apprentice', hasPassword: false });
    const token = (await mailTo(email, 'You are invited to Bondmap')).text.match(/\/set-password\/([\w-]+)/)[1];
    expect((await new Client().post('/api/auth/login', { email, password: 'anything at all' })).status).toBe(401);

    const short = await new Client().post('/api/auth/set-password', { token, password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.issues[0].path).toBe('password');

    expect((await new Client().post('/api/auth/set-password', { token, password: 'a long new password' })).status).toBe(200);
    expect((await new Client().post('/api/auth/set-password', { token, password: 'another long password' })).body.error.code).toBe('TOKEN_INVALID');
    const client = await signedIn(email, 'a long new password');
    expect((await client.get('/api/me')).body.person.email).toBe(email);
  });

  it('refuses an e-mail that is taken', async () => {
    const response = await admin.post('/api/admin/users', { email: team.lead.email, name: 'Copy', role: 'crew_lead' });
    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe('EMAIL_TAKEN');
  });

  it('changes a role', async () => {
    const response = await admin.patch(`/api/admin/users/${team.apprentice.id}`, { role: 'reviewer' });
    expect(response.status).toBe(200);
    expect(response.body.person.role).toBe('reviewer');
    await admin.patch(`/api/admin/users/${team.apprentice.id}`, { role: 'apprentice' });
  });

  it('disabling a person ends their sessions at once', async () => {
    const team2 = await makeTeam();
    const admin2 = await signedIn(team2.admin.email, PASSWORD);
    const lead = await signedIn(team2.lead.email, PASSWORD);
    expect((await lead.get('/api/me')).status).toBe(200);
    const response = await admin2.patch(`/api/admin/users/${team2.lead.id}`, { disabled: true });
    expect(response.body.person.disabled).toBe(true);
    expect((await lead.get('/api/me')).status).toBe(401);
    expect((await new Client().post('/api/auth/login', { email: team2.lead.email, password: PASSWORD })).status).toBe(401);
  });

  it('does not let an admin disable or demote themselves', async () => {
    const response = await admin.patch(`/api/admin/users/${team.admin.id}`, { disabled: true });
    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe('SELF_CHANGE');
  });

  it('answers 404 for a person of another organisation', async () => {
    const other = await makeTeam();
    const response = await admin.patch(`/api/admin/users/${other.lead.id}`, { role: 'reviewer' });
    expect(response.status).toBe(404);
  });

  it('validates the body, naming each field', async () => {
    const response = await admin.post('/api/admin/users', { email: 'nope', role: 'boss' });
    expect(response.status).toBe(400);
    expect(response.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual(['email', 'name', 'role']);
  });
});

describe('mail for people', () => {
  it('e-mails the invitation with its one-time link', async () => {
    const email = `invited-${Date.now()}@example.test`;
    const invited = await admin.post('/api/admin/users', { email, name: 'Mailed Person', role: 'crew_lead' });
    const mail = await mailTo(email, 'You are invited to Bondmap');
    expect(mail.text).toMatch(/\/set-password\/[\w-]{20,}/);
    expect(invited.body.invitation.message).toContain('An invitation was sent');
    expect(mail.to).toEqual([email]);
  });

  it('sends a reset link that sets a new password once, and answers the same for unknown e-mails', async () => {
    const known = await admin.post('/api/admin/users', { email: `resetter-${Date.now()}@example.test`, name: 'Re Setter', role: 'apprentice' });
    const email = known.body.invitation.email;
    const unknown = await new Client().post('/api/auth/forgot', { email: 'not-a-person@example.test' });
    const asked = await new Client().post('/api/auth/forgot', { email });
    expect(asked.status).toBe(200);
    expect(asked.body).toEqual(unknown.body);
    const mail = await mailTo(email, 'Reset your Bondmap password');
    const token = mail.text.match(/\/set-password\/([\w-]+)/)[1];
    expect((await new Client().post('/api/auth/set-password', { token, password: 'brand new password' })).status).toBe(200);
    expect((await new Client().post('/api/auth/login', { email, password: 'brand new password' })).status).toBe(200);
    expect((await new Client().post('/api/auth/set-password', { token, password: 'brand new password 2' })).status).toBe(400);
  });

  it('keeps another organisation\'s mail out of the admin\'s view', async () => {
    const other = await makeTeam();
    const otherAdmin = await signedIn(other.admin.email, PASSWORD);
    const email = `elsewhere-${Date.now()}@example.test`;
    await otherAdmin.post('/api/admin/users', { email, name: 'Else Where', role: 'apprentice' });
    // Caught: their own admin sees it, so its absence below is the filter, not the timing.
    await mailToAs(otherAdmin, email, '');
    const mine = (await admin.get('/api/dev/mail')).body.messages;
    expect(mine.some((m: { subject: string; to: string[] }) => m.to.some((t) => t.startsWith('elsewhere-')))).toBe(false);
  });
});

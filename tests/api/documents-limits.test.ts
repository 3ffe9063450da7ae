/**
 * Documents nested thousands of levels deep are refused at the schema, naming the field, and a
 * document stored before the limit existed still opens everywhere (plan and library pages,
 * approval); returning a plan with long comments does all it says (the decision and the mail)
 * and never answers 500.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeTeam, planDocument, testDb, PASSWORD } from '../helpers/factories';
import { mailTo } from '../helpers/wait';

let lead: Client;
let reviewer: Client;
let admin: Client;
let team: Awaited<ReturnType<typeof makeTeam>>;
beforeAll(async () => {
  team = await makeTeam();
  [lead, reviewer, admin] = await Promise.all([signedIn(team.lead.email, PASSWORD), signedIn(team.reviewer.email, PASSWORD), signedIn(team.admin.email, PASSWORD)]);
});
afterAll(closeTestDb);

/** A plan document's JSON with `"notes": [[[…]]]` `depth` levels deep, written as text (no recursion). */
function deepDocumentJson(depth: number): string {
  const plain = JSON.stringify(planDocument());
  return `${plain.slice(0, -1)},"notes":${'['.repeat(depth)}${']'.repeat(depth)}}`;
}

describe('deeply nested extra fields', () => {
  it.each([1500, 4500, 5000])('refuses a document %i levels deep on create, save and check, naming the field', async (depth) => {
    const document = deepDocumentJson(depth);
    const created = await lead.request('POST', '/api/plans', { body: `{"title":"Deep pole","document":${document}}`, headers: { 'content-type': 'application/json' } });
    expect(created.status, created.text).toBe(400);
    expect(created.body.error.code).toBe('VALIDATION');
    expect(created.body.error.issues[0].path).toMatch(/^document\.notes(\[0\])+$/);
    expect(created.body.error.issues[0].message).toMatch(/deeper than 16 levels/);

    const checked = await lead.request('POST', '/api/check', { body: document, headers: { 'content-type': 'application/json' } });
    expect(checked.status).toBe(400);
    expect(checked.body.error.issues[0].path).toMatch(/^notes/);

    const plan = (await lead.post('/api/plans', { title: 'Shallow pole', document: planDocument() })).body.plan;
    const saved = await lead.request('PUT', `/api/plans/${plan.id}`, { body: `{"expectedRevision":1,"document":${document}}`, headers: { 'content-type': 'application/json' } });
    expect(saved.status).toBe(400);
    expect((await lead.get(`/api/plans/${plan.id}`)).body.plan.currentRevision).toBe(1);
  });

  it('keeps extra fields that nest within the limit', async () => {
    const notes = { crew: [{ said: ['check the bar'] }] };
    const created = await lead.post('/api/plans', { title: 'Noted pole', document: { ...planDocument(), notes } });
    expect(created.status).toBe(201);
    expect(created.body.plan.document.notes).toEqual(notes);
  });

  it('still opens, approves and shows in the library a document stored 3,000 levels deep', async () => {
    const plan = (await lead.post('/api/plans', { title: 'Stored deep pole', document: planDocument() })).body.plan;
    await testDb().models.PlanRevision.update({ document: deepDocumentJson(3000) }, { where: { planId: plan.id, number: 1 } });
    expect((await lead.get(`/api/plans/${plan.id}`)).status).toBe(200);
    expect((await lead.get(`/plans/${plan.id}`)).status).toBe(200);
    expect((await lead.post(`/api/plans/${plan.id}/submit`)).status).toBe(200);
    expect((await reviewer.get(`/plans/${plan.id}/review`)).status).toBe(200);
    const approved = await reviewer.post(`/api/plans/${plan.id}/review`, { decision: 'approve' });
    expect(approved.status, approved.text).toBe(200);
    expect((await reviewer.get(`/api/plans/${plan.id}/revisions/1`)).status).toBe(200);
    expect((await lead.get('/library')).status).toBe(200);
    const page = await lead.get(`/library/${plan.id}`);
    expect(page.status).toBe(200);
    expect(page.text).toContain('removed: nested too deep');
  });
});

describe('returning with long comments', () => {
  it('records the return and queues the mail in full, or does neither; never a 500', async () => {
    const plan = (await lead.post('/api/plans', { title: 'Much-commented pole', document: planDocument() })).body.plan;
    expect((await lead.post(`/api/plans/${plan.id}/submit`)).status).toBe(200);
    // Characters that grow when escaped for HTML, and four-byte characters: far past 64 KB of mail.
    const long = `"<&'>`.repeat(700) + '⚡'.repeat(500);
    for (let i = 0; i < 8; i += 1) expect((await reviewer.post(`/api/plans/${plan.id}/comments`, { body: long.slice(i) })).status).toBe(201);
    const returned = await reviewer.post(`/api/plans/${plan.id}/review`, { decision: 'return', comment: long });
    expect(returned.status, returned.text).toBe(200);
    expect(returned.body.plan.status).toBe('returned');
    const queued = await testDb().models.MailOutbox.findAll({ where: { toAddress: team.lead.email, kind: 'plan.returned' } });
    expect(queued).toHaveLength(1);
    expect(queued[0].textBody).toContain('"<&\'>');
    expect(queued[0].htmlBody).toContain('&#34;&#60;&#38;&#39;&#62;');
    // The caught message arrives whole (the local mail server stores what it received).
    const mail = await mailTo(admin, team.lead.email, 'Much-commented pole');
    expect(mail.text).toContain('Fix what they point at');
  });
});

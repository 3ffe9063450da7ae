/**
 * The crew lead answers a reviewer's comment: the reply sits under it (API, plan page, review
 * page), the reviewer gets a mail, and a reply to another plan's or organisation's comment, to a
 * reply, or pinned to an element is refused naming the field, storing nothing.
 */
import { ForeignKeyConstraintError } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeOrganization, makePerson, makeTeam, PASSWORD, planDocument, testDb } from '../helpers/factories';

let team: Awaited<ReturnType<typeof makeTeam>>;
let lead: Client;
let reviewer: Client;
let apprentice: Client;
let other: Client;
let otherLead: Client;
let planId: number;
let commentId: number;

const commentCount = () => testDb().models.PlanComment.count();

async function submittedPlan(title: string): Promise<number> {
  const id = (await lead.post('/api/plans', { title, document: planDocument() })).body.plan.id;
  expect((await lead.post(`/api/plans/${id}/submit`)).status).toBe(200);
  return id;
}

beforeAll(async () => {
  team = await makeTeam();
  lead = await signedIn(team.lead.email, PASSWORD);
  reviewer = await signedIn(team.reviewer.email, PASSWORD);
  apprentice = await signedIn(team.apprentice.email, PASSWORD);
  const elsewhere = await makeOrganization('Elsewhere Invented Co-operative');
  other = await signedIn((await makePerson(elsewhere, 'reviewer')).email, PASSWORD);
  otherLead = await signedIn((await makePerson(elsewhere, 'crew_lead')).email, PASSWORD);
  planId = await submittedPlan('Reply pole');
  commentId = (await reviewer.post(`/api/plans/${planId}/comments`, { elementId: 'jA', body: 'Is this clamp rated for the fault?' })).body.comment.id;
});
afterAll(closeTestDb);

describe('replies over the API', () => {
  it('puts the crew lead\'s reply under the comment and mails the reviewer', async () => {
    const r = await lead.post(`/api/plans/${planId}/comments`, { replyTo: commentId, body: 'Yes: 43 kA for 15 cycles on the set record.' });
    expect(r.status).toBe(201);
    expect(r.body.comment).toMatchObject({ replyTo: commentId, elementId: null, authorId: team.lead.id, revision: 1 });
    const listed = (await reviewer.get(`/api/plans/${planId}/comments`)).body.comments;
    expect(listed.map((c: { id: number; replyTo: number | null }) => [c.id, c.replyTo])).toEqual([[commentId, null], [r.body.comment.id, commentId]]);
    const mail = await testDb().models.MailOutbox.findAll({ where: { toAddress: team.reviewer.email, kind: 'comment.replied' } });
    expect(mail).toHaveLength(1);
    expect(mail[0].textBody).toContain('Yes: 43 kA for 15 cycles');
    expect(mail[0].textBody).toContain('Is this clamp rated');
    // The reviewer answering their own thread mails nobody.
    expect((await reviewer.post(`/api/plans/${planId}/comments`, { replyTo: commentId, body: 'Thanks, noted.' })).status).toBe(201);
    expect(await testDb().models.MailOutbox.count({ where: { kind: 'comment.replied', organizationId: team.organizationId } })).toBe(1);
  });

  it('refuses, naming replyTo, a reply to a comment of another plan or another organisation, or to a reply', async () => {
    const second = await submittedPlan('Second reply pole');
    const elsewhere = (await reviewer.post(`/api/plans/${second}/comments`, { body: 'On the other plan.' })).body.comment.id;
    const theirPlanId = (await otherLead.post('/api/plans', { title: 'Their pole', document: planDocument() })).body.plan.id;
    const theirComment = (await other.post(`/api/plans/${theirPlanId}/comments`, { body: 'Theirs.' })).body.comment.id;
    const reply = (await lead.get(`/api/plans/${planId}/comments`)).body.comments.find((c: { replyTo: number | null }) => c.replyTo !== null).id;
    const before = await commentCount();
    for (const replyTo of [elsewhere, theirComment, 2 ** 31]) {
      const r = await lead.post(`/api/plans/${planId}/comments`, { replyTo, body: 'Misplaced.' });
      expect(r.status, `reply to ${replyTo}`).toBe(400);
      expect(r.body.error.issues).toEqual([{ path: 'replyTo', message: `no comment ${replyTo} on this plan` }]);
    }
    const nested = await lead.post(`/api/plans/${planId}/comments`, { replyTo: reply, body: 'Deeper.' });
    expect(nested.status).toBe(400);
    expect(nested.body.error.issues[0]).toMatchObject({ path: 'replyTo', message: expect.stringContaining(`answer comment ${commentId}`) });
    const pinned = await lead.post(`/api/plans/${planId}/comments`, { replyTo: commentId, elementId: 'A', body: 'Pinned reply.' });
    expect(pinned.status).toBe(400);
    expect(pinned.body.error.issues.map((i: { path: string }) => i.path)).toEqual(['elementId']);
    for (const replyTo of ['seven', -1, 1.5]) expect((await lead.post(`/api/plans/${planId}/comments`, { replyTo, body: 'Bad id.' })).body.error.issues[0].path).toBe('replyTo');
    // Another organisation cannot reach this plan at all; an apprentice may not comment.
    expect((await other.post(`/api/plans/${planId}/comments`, { replyTo: commentId, body: 'From outside.' })).status).toBe(404);
    expect((await apprentice.post(`/api/plans/${planId}/comments`, { replyTo: commentId, body: 'Me too.' })).status).toBe(403);
    expect(await commentCount()).toBe(before);
  });

  it('keeps a reply to another plan\'s comment out of the database itself', async () => {
    const second = await submittedPlan('Key check pole');
    const theirs = await testDb().models.PlanComment.create({ planId: second, revision: 1, elementId: null, authorId: team.reviewer.id, body: 'Elsewhere.', resolvedAt: null, resolvedBy: null });
    await expect(testDb().models.PlanComment.create({ planId, revision: 1, elementId: null, authorId: team.lead.id, body: 'Crossed.', resolvedAt: null, resolvedBy: null, replyTo: theirs.id })).rejects.toBeInstanceOf(ForeignKeyConstraintError);
  });

  it('counts threads, not replies, as open comments, and resolves a thread by its comment only', async () => {
    const reply = (await lead.get(`/api/plans/${planId}/comments`)).body.comments.find((c: { replyTo: number | null }) => c.replyTo !== null).id;
    expect((await lead.patch(`/api/plans/${planId}/comments/${reply}`, { resolved: true })).status).toBe(404);
    const page = await lead.get(`/plans/${planId}`);
    expect(page.body).toContain('(1 open)');
    expect(page.body).toContain('Resolve comment 1');
    expect(page.body).not.toContain('Resolve comment 2');
  });
});

describe('replies on the pages', () => {
  it('shows replies under their comment on the plan page and takes a reply from its form', async () => {
    const id = await submittedPlan('Form reply pole');
    const first = (await reviewer.post(`/api/plans/${id}/comments`, { body: 'Where does the truck stand?' })).body.comment.id;
    await reviewer.post(`/api/plans/${id}/comments`, { elementId: 'CB', body: 'Bar size?' });
    const sent = await lead.form(`/plans/${id}/workflow`, { action: 'reply', replyTo: String(first), body: 'Outside the barricade, on mats.' });
    expect(sent.status).toBe(303);
    expect(sent.headers.get('location')).toMatch(new RegExp(`^/plans/${id}\\?notice=replied#comment-\\d+$`));
    const page = (await lead.get(`/plans/${id}`)).body;
    const replies = page.slice(page.indexOf('data-testid="replies-1"'), page.indexOf('</ol>', page.indexOf('data-testid="replies-1"')));
    expect(replies).toContain('Outside the barricade, on mats.');
    expect(page).not.toContain('data-testid="replies-2"');
    expect(page).toContain('data-testid="reply-form-2"');
    // An empty reply from a forged form is refused and stores nothing.
    const before = await commentCount();
    expect((await lead.form(`/plans/${id}/workflow`, { action: 'reply', replyTo: String(first), body: '  ' })).headers.get('location')).toContain('problem=VALIDATION');
    expect(await commentCount()).toBe(before);
  });

  it('lets a reviewer reply on the review page; a refused reply keeps its words; another plan\'s comment is named', async () => {
    const id = await submittedPlan('Review reply pole');
    const first = (await reviewer.post(`/api/plans/${id}/comments`, { body: 'Which rod length?' })).body.comment.id;
    const ok = await reviewer.form(`/plans/${id}/review`, { action: 'reply', replyTo: String(first), body: 'Answering myself: 8 ft.' });
    expect(ok.status).toBe(200);
    expect(ok.body.slice(ok.body.indexOf('data-testid="replies-1"'))).toContain('Answering myself: 8 ft.');
    const long = `Kept words ${'x'.repeat(4000)}`;
    const tooLong = await reviewer.form(`/plans/${id}/review`, { action: 'reply', replyTo: String(first), body: long });
    expect(tooLong.status).toBe(400);
    expect(tooLong.body).toContain('The reply must be at most 4000 characters.');
    expect(tooLong.body).toContain(long);
    const bad = await reviewer.form(`/plans/${id}/review`, { action: 'reply', replyTo: String(commentId), body: 'Misplaced.' });
    expect(bad.status).toBe(400);
    expect(bad.body).toContain(`replyTo: no comment ${commentId} on this plan`);
  });
});

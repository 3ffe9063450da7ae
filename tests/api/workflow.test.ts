/**
 * The review state machine over real HTTP: draft → submitted → approved, or → returned → submitted
 * again, with every refusal, the decision race, fixed approved revisions and the mail that goes out.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { canonicalJson } from '@/lib/domain/canonical-json';
import { checkPlan } from '@/lib/domain/checker';
import { createHash } from 'node:crypto';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makePerson, makeTeam, planDocument, testDb, PASSWORD } from '../helpers/factories';
import { startMailCatcher, stopMailCatcher } from '../../scripts/lib.mjs';
import { mailTo as mailToAs, waitFor } from '../helpers/wait';

type Team = Awaited<ReturnType<typeof makeTeam>>;
let team: Team;
let lead: Client;
let reviewer: Client;
let admin: Client;
let apprentice: Client;

beforeAll(async () => {
  team = await makeTeam();
  [lead, reviewer, admin, apprentice] = await Promise.all([
    signedIn(team.lead.email, PASSWORD),
    signedIn(team.reviewer.email, PASSWORD),
    signedIn(team.admin.email, PASSWORD),
    signedIn(team.apprentice.email, PASSWORD),
  ]);
});
afterAll(closeTestDb);

const sha = (v: unknown) => createHash('sha256').update(canonicalJson(v)).digest('hex');

/** A climber standing on the wood pole: stand-not-conductive is a blocker. */
function blockedDocument() {
  const doc = planDocument();
  return { ...doc, nodes: [...doc.nodes.filter((n) => n.id !== 'W1'), { id: 'P1', kind: 'structure' as const, material: 'wood' as const }, { id: 'W1', kind: 'worker' as const, standsOn: 'P1' }] };
}

async function createPlan(client = lead, document: unknown = planDocument()) {
  const response = await client.post('/api/plans', { title: `Workflow pole ${Math.random().toString(36).slice(2, 7)}`, document });
  expect(response.status).toBe(201);
  return response.body.plan as { id: number; currentRevision: number; title: string };
}

const mailTo = (address: string, subjectPart: string, deadline?: number) => mailToAs(admin, address, subjectPart, deadline);

describe('submitting', () => {
  it('refuses while the server\'s own check finds blockers, listing them', async () => {
    const plan = await createPlan(lead, blockedDocument());
    const response = await lead.post(`/api/plans/${plan.id}/submit`);
    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe('SUBMIT_BLOCKED');
    expect(response.body.error.blockers.map((b: { rule: string }) => b.rule)).toContain('stand-not-conductive');
    expect((await lead.get(`/api/plans/${plan.id}`)).body.plan.status).toBe('draft');
  });

  it('does not trust a stored report: a blocker hidden from the stored report still blocks', async () => {
    const plan = await createPlan(lead, blockedDocument());
    // A well-formed report (it passes the report schema) that hides the blocker.
    const clean = JSON.stringify(checkPlan(planDocument()));
    expect(JSON.parse(clean).summary.blockers).toBe(0);
    await testDb().models.PlanRevision.update({ report: clean }, { where: { planId: plan.id } });
    await testDb().models.Plan.update({ blockers: 0 }, { where: { id: plan.id } });
    expect((await lead.post(`/api/plans/${plan.id}/submit`)).status).toBe(409);
  });

  it('submits a clean plan and tells the reviewers by mail', async () => {
    const plan = await createPlan();
    const response = await lead.post(`/api/plans/${plan.id}/submit`);
    expect(response.status).toBe(200);
    expect(response.body.plan.status).toBe('submitted');
    const mail = await mailTo(team.reviewer.email, plan.title);
    expect(mail.text).toContain(`/plans/${plan.id}/review`);
    expect(mail.html).toContain('<a href=');
  });

  it('is for crew leads and admins only, and only from draft or returned', async () => {
    const plan = await createPlan();
    expect((await apprentice.post(`/api/plans/${plan.id}/submit`)).status).toBe(403);
    expect((await reviewer.post(`/api/plans/${plan.id}/submit`)).status).toBe(403);
    expect((await lead.post(`/api/plans/${plan.id}/submit`)).status).toBe(200);
    const again = await lead.post(`/api/plans/${plan.id}/submit`);
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('NOT_SUBMITTABLE');
    const save = await lead.put(`/api/plans/${plan.id}`, { expectedRevision: 1, document: planDocument() });
    expect(save.body.error.code).toBe('NOT_EDITABLE');
  });
});

describe('deciding', () => {
  it('refuses a return without a comment, naming the field', async () => {
    const plan = await createPlan();
    await lead.post(`/api/plans/${plan.id}/submit`);
    const response = await reviewer.post(`/api/plans/${plan.id}/review`, { decision: 'return' });
    expect(response.status).toBe(400);
    expect(response.body.error.issues).toEqual([{ path: 'comment', message: 'is required when returning a plan: say what to fix' }]);
  });

  it('does not let anyone review a plan they wrote or edited', async () => {
    const plan = await createPlan(admin);
    await admin.post(`/api/plans/${plan.id}/submit`);
    const response = await admin.post(`/api/plans/${plan.id}/review`, { decision: 'approve' });
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe('OWN_PLAN');

    const edited = await createPlan(lead);
    expect((await admin.put(`/api/plans/${edited.id}`, { expectedRevision: 1, document: planDocument() })).status).toBe(200);
    await lead.post(`/api/plans/${edited.id}/submit`);
    expect((await admin.post(`/api/plans/${edited.id}/review`, { decision: 'approve' })).body.error.code).toBe('OWN_PLAN');
  });

  it('is for reviewers and admins only, and only on a submitted plan', async () => {
    const plan = await createPlan();
    expect((await reviewer.post(`/api/plans/${plan.id}/review`, { decision: 'approve' })).body.error.code).toBe('NOT_SUBMITTED');
    await lead.post(`/api/plans/${plan.id}/submit`);
    expect((await lead.post(`/api/plans/${plan.id}/review`, { decision: 'approve' })).status).toBe(403);
    expect((await apprentice.post(`/api/plans/${plan.id}/review`, { decision: 'approve' })).status).toBe(403);
  });

  it('keeps another organisation out (404)', async () => {
    const plan = await createPlan();
    await lead.post(`/api/plans/${plan.id}/submit`);
    const other = await makeTeam();
    const outsider = await signedIn(other.reviewer.email, PASSWORD);
    expect((await outsider.post(`/api/plans/${plan.id}/review`, { decision: 'approve' })).status).toBe(404);
    expect((await outsider.get(`/api/plans/${plan.id}/revisions`)).status).toBe(404);
    expect((await outsider.post(`/api/plans/${plan.id}/comments`, { body: 'hello' })).status).toBe(404);
  });

  it('lets exactly one of many simultaneous decisions win', async () => {
    const plan = await createPlan();
    await lead.post(`/api/plans/${plan.id}/submit`);
    const reviewers = await Promise.all(Array.from({ length: 22 }, () => makePerson(team.organizationId, 'reviewer')));
    const clients = await Promise.all(reviewers.map((r) => signedIn(r.email, PASSWORD)));
    const results = await Promise.all(
      clients.map((c, i) => c.post(`/api/plans/${plan.id}/review`, i % 2 ? { decision: 'approve' } : { decision: 'return', comment: `Reviewer ${i} wants changes` })),
    );
    expect(results.filter((r) => r.status === 200)).toHaveLength(1);
    expect(results.filter((r) => r.status === 409)).toHaveLength(21);
    const decisions = await testDb().models.PlanDecision.count({ where: { planId: plan.id } });
    expect(decisions).toBe(1);
    const winner = results.find((r) => r.status === 200)!.body.plan.status;
    expect((await lead.get(`/api/plans/${plan.id}`)).body.plan.status).toBe(winner);
  });
});

describe('the whole loop', () => {
  it('returns with a pinned comment, is fixed and resubmitted, approved with hashes, and stays fixed', async () => {
    const plan = await createPlan();
    expect((await lead.post(`/api/plans/${plan.id}/submit`)).status).toBe(200);

    const pinned = await reviewer.post(`/api/plans/${plan.id}/comments`, { elementId: 'jN', body: 'Use a shorter neutral lead.' });
    expect(pinned.status).toBe(201);
    expect(pinned.body.comment).toMatchObject({ elementId: 'jN', revision: 1, resolvedAt: null });
    const badPin = await reviewer.post(`/api/plans/${plan.id}/comments`, { elementId: 'nothing-here', body: 'x' });
    expect(badPin.status).toBe(400);
    expect(badPin.body.error.issues[0].path).toBe('elementId');

    const returned = await reviewer.post(`/api/plans/${plan.id}/review`, { decision: 'return', comment: 'Bond the bucket too.' });
    expect(returned.status).toBe(200);
    expect(returned.body.plan.status).toBe('returned');
    const returnMail = await mailTo(team.lead.email, `Returned with comments: ${plan.title}`);
    expect(returnMail.text).toContain('Bond the bucket too.');
    expect(returnMail.text).toContain('jN: Use a shorter neutral lead.');

    const comments = (await lead.get(`/api/plans/${plan.id}/comments`)).body.comments;
    expect(comments.map((c: { body: string }) => c.body)).toEqual(['Use a shorter neutral lead.', 'Bond the bucket too.']);
    for (const c of comments) expect((await lead.patch(`/api/plans/${plan.id}/comments/${c.id}`, { resolved: true })).body.comment.resolvedAt).not.toBeNull();

    const fixed = planDocument({ links: planDocument().links.map((l) => (l.id === 'jN' ? { ...l, lengthM: 1.2 } : l)) });
    expect((await lead.put(`/api/plans/${plan.id}`, { expectedRevision: 1, document: fixed })).status).toBe(200);
    expect((await lead.post(`/api/plans/${plan.id}/submit`)).status).toBe(200);

    const second = await signedIn((await makePerson(team.organizationId, 'reviewer')).email, PASSWORD);
    const approved = await second.post(`/api/plans/${plan.id}/review`, { decision: 'approve', teachingNote: 'All three phases and the neutral meet at one bar.' });
    expect(approved.status).toBe(200);
    expect(approved.body.plan).toMatchObject({ status: 'approved', currentRevision: 2 });
    await mailTo(team.lead.email, `Approved: ${approved.body.plan.title}`);

    const revision = (await apprentice.get(`/api/plans/${plan.id}/revisions/2`)).body.revision;
    expect(revision.state).toBe('approved');
    expect(revision.decision).toMatchObject({ decision: 'approve', teachingNote: 'All three phases and the neutral meet at one bar.' });
    expect(revision.decision.documentHash).toBe(sha(revision.document));
    expect(revision.decision.reportHash).toBe(sha(revision.report));
    expect((await apprentice.get(`/api/plans/${plan.id}/revisions/1`)).body.revision.state).toBe('returned');
    const list = (await apprentice.get(`/api/plans/${plan.id}/revisions`)).body.revisions;
    expect(list.map((r: { number: number }) => r.number)).toEqual([2, 1]);

    // Every write to the approved revision is refused.
    expect((await lead.put(`/api/plans/${plan.id}`, { expectedRevision: 2, document: planDocument() })).status).toBe(409);
    expect((await lead.post(`/api/plans/${plan.id}/submit`)).status).toBe(409);
    expect((await second.post(`/api/plans/${plan.id}/review`, { decision: 'return', comment: 'late' })).status).toBe(409);
    expect((await lead.post(`/api/plans/${plan.id}/check`)).body.stored).toBe(false);

    // Editing it starts a new draft revision that goes through review again.
    const reopened = await lead.post(`/api/plans/${plan.id}/reopen`);
    expect(reopened.status).toBe(201);
    expect(reopened.body.plan).toMatchObject({ status: 'draft', currentRevision: 3 });
    const still = (await apprentice.get(`/api/plans/${plan.id}/revisions/2`)).body.revision;
    expect(still.decision.documentHash).toBe(revision.decision.documentHash);
    expect(still.document).toEqual(revision.document);

    const diff = (await lead.get(`/api/plans/${plan.id}/diff?from=1&to=2`)).body.diff;
    // The saved document carries its own title, so the title changed too.
    expect(diff).toEqual({ added: [], removed: [], changed: [{ id: 'jN', kind: 'jumper', fields: ['lengthM'] }], plan: ['title'] });

    const actions = (await apprentice.get(`/api/plans/${plan.id}/history`)).body.events.map((e: { action: string }) => e.action).reverse();
    expect(actions).toEqual(['plan.created', 'plan.submitted', 'comment.added', 'plan.returned', 'comment.resolved', 'comment.resolved', 'plan.saved', 'plan.submitted', 'plan.approved', 'plan.reopened']);
  });
});

describe('mail when the mail server is down', () => {
  it('still answers the request, and delivers once the server is back', async () => {
    const port = Number(process.env.BONDMAP_TEST_SMTP_PORT);
    const env = Object.fromEntries(Object.entries(process.env).filter(([k]) => k.startsWith('BONDMAP_DB_'))) as Record<string, string>;
    expect(await stopMailCatcher('test')).toBe(true);
    let plan: { id: number; title: string };
    try {
      plan = await createPlan();
      const response = await lead.post(`/api/plans/${plan.id}/submit`);
      expect(response.status).toBe(200);
      // The delivery loop tries once and fails: wait for that attempt, not for a fixed time.
      const mine = await waitFor(async () => {
        const queued = await testDb().models.MailOutbox.findAll({ where: { toAddress: team.reviewer.email, kind: 'plan.submitted' } });
        const rows = queued.filter((m) => m.subject.includes(plan.title));
        return rows.length && rows.every((m) => m.attempts >= 1) ? rows : null;
      }, { what: 'a failed delivery attempt' });
      expect(mine).toHaveLength(1);
      expect(mine[0].status).toBe('pending');
      expect(mine[0].attempts).toBeGreaterThanOrEqual(1);
      expect(mine[0].lastError).toBeTruthy();
      // Let the retry come due soon, as if its back-off had passed.
      await testDb().models.MailOutbox.update({ nextAttemptAt: new Date() }, { where: { id: mine[0].id } });
    } finally {
      await startMailCatcher({ profile: 'test', port, env });
    }
    const mail = await mailTo(team.reviewer.email, plan!.title, 20_000);
    expect(mail.subject).toContain('Plan to review');
  });
});

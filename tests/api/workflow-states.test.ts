/**
 * The review workflow as a state machine over real HTTP: from every state each action either
 * moves the plan where the table in src/lib/domain/plan-status.ts says, or is refused and changes
 * nothing; every allowed action is taken from every state at least once (a returned plan
 * resubmitted unchanged included), and no state is a dead end.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { nextStatus, PLAN_STATUSES, WORKFLOW_ACTIONS, type PlanStatus, type WorkflowAction } from '@/lib/domain/plan-status';
import { submitPlan } from '@db/repositories/review';
import { checkPlan } from '@/lib/domain/checker';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeTeam, planDocument, testDb, PASSWORD } from '../helpers/factories';

let lead: Client;
let reviewer: Client;
let team: Awaited<ReturnType<typeof makeTeam>>;
beforeAll(async () => {
  team = await makeTeam();
  [lead, reviewer] = await Promise.all([signedIn(team.lead.email, PASSWORD), signedIn(team.reviewer.email, PASSWORD)]);
});
afterAll(closeTestDb);

async function current(planId: number): Promise<{ status: PlanStatus; currentRevision: number }> {
  const response = await lead.get(`/api/plans/${planId}`);
  expect(response.status).toBe(200);
  return response.body.plan;
}

let saves = 0;
function act(planId: number, action: WorkflowAction, revision: number) {
  switch (action) {
    case 'save':
      saves += 1;
      return lead.put(`/api/plans/${planId}`, { expectedRevision: revision, document: planDocument({ title: `Walked pole, save ${saves}` }) });
    case 'submit':
      return lead.post(`/api/plans/${planId}/submit`);
    case 'approve':
      return reviewer.post(`/api/plans/${planId}/review`, { decision: 'approve', revision });
    case 'return':
      return reviewer.post(`/api/plans/${planId}/review`, { decision: 'return', comment: 'Walked back once more.', revision });
    case 'reopen':
      return lead.post(`/api/plans/${planId}/reopen`);
    case 'withdraw':
      return lead.post(`/api/plans/${planId}/withdraw`);
  }
}

describe('the workflow state machine', () => {
  it('takes every allowed action from every state, refuses the rest, and never gets stuck', async () => {
    const created = await lead.post('/api/plans', { title: 'Walked pole', document: planDocument() });
    expect(created.status).toBe(201);
    const planId: number = created.body.plan.id;
    const taken = new Set<string>();
    const allowedEdges = PLAN_STATUSES.flatMap((s) => WORKFLOW_ACTIONS.filter((a) => nextStatus(s, a)).map((a) => `${s}:${a}`));
    // The unchanged resubmission is the case that used to leave a plan undecidable for good.
    const script: WorkflowAction[] = ['submit', 'withdraw', 'save', 'submit', 'return', 'submit', 'return', 'submit', 'approve', 'reopen', 'save', 'submit', 'return', 'save', 'submit', 'approve', 'reopen', 'submit', 'return', 'submit', 'approve'];

    for (const step of script) {
      const before = await current(planId);
      // Everything the table refuses from here is refused, and leaves the plan exactly as it was.
      for (const refused of WORKFLOW_ACTIONS.filter((a) => !nextStatus(before.status, a))) {
        const response = await act(planId, refused, before.currentRevision);
        expect(response.status, `${before.status}:${refused} ${response.text}`).toBe(409);
        expect(await current(planId)).toMatchObject(before);
      }
      // No dead end: the state has an allowed action, and the scripted one succeeds.
      expect(WORKFLOW_ACTIONS.some((a) => nextStatus(before.status, a))).toBe(true);
      const expected = nextStatus(before.status, step);
      expect(expected, `the script takes ${step} from ${before.status}`).not.toBeNull();
      const response = await act(planId, step, before.currentRevision);
      expect(response.status, `${before.status}:${step} ${response.text}`).toBeLessThan(300);
      const after = await current(planId);
      expect(after.status).toBe(expected);
      taken.add(`${before.status}:${step}`);
    }
    expect([...taken].sort()).toEqual(allowedEdges.sort());

    // Each revision was decided at most once, and every decision names a revision that exists.
    const decisions = await testDb().models.PlanDecision.findAll({ where: { planId } });
    expect(new Set(decisions.map((d) => d.revision)).size).toBe(decisions.length);
    expect(decisions).toHaveLength(script.filter((s) => s === 'approve' || s === 'return').length);
  });

  it('resubmits a returned revision unchanged as a new revision that can be decided', async () => {
    const plan = (await lead.post('/api/plans', { title: 'Unchanged pole', document: planDocument() })).body.plan;
    expect((await lead.post(`/api/plans/${plan.id}/submit`)).status).toBe(200);
    expect((await reviewer.post(`/api/plans/${plan.id}/review`, { decision: 'return', comment: 'Look again.' })).status).toBe(200);
    const again = await lead.post(`/api/plans/${plan.id}/submit`);
    expect(again.status).toBe(200);
    expect(again.body.plan).toMatchObject({ status: 'submitted', currentRevision: 2 });
    const first = (await lead.get(`/api/plans/${plan.id}/revisions/1`)).body.revision;
    const second = (await lead.get(`/api/plans/${plan.id}/revisions/2`)).body.revision;
    expect(second.document).toEqual(first.document);
    expect(first.state).toBe('returned');
    expect(second.state).toBe('submitted');
    const approved = await reviewer.post(`/api/plans/${plan.id}/review`, { decision: 'approve' });
    expect(approved.status).toBe(200);
    expect(approved.body.plan).toMatchObject({ status: 'approved', currentRevision: 2 });
  });

  it('never submits a revision other than the one the server checked', async () => {
    const plan = (await lead.post('/api/plans', { title: 'Raced pole', document: planDocument() })).body.plan;
    // A save lands between the submit's check of revision 1 and its transaction.
    expect((await lead.put(`/api/plans/${plan.id}`, { expectedRevision: 1, document: planDocument({ title: 'Saved meanwhile' }) })).status).toBe(200);
    const clean = checkPlan(planDocument());
    expect(clean.summary.blockers).toBe(0);
    const outcome = await submitPlan(testDb(), team.organizationId, plan.id, team.lead.id, clean, { checkedRevision: 1 });
    expect(outcome).toMatchObject({ kind: 'stale', revision: 2 });
    expect(await current(plan.id)).toMatchObject({ status: 'draft', currentRevision: 2 });
  });
});

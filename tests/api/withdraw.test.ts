/** Withdrawing a submitted plan: its author or an admin, before a decision, back to a draft at the same revision. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makePerson, makeTeam, planDocument, testDb, PASSWORD } from '../helpers/factories';

let team: Awaited<ReturnType<typeof makeTeam>>;
let lead: Client;
let otherLead: Client;
let reviewer: Client;
beforeAll(async () => {
  team = await makeTeam();
  const second = await makePerson(team.organizationId, 'crew_lead');
  [lead, otherLead, reviewer] = await Promise.all([signedIn(team.lead.email, PASSWORD), signedIn(second.email, PASSWORD), signedIn(team.reviewer.email, PASSWORD)]);
});
afterAll(closeTestDb);

async function submitted(): Promise<number> {
  const id = (await lead.post('/api/plans', { title: 'Withdrawn pole', document: planDocument() })).body.plan.id as number;
  expect((await lead.post(`/api/plans/${id}/submit`)).status).toBe(200);
  return id;
}

describe('withdraw', () => {
  it('the author takes it back to a draft at the same revision, with an audit event; it can be submitted again', async () => {
    const id = await submitted();
    const response = await lead.post(`/api/plans/${id}/withdraw`);
    expect(response.status).toBe(200);
    expect(response.body.plan).toMatchObject({ status: 'draft', currentRevision: 1 });
    const events = await testDb().models.AuditEvent.findAll({ where: { subjectType: 'plan', subjectId: String(id), action: 'plan.withdrawn' } });
    expect(events).toHaveLength(1);
    expect((await lead.post(`/api/plans/${id}/withdraw`)).body.error.code).toBe('NOT_WITHDRAWABLE');
    expect((await reviewer.post(`/api/plans/${id}/review`, { decision: 'return', comment: 'Too late.' })).status).toBe(409);
    expect((await lead.post(`/api/plans/${id}/submit`)).body.plan).toMatchObject({ status: 'submitted', currentRevision: 1 });
  });

  it('another crew lead may not withdraw it, and after a decision nobody can', async () => {
    const id = await submitted();
    // The plan page offers the button (asking first) to the author only.
    const own = await lead.get(`/plans/${id}`);
    expect(own.text).toMatch(/data-testid="withdraw-form"[\s\S]*?data-confirm="Withdraw this plan from review\?/);
    expect((await otherLead.get(`/plans/${id}`)).text).not.toContain('data-testid="withdraw-form"');
    const refused = await otherLead.post(`/api/plans/${id}/withdraw`);
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('NOT_AUTHOR');
    expect((await reviewer.post(`/api/plans/${id}/review`, { decision: 'return', comment: 'Look again.' })).status).toBe(200);
    const late = await lead.post(`/api/plans/${id}/withdraw`);
    expect(late.status).toBe(409);
    expect((await lead.get(`/api/plans/${id}`)).body.plan.status).toBe('returned');
  });
});

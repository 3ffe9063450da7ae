/** Diffs read as before → after values in words (history page; the review page after a return), never field names. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makePerson, makeTeam, planDocument, PASSWORD } from '../helpers/factories';

let lead: Client;
beforeAll(async () => {
  const team = await makeTeam();
  lead = await signedIn(team.lead.email, PASSWORD);
});
afterAll(closeTestDb);

describe('history diff in words', () => {
  it('shows the fault current and the neutral resistance before → after', async () => {
    const doc = planDocument({ title: 'Words pole' });
    const created = await lead.post('/api/plans', { title: 'Words pole', document: doc });
    expect(created.status).toBe(201);
    const id = created.body.plan.id as number;
    const changed = { ...doc, system: { ...doc.system, faultKa: 12 }, nodes: doc.nodes.map((n) => (n.id === 'N' && n.kind === 'neutral' ? { ...n, groundOhms: 8 } : n)) };
    expect((await lead.put(`/api/plans/${id}`, { expectedRevision: 1, document: changed })).status).toBe(200);
    const page = await lead.get(`/plans/${id}/history?from=1&to=2`);
    expect(page.status).toBe(200);
    const diff = page.text.slice(page.text.indexOf('data-testid="diff"'));
    expect(diff).toContain('available fault current 10 kA → 12 kA');
    expect(diff).toContain('resistance to earth 5 Ω → 8 Ω');
    expect(diff.slice(0, diff.indexOf('</ul>'))).not.toMatch(/faultKa|groundOhms|\bsystem\b/);
  });
});

describe('the review page after a return', () => {
  it('shows what changed between the returned revision and the one submitted again', async () => {
    const team = await makeTeam();
    const [author, reviewer, second] = await Promise.all([signedIn(team.lead.email, PASSWORD), signedIn(team.reviewer.email, PASSWORD), signedIn((await makePerson(team.organizationId, 'reviewer')).email, PASSWORD)]);
    const doc = planDocument({ title: 'Returned pole' });
    const id = (await author.post('/api/plans', { title: 'Returned pole', document: doc })).body.plan.id as number;
    expect((await author.post(`/api/plans/${id}/submit`)).status).toBe(200);
    const before = await reviewer.get(`/plans/${id}/review`);
    expect(before.text).not.toContain('data-testid="since-return"');
    expect((await reviewer.post(`/api/plans/${id}/review`, { decision: 'return', comment: 'Raise the fault current to the utility figure.' })).status).toBe(200);
    expect((await author.put(`/api/plans/${id}`, { expectedRevision: 1, document: { ...doc, system: { ...doc.system, faultKa: 12 } } })).status).toBe(200);
    expect((await author.post(`/api/plans/${id}/submit`)).status).toBe(200);
    const page = await second.get(`/plans/${id}/review`);
    expect(page.status).toBe(200);
    const section = page.text.slice(page.text.indexOf('data-testid="since-return"'));
    expect(section).toContain('Changed since revision 1 was returned');
    expect(section).toContain('available fault current 10 kA → 12 kA');
    expect(section).toContain('Raise the fault current to the utility figure.');
  });
});

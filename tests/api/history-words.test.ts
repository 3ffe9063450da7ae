/** The history page's diff reads as before → after values in words, not the plan format's field names. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeTeam, planDocument, PASSWORD } from '../helpers/factories';

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

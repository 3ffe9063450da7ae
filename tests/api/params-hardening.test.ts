/**
 * Small holes: numbers in paths and queries written any way but plain digits, query values that
 * name properties of plain objects, and a check report stored by someone who may not edit.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeTeam, planDocument, testDb, PASSWORD } from '../helpers/factories';

let lead: Client;
let apprentice: Client;
let reviewer: Client;
let planId: number;
beforeAll(async () => {
  const team = await makeTeam();
  [lead, apprentice, reviewer] = await Promise.all([signedIn(team.lead.email, PASSWORD), signedIn(team.apprentice.email, PASSWORD), signedIn(team.reviewer.email, PASSWORD)]);
  planId = (await lead.post('/api/plans', { title: 'Param pole', document: planDocument() })).body.plan.id;
  expect((await lead.put(`/api/plans/${planId}`, { expectedRevision: 1, document: planDocument() })).status).toBe(200);
});
afterAll(closeTestDb);

describe('numbers in paths and queries', () => {
  it('reads plain digits', async () => {
    expect((await lead.get(`/api/plans/${planId}/revisions/1`)).status).toBe(200);
    expect((await lead.get(`/api/plans/${planId}/diff?from=1&to=2`)).status).toBe(200);
  });

  it.each(['0x1', '%31', '1%20', '%201', '1e0', '01', '1.0', '+1', '-1', '0', '１'])('refuses revision %s with 400 naming the field', async (n) => {
    const response = await lead.get(`/api/plans/${planId}/revisions/${n}`);
    expect(response.status, response.text).toBe(400);
    expect(response.body.error.issues[0].path).toBe('revision');
    // In a query string %31 is the digit 1 by definition (URLSearchParams decodes it); the rest are refused.
    if (n === '%31') return;
    const diff = await lead.get(`/api/plans/${planId}/diff?from=${n}&to=2`);
    expect(diff.status).toBe(400);
    expect(diff.body.error.issues[0].path).toBe('from');
  });

  it('refuses a plan id written as 0x1 or %31 the same way', async () => {
    for (const id of ['0x1', '%31']) {
      const response = await lead.get(`/api/plans/${id}`);
      expect(response.status).toBe(400);
      expect(response.body.error.issues[0].path).toBe('id');
    }
  });
});

describe('notices named like object properties', () => {
  it.each(['constructor', 'toString', '__proto__', 'hasOwnProperty'])('prints nothing when ?notice= and ?problem= are %s', async (name) => {
    const page = await lead.get(`/plans/${planId}?notice=${name}&problem=${name}`);
    expect(page.status).toBe(200);
    // What the page prints, without its scripts (a bundled script may well say `function `).
    const printed = page.text.replace(/<script\b[^>]*>[\s\S]*?<\/script>/g, '');
    expect(printed).not.toMatch(/\[object Object\]|function |native code/);
    expect(page.text).not.toMatch(/<p role="status" class="font-semibold text-clear">/);
    expect(page.text).not.toMatch(/<p role="alert" class="font-semibold text-blocker">/);
  });
});

describe('re-checking a draft', () => {
  it('is read-only for an apprentice and a reviewer, and stored for the crew lead', async () => {
    const revision = () => testDb().models.PlanRevision.findOne({ where: { planId, number: 2 } });
    await testDb().models.PlanRevision.update({ report: null }, { where: { planId, number: 2 } });
    for (const client of [apprentice, reviewer]) {
      const response = await client.post(`/api/plans/${planId}/check`);
      expect(response.status).toBe(200);
      expect(response.body).toMatchObject({ revision: 2, stored: false });
      expect(response.body.report.summary).toBeDefined();
      expect((await revision())!.report).toBeNull();
    }
    const stored = await lead.post(`/api/plans/${planId}/check`);
    expect(stored.body.stored).toBe(true);
    expect(JSON.parse((await revision())!.report!)).toEqual(stored.body.report);
  });
});

/** The review page's decision form keeps what the reviewer chose when it is sent back for a fix. */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeTeam, planDocument, PASSWORD } from '../helpers/factories';

let lead: Client;
let reviewer: Client;
beforeAll(async () => {
  const team = await makeTeam();
  [lead, reviewer] = await Promise.all([signedIn(team.lead.email, PASSWORD), signedIn(team.reviewer.email, PASSWORD)]);
});
afterAll(closeTestDb);

it('"a comment is required" leaves Return chosen and the teaching note as typed', async () => {
  const created = await lead.post('/api/plans', { title: 'Form pole', document: planDocument() });
  expect(created.status).toBe(201);
  const id = created.body.plan.id as number;
  expect((await lead.post(`/api/plans/${id}/submit`)).status).toBe(200);
  const form = new URLSearchParams({ action: 'decide', revision: String(created.body.plan.currentRevision), decision: 'return', comment: '', teachingNote: 'Bar at the feet' });
  const page = await reviewer.request('POST', `/plans/${id}/review`, { body: form.toString(), headers: { 'content-type': 'application/x-www-form-urlencoded', origin: new URL(reviewer.baseUrl).origin } });
  expect(page.text).toMatch(/A comment[^<]*required|A comment[^<]*/);
  expect(page.text).toMatch(/value="return"[^>]*checked/);
  expect(page.text).not.toMatch(/value="approve"[^>]*checked/);
  expect(page.text).toContain('Bar at the feet</textarea>');
});

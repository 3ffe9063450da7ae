/**
 * The library reads what it shows from the approval: title, tags, material and the findings
 * fixed along the way are stored on the approving decision (migration 0009); approvals from
 * before that are filled the first time the library reads them.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { libraryEntry, listLibrary } from '@db/repositories/library';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeTeam, planDocument, testDb, PASSWORD } from '../helpers/factories';

let team: Awaited<ReturnType<typeof makeTeam>>;
let lead: Client;
let reviewer: Client;
let apprentice: Client;
beforeAll(async () => {
  team = await makeTeam();
  [lead, reviewer, apprentice] = await Promise.all([signedIn(team.lead.email, PASSWORD), signedIn(team.reviewer.email, PASSWORD), signedIn(team.apprentice.email, PASSWORD)]);
});
afterAll(closeTestDb);

/** A climber standing on the wood pole: stand-not-conductive is a blocker. */
function blockedDocument() {
  const doc = planDocument({ title: 'Library pole, first try' });
  return { ...doc, nodes: [...doc.nodes.filter((n) => n.id !== 'W1'), { id: 'P1', kind: 'structure' as const, material: 'wood' as const }, { id: 'W1', kind: 'worker' as const, standsOn: 'P1' }] };
}

/** Draws a blocked plan, fixes it in a second save, and has it approved; returns its id. */
async function approvedAfterAFix(): Promise<number> {
  const created = await lead.post('/api/plans', { title: 'Library pole', document: blockedDocument() });
  expect(created.status).toBe(201);
  const id = created.body.plan.id as number;
  const blocked = await lead.post(`/api/plans/${id}/submit`);
  expect(blocked.body.error.code).toBe('SUBMIT_BLOCKED');
  expect((await lead.put(`/api/plans/${id}`, { expectedRevision: 1, document: planDocument({ title: 'Library pole, as approved' }) })).status).toBe(200);
  expect((await lead.post(`/api/plans/${id}/submit`)).status).toBe(200);
  expect((await reviewer.post(`/api/plans/${id}/review`, { decision: 'approve', teachingNote: 'Stand on something bonded.' })).status).toBe(200);
  return id;
}

describe('the library', () => {
  it('stores title, tags and fixed findings at approval and shows them without reading revisions', async () => {
    const id = await approvedAfterAFix();
    const row = await testDb().models.PlanDecision.findOne({ where: { planId: id, decision: 'approve' } });
    expect(row!.title).toBe('Library pole, as approved');
    expect(JSON.parse(row!.fixedRules!)).toContain('stand-not-conductive');
    expect(JSON.parse(row!.libraryTags!).length).toBeGreaterThan(0);
    const entry = await libraryEntry(testDb(), team.organizationId, id);
    expect(entry).toMatchObject({ planId: id, revision: 2, title: 'Library pole, as approved', teachingNote: 'Stand on something bonded.' });
    expect(entry!.fixedRules).toContain('stand-not-conductive');
    // Editing after approval (a new draft, retitled) leaves the library's entry as approved.
    expect((await lead.post(`/api/plans/${id}/reopen`)).status).toBe(201);
    expect((await lead.put(`/api/plans/${id}`, { expectedRevision: 3, document: planDocument({ title: 'Library pole, being redrawn' }) })).status).toBe(200);
    expect((await libraryEntry(testDb(), team.organizationId, id))!.title).toBe('Library pole, as approved');
    const page = await apprentice.get(`/library/${id}`);
    expect(page.status).toBe(200);
    expect(page.text).toContain('Library pole, as approved');
    const filtered = (await apprentice.get('/library?fixed=stand-not-conductive')).text;
    expect(filtered).toContain('Library pole, as approved');
    // The crew reads the finding's title; the rule id stays only in the filter's value.
    expect(filtered).toContain('Fixed on the way: Worker stands on something that does not conduct');
    expect(filtered.replace(/value="[^"]*"|href="[^"]*"/g, '')).not.toContain('stand-not-conductive');
  });

  it('fills an approval made before the stored facts on first read, with the same result', async () => {
    const id = await approvedAfterAFix();
    const before = await libraryEntry(testDb(), team.organizationId, id);
    await testDb().models.PlanDecision.update({ title: null, libraryTags: null, material: null, fixedRules: null }, { where: { planId: id } });
    const listed = (await listLibrary(testDb(), team.organizationId)).find((e) => e.planId === id);
    expect(listed).toEqual(before);
    const row = await testDb().models.PlanDecision.findOne({ where: { planId: id, decision: 'approve' } });
    expect(row!.libraryTags).not.toBeNull();
    expect(await libraryEntry(testDb(), team.organizationId, 999_999_999)).toBeNull();
  });
});

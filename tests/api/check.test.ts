import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkPlan } from '@/lib/domain/checker';
import { CAUTION } from '@/lib/domain/report';
import { parsePlan } from '@/lib/schemas/plan';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeTeam, planDocument, testDb, PASSWORD } from '../helpers/factories';

const fixture = (name: string) => JSON.parse(readFileSync(join(import.meta.dirname, '../../fixtures/plans', name), 'utf8'));

let apprentice: Client;
let lead: Client;
beforeAll(async () => {
  const team = await makeTeam();
  apprentice = await signedIn(team.apprentice.email, PASSWORD);
  lead = await signedIn(team.lead.email, PASSWORD);
});
afterAll(closeTestDb);

describe('POST /api/check', () => {
  it.each(['ground-worker-no-mat.json', 'bucket-tangent-clean.json', 'rod-only-ground.json'])('returns the same report as the checker for %s', async (name) => {
    const document = fixture(name);
    const response = await apprentice.post('/api/check', document);
    expect(response.status).toBe(200);
    const parsed = parsePlan(document);
    if (!parsed.ok) throw new Error(`fixture ${name} is invalid`);
    expect(response.body).toEqual(JSON.parse(JSON.stringify(checkPlan(parsed.plan))));
    expect(response.body).toMatchObject({ format: 'bondmap-check', version: 1, caution: CAUTION });
  });

  const bad: { name: string; doc: () => unknown; path: string }[] = [
    { name: 'not an object', doc: () => 'plan', path: '(document)' },
    { name: 'no format', doc: () => ({ ...planDocument(), format: undefined }), path: 'format' },
    { name: 'version 2', doc: () => ({ ...planDocument(), version: 2 }), path: 'version' },
    { name: 'no system', doc: () => ({ ...planDocument(), system: undefined }), path: 'system' },
    { name: 'fault current 0', doc: () => planDocument({ system: { ...planDocument().system, faultKa: 0 } }), path: 'system.faultKa' },
    { name: 'clearing 500 cycles', doc: () => planDocument({ system: { ...planDocument().system, clearingCycles: 500 } }), path: 'system.clearingCycles' },
    { name: 'X/R negative', doc: () => planDocument({ system: { ...planDocument().system, xOverR: -2 } }), path: 'system.xOverR' },
    { name: 'body 60 kg', doc: () => planDocument({ criteria: { bodyKg: 60 as 50 } }), path: 'criteria.bodyKg' },
    { name: 'structure without material', doc: () => planDocument({ nodes: [...planDocument().nodes, { id: 'P', kind: 'structure' } as never] }), path: 'nodes[6].material' },
    { name: 'rod without soil', doc: () => planDocument({ nodes: [...planDocument().nodes, { id: 'R', kind: 'ground-rod', lengthM: 2.4, diameterMm: 16 } as never] }), path: 'nodes[6].soilOhmM' },
    { name: 'worker on a worker', doc: () => planDocument({ nodes: [...planDocument().nodes, { id: 'W2', kind: 'worker', standsOn: 'W1' }] }), path: 'nodes[6].standsOn' },
    { name: 'reach not from a worker', doc: () => planDocument({ links: [...planDocument().links, { id: 'r9', kind: 'reach', from: 'A', to: 'B' }] }), path: 'links[5].from' },
    { name: 'jumper to a worker', doc: () => planDocument({ links: [...planDocument().links, { id: 'j9', kind: 'jumper', from: 'W1', to: 'CB', cable: '2/0', lengthM: 1 }] }), path: 'links[5].kind' },
    { name: 'link id equal to a node id', doc: () => planDocument({ links: [...planDocument().links, { id: 'A', kind: 'bond', from: 'B', to: 'CB' }] }), path: 'links[5].id' },
    { name: 'clamp rating negative', doc: () => planDocument({ links: [{ id: 'j1', kind: 'jumper', from: 'A', to: 'CB', cable: '2/0', lengthM: 1, clampKa: -3 }] }), path: 'links[0].clampKa' },
    { name: 'unknown link kind', doc: () => planDocument({ links: [{ id: 'x', kind: 'rope', from: 'A', to: 'CB' } as never] }), path: 'links[0].kind' },
  ];
  it.each(bad)('refuses $name with 400 naming $path', async ({ doc, path }) => {
    const response = await apprentice.post('/api/check', doc());
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('VALIDATION');
    expect(response.body.error.issues.map((i: { path: string }) => i.path)).toContain(path);
  });
});

describe('POST /api/plans/:id/check', () => {
  it('checks the current revision again and stores the report with it', async () => {
    const created = await lead.post('/api/plans', { title: 'Stored check pole', document: planDocument() });
    const id = created.body.plan.id;
    await testDb().models.PlanRevision.update({ report: null }, { where: { planId: id } });
    const response = await lead.post(`/api/plans/${id}/check`);
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({ revision: 1, stored: true });
    const row = await testDb().models.PlanRevision.findOne({ where: { planId: id, number: 1 } });
    expect(JSON.parse(row!.report!)).toEqual(response.body.report);
  });
});

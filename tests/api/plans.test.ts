import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeTeam, planDocument, testDb, PASSWORD } from '../helpers/factories';

let lead: Client;
let admin: Client;
beforeAll(async () => {
  const team = await makeTeam();
  lead = await signedIn(team.lead.email, PASSWORD);
  admin = await signedIn(team.admin.email, PASSWORD);
});
afterAll(closeTestDb);

async function newPlan(title = 'Invented pole 5') {
  const response = await lead.post('/api/plans', { title, document: planDocument() });
  expect(response.status).toBe(201);
  return response.body.plan;
}

describe('creating and reading', () => {
  it('creates a draft at revision 1 with its check report and reads it back', async () => {
    const plan = await newPlan('Pole 5 at the invented creek');
    expect(plan).toMatchObject({ title: 'Pole 5 at the invented creek', status: 'draft', currentRevision: 1 });
    expect(plan.document.title).toBe('Pole 5 at the invented creek');
    expect(plan.report.format).toBe('bondmap-check');
    expect(plan.blockers).toBe(plan.report.summary.blockers);
    const read = await lead.get(`/api/plans/${plan.id}`);
    expect(read.status).toBe(200);
    expect(read.body.plan.document).toEqual(plan.document);
  });

  it('answers 404 for a plan that does not exist and 400 for a bad id', async () => {
    expect((await lead.get('/api/plans/99999999')).status).toBe(404);
    const bad = await lead.get('/api/plans/abc');
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe('id');
  });
});

describe('listing', () => {
  it('pages, filters by status, searches by title and sorts', async () => {
    const team = await makeTeam();
    const own = await signedIn(team.lead.email, PASSWORD);
    for (const title of ['Bravo pole', 'Alpha pole', 'Charlie pole', 'Delta tower', 'Echo pole']) {
      expect((await own.post('/api/plans', { title, document: planDocument() })).status).toBe(201);
    }
    const first = await own.get('/api/plans?pageSize=2&sort=title&dir=asc');
    expect(first.body).toMatchObject({ total: 5, page: 1, pageSize: 2, pages: 3 });
    expect(first.body.items.map((p: { title: string }) => p.title)).toEqual(['Alpha pole', 'Bravo pole']);
    const third = await own.get('/api/plans?pageSize=2&page=3&sort=title&dir=asc');
    expect(third.body.items.map((p: { title: string }) => p.title)).toEqual(['Echo pole']);
    const search = await own.get('/api/plans?q=tower');
    expect(search.body.items.map((p: { title: string }) => p.title)).toEqual(['Delta tower']);
    const id = first.body.items[0].id;
    await testDb().models.Plan.update({ status: 'submitted' }, { where: { id } });
    const submitted = await own.get('/api/plans?status=submitted');
    expect(submitted.body.items.map((p: { id: number }) => p.id)).toEqual([id]);
    const newest = await own.get('/api/plans?sort=updated');
    expect(newest.body.items[0].title).toBe('Alpha pole'); // changed last
  });

  it('refuses bad query parameters naming them', async () => {
    const response = await lead.get('/api/plans?status=lost&pageSize=1000&sort=colour');
    expect(response.status).toBe(400);
    expect(response.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual(['pageSize', 'sort', 'status']);
  });
});

describe('saving drafts', () => {
  it('saves a new revision when the expected revision is current', async () => {
    const plan = await newPlan();
    const changed = planDocument({ title: 'Renamed in the document' });
    const saved = await lead.put(`/api/plans/${plan.id}`, { expectedRevision: 1, document: changed });
    expect(saved.status).toBe(200);
    expect(saved.body.plan).toMatchObject({ currentRevision: 2, title: 'Renamed in the document' });
    const revisions = await testDb().models.PlanRevision.count({ where: { planId: plan.id } });
    expect(revisions).toBe(2);
  });

  it('answers a stale save with 409 and the current revision, and keeps what was saved', async () => {
    const plan = await newPlan();
    const mine = planDocument({ title: 'Mine' });
    const theirs = planDocument({ title: 'Theirs' });
    expect((await lead.put(`/api/plans/${plan.id}`, { expectedRevision: 1, document: theirs })).status).toBe(200);
    const stale = await admin.put(`/api/plans/${plan.id}`, { expectedRevision: 1, document: mine });
    expect(stale.status).toBe(409);
    expect(stale.body.error).toMatchObject({ code: 'STALE_REVISION', currentRevision: 2, yourRevision: 1 });
    expect(stale.body.error.current.document.title).toBe('Theirs');
    const read = await lead.get(`/api/plans/${plan.id}`);
    expect(read.body.plan).toMatchObject({ currentRevision: 2, title: 'Theirs' });
  });

  it('lets exactly one of many simultaneous saves from the same revision win', async () => {
    const plan = await newPlan();
    const results = await Promise.all(
      Array.from({ length: 12 }, (_, i) => lead.put(`/api/plans/${plan.id}`, { expectedRevision: 1, document: planDocument({ title: `Racer ${i}` }) })),
    );
    const statuses = results.map((r) => r.status).sort();
    expect(statuses.filter((s) => s === 200)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(11);
    const winner = results.find((r) => r.status === 200)!.body.plan.title;
    expect((await lead.get(`/api/plans/${plan.id}`)).body.plan).toMatchObject({ currentRevision: 2, title: winner });
  });

  it('refuses to change a plan that is not a draft', async () => {
    const plan = await newPlan();
    await testDb().models.Plan.update({ status: 'approved' }, { where: { id: plan.id } });
    const response = await lead.put(`/api/plans/${plan.id}`, { expectedRevision: 1, document: planDocument() });
    expect(response.status).toBe(409);
    expect(response.body.error).toMatchObject({ code: 'NOT_EDITABLE', status: 'approved' });
  });
});

describe('bad input is refused whole, every problem by path', () => {
  const valid = () => ({ title: 'Bad input pole', document: planDocument() });
  const cases: { name: string; body: () => unknown; paths: string[] }[] = [
    { name: 'missing title', body: () => ({ document: planDocument() }), paths: ['title'] },
    { name: 'missing document', body: () => ({ title: 'x' }), paths: ['document'] },
    { name: 'wrong format', body: () => ({ ...valid(), document: { ...planDocument(), format: 'something-else' } }), paths: ['document.format'] },
    { name: 'wrong version', body: () => ({ ...valid(), document: { ...planDocument(), version: 2 } }), paths: ['document.version'] },
    { name: 'negative fault current', body: () => ({ ...valid(), document: planDocument({ system: { ...planDocument().system, faultKa: -5 } }) }), paths: ['document.system.faultKa'] },
    { name: 'fault current over 200 kA', body: () => ({ ...valid(), document: planDocument({ system: { ...planDocument().system, faultKa: 250 } }) }), paths: ['document.system.faultKa'] },
    { name: 'frequency not 50 or 60', body: () => ({ ...valid(), document: planDocument({ system: { ...planDocument().system, frequencyHz: 55 as 60 } }) }), paths: ['document.system.frequencyHz'] },
    { name: 'clearing cycles as a string', body: () => ({ ...valid(), document: planDocument({ system: { ...planDocument().system, clearingCycles: '15' as unknown as number } }) }), paths: ['document.system.clearingCycles'] },
    { name: 'unknown node kind', body: () => ({ ...valid(), document: planDocument({ nodes: [...planDocument().nodes, { id: 'Z', kind: 'teapot' } as never] }) }), paths: ['document.nodes[6].kind'] },
    { name: 'duplicate node id', body: () => ({ ...valid(), document: planDocument({ nodes: [...planDocument().nodes, { id: 'A', kind: 'phase' }] }) }), paths: ['document.nodes[6].id'] },
    { name: 'worker stands on an unknown node', body: () => ({ ...valid(), document: planDocument({ nodes: [...planDocument().nodes.slice(0, 5), { id: 'W1', kind: 'worker', standsOn: 'B9' }] }) }), paths: ['document.nodes[5].standsOn'] },
    { name: 'link to an unknown node', body: () => ({ ...valid(), document: planDocument({ links: [...planDocument().links, { id: 'jX', kind: 'jumper', from: 'A', to: 'Q9', cable: '2/0', lengthM: 2 }] }) }), paths: ['document.links[5].to'] },
    { name: 'bad cable size', body: () => ({ ...valid(), document: planDocument({ links: [{ id: 'jX', kind: 'jumper', from: 'A', to: 'CB', cable: '6' as '2', lengthM: 2 }] }) }), paths: ['document.links[0].cable'] },
    { name: 'negative jumper length', body: () => ({ ...valid(), document: planDocument({ links: [{ id: 'jX', kind: 'jumper', from: 'A', to: 'CB', cable: '2/0', lengthM: -1 }] }) }), paths: ['document.links[0].lengthM'] },
    { name: 'link from and to the same node', body: () => ({ ...valid(), document: planDocument({ links: [{ id: 'b1', kind: 'bond', from: 'A', to: 'A' }] }) }), paths: ['document.links[0].to'] },
    { name: 'rod group without spacing', body: () => ({ ...valid(), document: planDocument({ nodes: [...planDocument().nodes, { id: 'R1', kind: 'ground-rod', lengthM: 2.4, diameterMm: 16, soilOhmM: 100, count: 2 }] }) }), paths: ['document.nodes[6].spacingM'] },
    { name: 'nodes not a list', body: () => ({ ...valid(), document: { ...planDocument(), nodes: 'many' } }), paths: ['document.nodes'] },
    { name: 'several problems at once', body: () => ({ title: '', document: planDocument({ system: { ...planDocument().system, xOverR: -1 }, nodes: [...planDocument().nodes, { id: 'W2', kind: 'worker', standsOn: 'nowhere' }] }) }), paths: ['title', 'document.system.xOverR', 'document.nodes[6].standsOn'] },
  ];

  it.each(cases)('$name → 400 naming $paths', async ({ body, paths }) => {
    const before = await testDb().models.Plan.count();
    const response = await lead.post('/api/plans', body());
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('VALIDATION');
    expect(response.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual([...paths].sort());
    expect(await testDb().models.Plan.count()).toBe(before);
  });

  it('refuses a body that is not JSON', async () => {
    const response = await lead.request('POST', '/api/plans', { body: '{"title": "x", ', headers: { 'content-type': 'application/json' } });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('NOT_JSON');
  });

  it('refuses a body that is not sent as JSON', async () => {
    const response = await lead.request('POST', '/api/plans', { body: '<plan/>', headers: { 'content-type': 'application/xml' } });
    expect(response.status).toBe(415);
    expect(response.body.error.code).toBe('UNSUPPORTED_MEDIA');
  });

  it('refuses an oversized body without reading it all', async () => {
    const huge = JSON.stringify({ title: 'x', document: { ...planDocument(), padding: 'x'.repeat(3 * 1024 * 1024) } });
    const response = await lead.request('POST', '/api/plans', { body: huge, headers: { 'content-type': 'application/json' } });
    expect(response.status).toBe(413);
    expect(response.body.error.code).toBe('BODY_TOO_LARGE');
  });

  it('refuses a save without expectedRevision, naming it', async () => {
    const plan = await newPlan();
    const response = await lead.put(`/api/plans/${plan.id}`, { document: planDocument() });
    expect(response.status).toBe(400);
    expect(response.body.error.issues).toEqual([{ path: 'expectedRevision', message: 'is required' }]);
  });
});

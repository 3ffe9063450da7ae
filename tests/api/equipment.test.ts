/** Grounding sets over HTTP on the real database: records, tests and faults, lists, import, checks. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMonths } from '@/lib/domain/equipment';
import type { Client } from '../helpers/api';
import { signedIn } from '../helpers/api';
import { CSV_HEADER, monthsAgo, postCsv, setBody, today, uniqueTag } from '../helpers/equipment';
import { closeTestDb, makeTeam, planDocument, testDb, PASSWORD } from '../helpers/factories';

let admin: Client;
let lead: Client;
let organizationId: number;
beforeAll(async () => {
  const team = await makeTeam();
  organizationId = team.organizationId;
  admin = await signedIn(team.admin.email, PASSWORD);
  lead = await signedIn(team.lead.email, PASSWORD);
});
afterAll(closeTestDb);

const count = () => testDb().models.GroundingSet.count({ where: { organizationId } });

describe('a set record', () => {
  it('is created with the wire names and a due date one interval after its last test', async () => {
    const body = setBody({ lastTestedOn: monthsAgo(3) });
    const response = await admin.post('/api/equipment', body);
    expect(response.status).toBe(201);
    expect(Object.keys(response.body.set).sort()).toEqual(['cable', 'clampCycles', 'clampKa', 'clampKind', 'connection', 'description', 'id', 'inServiceOn', 'lastTestedOn', 'lengthM', 'notes', 'status', 'statusReason', 'tag', 'testDueOn'].sort());
    expect(response.body.set).toMatchObject({ tag: body.tag, status: 'in-service', lastTestedOn: body.lastTestedOn, testDueOn: addMonths(body.lastTestedOn, 12) });
  });

  it.each([
    ['a leap day', '2024-02-29', null, '2025-02-28'],
    ['a month end before February', '2026-01-31', null, '2027-01-31'],
    ['the in-service date on a leap day, never tested', null, '2024-02-29', '2025-02-28'],
    ['the last day of the year', '2025-12-31', null, '2026-12-31'],
  ])('computes the due date from %s', async (_name, lastTestedOn, inServiceOn, due) => {
    const response = await admin.post('/api/equipment', setBody({ lastTestedOn, ...(inServiceOn ? { inServiceOn } : { inServiceOn: '2023-01-01' }) }));
    expect(response.status).toBe(201);
    expect(response.body.set.testDueOn).toBe(due);
  });

  it('refuses a duplicate tag with 409 naming it, and saves nothing', async () => {
    const body = setBody();
    expect((await admin.post('/api/equipment', body)).status).toBe(201);
    const before = await count();
    const again = await admin.post('/api/equipment', { ...body, description: 'another' });
    expect(again.status).toBe(409);
    expect(again.body.error).toMatchObject({ code: 'SET_TAG_TAKEN', tag: body.tag });
    expect(await count()).toBe(before);
  });

  it('names every bad field', async () => {
    const response = await admin.post('/api/equipment', { ...setBody(), cable: '3/8', lengthM: -1, clampKind: 'hook', inServiceOn: '2025-02-29' });
    expect(response.status).toBe(400);
    expect(response.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual(['cable', 'clampKind', 'inServiceOn', 'lengthM']);
    const retired = await admin.post('/api/equipment', { ...setBody(), status: 'retired' });
    expect(retired.body.error.issues).toEqual([{ path: 'statusReason', message: 'is required when the status is retired' }]);
  });
});

describe('faults and tests', () => {
  it('takes a set out of service after a fault and puts it back after a passing test', async () => {
    const created = await admin.post('/api/equipment', setBody());
    const id = created.body.set.id;
    const fault = await admin.patch(`/api/equipment/${id}`, { faultOn: today() });
    expect(fault.status).toBe(200);
    expect(fault.body.set).toMatchObject({ status: 'out-of-service' });
    expect(fault.body.set.statusReason).toMatch(/fault current/);
    const early = await admin.patch(`/api/equipment/${id}`, { status: 'in-service' });
    expect(early.status).toBe(409);
    expect(early.body.error.code).toBe('SET_NEEDS_TEST');
    const failed = await lead.post(`/api/equipment/${id}/tests`, { testedOn: today(), resistanceMilliohms: 2.4, limitMilliohms: 1.5 });
    expect(failed.status).toBe(201);
    expect(failed.body.test.passed).toBe(false);
    expect(failed.body.set.status).toBe('out-of-service');
    const passed = await lead.post(`/api/equipment/${id}/tests`, { testedOn: today(), resistanceMilliohms: 0.9, limitMilliohms: 1.5 });
    expect(passed.body.test.passed).toBe(true);
    expect(passed.body.set).toMatchObject({ status: 'in-service', statusReason: null, lastTestedOn: today(), testDueOn: addMonths(today(), 12) });
    const detail = await admin.get(`/api/equipment/${id}`);
    expect(detail.body.tests.map((t: { passed: boolean }) => t.passed)).toEqual([true, false]);
    expect(detail.body.events.map((e: { kind: string }) => e.kind)).toEqual(['status', 'test', 'test', 'fault', 'created']);
  });

  it('does not bring back a set an admin took out of service for another reason', async () => {
    const id = (await admin.post('/api/equipment', setBody())).body.set.id;
    const out = await admin.patch(`/api/equipment/${id}`, { status: 'out-of-service', statusReason: 'Ferrule cracked' });
    expect(out.body.set).toMatchObject({ status: 'out-of-service', statusReason: 'Ferrule cracked' });
    const passed = await lead.post(`/api/equipment/${id}/tests`, { testedOn: today(), resistanceMilliohms: 0.5, passed: true });
    expect(passed.body.set.status).toBe('out-of-service');
    expect((await admin.patch(`/api/equipment/${id}`, { status: 'retired' })).status).toBe(400);
    const retired = await admin.patch(`/api/equipment/${id}`, { status: 'retired', statusReason: 'Cable worn' });
    expect(retired.body.set).toMatchObject({ status: 'retired', statusReason: 'Cable worn' });
  });

  it("uses the organisation's own limit, and needs `passed` when none applies", async () => {
    const id = (await admin.post('/api/equipment', setBody({ cable: '4/0', lengthM: 6 }))).body.set.id;
    const none = await lead.post(`/api/equipment/${id}/tests`, { testedOn: today(), resistanceMilliohms: 1 });
    expect(none.status).toBe(400);
    expect(none.body.error.issues[0].path).toBe('passed');
    const settings = await admin.put('/api/equipment/settings', { resistanceLimits: [{ cable: '4/0', maxLengthM: 8, limitMilliohms: 1.2 }] });
    expect(settings.status).toBe(200);
    const over = await lead.post(`/api/equipment/${id}/tests`, { testedOn: today(), resistanceMilliohms: 1.3 });
    expect(over.body.test).toMatchObject({ passed: false, limitMilliohms: 1.2 });
    const contradict = await lead.post(`/api/equipment/${id}/tests`, { testedOn: today(), resistanceMilliohms: 1.3, passed: true });
    expect(contradict.status).toBe(400);
    expect((await lead.post(`/api/equipment/${id}/tests`, { testedOn: '2999-01-01', resistanceMilliohms: 1, passed: true })).body.error.issues[0].path).toBe('testedOn');
  });

  it('moves every due date when the organisation changes its interval, and marks the default as not chosen', async () => {
    const team = await makeTeam();
    const own = await signedIn(team.admin.email, PASSWORD);
    expect((await own.get('/api/equipment/settings')).body.settings).toEqual({ testIntervalMonths: 12, intervalIsDefault: true, resistanceLimits: [] });
    const body = setBody({ lastTestedOn: '2026-01-31' });
    await own.post('/api/equipment', body);
    await own.put('/api/equipment/settings', { testIntervalMonths: 1 });
    const listed = await own.get('/api/equipment');
    expect(listed.body.items[0].testDueOn).toBe('2026-02-28');
    expect((await own.get('/api/equipment/settings')).body.settings.intervalIsDefault).toBe(false);
  });
});

describe('GET /api/equipment', () => {
  it('filters overdue and due-soon sets, sorts and pages', async () => {
    const team = await makeTeam();
    const own = await signedIn(team.admin.email, PASSWORD);
    const make = (tag: string, lastTestedOn: string, extra = {}) => own.post('/api/equipment', setBody({ tag, lastTestedOn, ...extra }));
    await make('A-OVER', monthsAgo(13));
    await make('B-SOON', monthsAgo(12, 10));
    await make('C-FINE', monthsAgo(1));
    await make('D-OUT', monthsAgo(12, 20), { status: 'out-of-service', statusReason: 'Jacket cut' });
    const tags = async (q: string) => (await own.get(`/api/equipment?${q}`)).body.items.map((s: { tag: string }) => s.tag);
    expect(await tags('due=overdue')).toEqual(['A-OVER']);
    expect(await tags('due=soon')).toEqual(['B-SOON', 'D-OUT']);
    expect(await tags('due=soon&status=in-service')).toEqual(['B-SOON']);
    expect(await tags('dueWithinDays=15')).toEqual(['A-OVER', 'B-SOON']);
    expect(await tags('sort=due&dir=desc')).toEqual(['C-FINE', 'D-OUT', 'B-SOON', 'A-OVER']);
    expect(await tags('q=OUT')).toEqual(['D-OUT']);
    const page = await own.get('/api/equipment?pageSize=3&page=2');
    expect(page.body).toMatchObject({ total: 4, page: 2, pageSize: 3 });
    expect(page.body.items.map((s: { tag: string }) => s.tag)).toEqual(['D-OUT']);
    const bad = await own.get('/api/equipment?due=later&pageSize=0');
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual(['due', 'pageSize']);
  });
});

describe('POST /api/equipment/import', () => {
  const good = (tag: string) => `${tag},Invented set,2/0,3,grounding,27,15,ferrule,2024-02-29,in-service,,2026-01-15`;
  const badRows: [string, string][] = [
    [',no tag,2/0,3,grounding,27,15,ferrule,2024-01-01,,,', 'tag'],
    ['BAD TAG!,x,2/0,3,grounding,27,15,ferrule,2024-01-01,,,', 'tag'],
    ['B-03,x,3/8,3,grounding,27,15,ferrule,2024-01-01,,,', 'cable'],
    ['B-04,x,2/0,three,grounding,27,15,ferrule,2024-01-01,,,', 'lengthM'],
    ['B-05,x,2/0,-2,grounding,27,15,ferrule,2024-01-01,,,', 'lengthM'],
    ['B-06,x,2/0,3,hook,27,15,ferrule,2024-01-01,,,', 'clampKind'],
    ['B-07,x,2/0,3,grounding,900,15,ferrule,2024-01-01,,,', 'clampKa'],
    ['B-08,x,2/0,3,grounding,27,,ferrule,2024-01-01,,,', 'clampCycles'],
    ['B-09,x,2/0,3,grounding,27,15,soldered,2024-01-01,,,', 'connection'],
    ['B-10,x,2/0,3,grounding,27,15,ferrule,2025-02-29,,,', 'inServiceOn'],
    ['B-11,x,2/0,3,grounding,27,15,ferrule,2024-01-01,broken,,', 'status'],
    ['B-12,x,2/0,3,grounding,27,15,ferrule,2024-01-01,retired,,', 'statusReason'],
    ['B-13,x,2/0,3,grounding,27,15,ferrule,2024-01-01,,,31/12/2025', 'lastTestedOn'],
    ['OK-1,x,2/0,3,grounding,27,15,ferrule,2024-01-01,,,', 'tag'], // the same tag as line 2
  ];

  it('refuses a file with any bad row, naming every problem as line N.column, and saves nothing', async () => {
    const before = await count();
    const csv = [CSV_HEADER, good('OK-1'), ...badRows.map(([row]) => row), good('OK-2')].join('\n');
    const response = await postCsv(admin, csv);
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('VALIDATION');
    const paths = response.body.error.issues.map((i: { path: string }) => i.path);
    expect(paths).toEqual(badRows.map(([, column], i) => `line ${i + 3}.${column}`));
    expect(await count()).toBe(before);
  });

  it.each([
    ['an unknown column', 'tag,colour\nX,red\n', 'line 1.colour'],
    ['a row with too few cells', `${CSV_HEADER}\n${good('Q-1')}\nQ-2,x,2/0\n`, 'line 3.(row)'],
    ['an unclosed quote', `${CSV_HEADER}\n"Q-3,x,2/0,3,grounding,27,15,ferrule,2024-01-01,,,\n`, 'line 2.(row)'],
    ['an empty file', '', 'line 1.(file)'],
    ['a test date in the future', `${CSV_HEADER}\nQ-4,x,2/0,3,grounding,27,15,ferrule,2024-01-01,,,2999-01-01\n`, 'line 2.lastTestedOn'],
  ])('refuses %s', async (_name, csv, path) => {
    const before = await count();
    const response = await postCsv(admin, csv);
    expect(response.status).toBe(400);
    expect(response.body.error.issues.map((i: { path: string }) => i.path)).toContain(path);
    expect(await count()).toBe(before);
  });

  it('refuses JSON instead of CSV', async () => {
    expect((await admin.post('/api/equipment/import', { tag: 'x' })).status).toBe(415);
  });

  it('imports a good file, and a re-import of its export updates rather than duplicates', async () => {
    const team = await makeTeam();
    const own = await signedIn(team.admin.email, PASSWORD);
    const tags = [uniqueTag('R'), uniqueTag('R')];
    const first = await postCsv(own, [CSV_HEADER, ...tags.map(good)].join('\n'));
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ created: 2, updated: 0 });
    expect(first.body.items[0]).toMatchObject({ inServiceOn: '2024-02-29', lastTestedOn: '2026-01-15', testDueOn: '2027-01-15' });
    const exported = await own.get('/api/equipment/export.csv');
    expect(exported.headers.get('content-type')).toMatch(/text\/csv/);
    expect(exported.text.split('\n')[0]).toBe(`${CSV_HEADER},testDueOn,notes`);
    const again = await postCsv(own, exported.text);
    expect(again.body).toMatchObject({ created: 0, updated: 2 });
    expect((await own.get('/api/equipment')).body.total).toBe(2);
  });
});

describe('checks against the inventory', () => {
  const withSets = (tags: Record<string, string>) => {
    const doc = planDocument();
    return { ...doc, links: doc.links.map((l) => (l.kind === 'jumper' && tags[l.id] ? { ...l, equipmentId: tags[l.id] } : l)) };
  };

  it('warns of an overdue set in a draft and refuses to submit it', async () => {
    const overdue = (await admin.post('/api/equipment', setBody({ cable: '2/0', lengthM: 2, lastTestedOn: monthsAgo(14) }))).body.set;
    const doc = withSets({ jA: overdue.tag });
    const checked = await lead.post('/api/check', doc);
    expect(checked.status).toBe(200);
    expect(checked.body.findings.find((f: { rule: string }) => f.rule === 'set-test-overdue')).toMatchObject({ severity: 'warning', elements: ['jA'] });
    expect(checked.body.sets).toEqual([{ tag: overdue.tag, jumpers: ['jA'], known: true, status: 'in-service', lastTestedOn: overdue.lastTestedOn, testDueOn: overdue.testDueOn, due: 'overdue' }]);
    const plan = await lead.post('/api/plans', { title: 'Pole with an overdue set', document: doc });
    expect(plan.body.plan.warnings).toBeGreaterThan(0);
    const submit = await lead.post(`/api/plans/${plan.body.plan.id}/submit`);
    expect(submit.status).toBe(409);
    expect(submit.body.error.blockers.map((b: { rule: string }) => b.rule)).toContain('set-test-overdue');
    // A passing test today clears it, and the same plan then goes through.
    await lead.post(`/api/equipment/${overdue.id}/tests`, { testedOn: today(), resistanceMilliohms: 0.7, limitMilliohms: 1.5 });
    expect((await lead.post(`/api/plans/${plan.body.plan.id}/submit`)).status).toBe(200);
  });

  it("finds a tag not in the organisation's inventory, including another organisation's set", async () => {
    const team = await makeTeam();
    const theirs = await signedIn(team.admin.email, PASSWORD);
    const tag = (await theirs.post('/api/equipment', setBody())).body.set.tag;
    const checked = await lead.post('/api/check', withSets({ jA: tag }));
    expect(checked.body.findings.find((f: { rule: string }) => f.rule === 'set-unknown')).toMatchObject({ severity: 'blocker', elements: ['jA'] });
    const stored = await lead.post('/api/plans', { title: 'Pole with a stranger set', document: withSets({ jA: tag }) });
    const again = await lead.post(`/api/plans/${stored.body.plan.id}/check`);
    expect(again.body.report.findings.map((f: { rule: string }) => f.rule)).toContain('set-unknown');
  });
});

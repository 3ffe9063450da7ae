/**
 * One operation, two doors: the JSON endpoint and the form page call the same service, so they
 * refuse the same input for the same field and store the same thing. Each case here was tested
 * through one door only before the form pages and endpoints shared their services.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedIn, type Client } from '../helpers/api';
import { CSV_HEADER, postCsv, setBody, today, uniqueTag } from '../helpers/equipment';
import { closeTestDb, makeTeam, PASSWORD, planDocument, testDb } from '../helpers/factories';
import { approvedPlan } from '../helpers/practice';

let admin: Client;
let lead: Client;
let reviewer: Client;

beforeAll(async () => {
  const team = await makeTeam();
  admin = await signedIn(team.admin.email, PASSWORD);
  lead = await signedIn(team.lead.email, PASSWORD);
  reviewer = await signedIn(team.reviewer.email, PASSWORD);
});
afterAll(closeTestDb);

async function newSet(): Promise<number> {
  const created = await admin.post('/api/equipment', setBody());
  expect(created.status).toBe(201);
  return created.body.set.id;
}
const testsOf = async (setId: number) => testDb().models.SetTest.count({ where: { setId } });

describe('grounding sets', () => {
  it('refuse a test dated in the future through the page and the API alike, naming testedOn and storing nothing', async () => {
    const id = await newSet();
    const page = await lead.form(`/equipment/${id}`, { action: 'test', testedOn: '2999-01-01', resistanceMilliohms: '0.5', passed: 'yes' });
    expect(page.status).toBe(200);
    expect(page.text).toContain('testedOn must not be in the future');
    const api = await lead.post(`/api/equipment/${id}/tests`, { testedOn: '2999-01-01', resistanceMilliohms: 0.5, passed: true });
    expect(api.status).toBe(400);
    expect(api.body.error.issues).toEqual([{ path: 'testedOn', message: 'must not be in the future' }]);
    expect(await testsOf(id)).toBe(0);
    const recorded = await lead.form(`/equipment/${id}`, { action: 'test', testedOn: today(), resistanceMilliohms: '0.5', passed: 'yes' });
    expect(recorded.text).toContain('Test recorded: passed.');
    expect(await testsOf(id)).toBe(1);
  });

  it('keep a set with a fault out of service until it passes a test, through the page and the API alike', async () => {
    const id = await newSet();
    expect((await admin.form(`/equipment/${id}`, { action: 'fault', faultOn: today() })).text).toContain('Fault recorded');
    const page = await admin.form(`/equipment/${id}`, { action: 'status', status: 'in-service' });
    expect(page.text).toContain('The set goes back in service only by passing a test.');
    const api = await admin.patch(`/api/equipment/${id}`, { status: 'in-service' });
    expect(api.status).toBe(409);
    expect(api.body.error.code).toBe('SET_NEEDS_TEST');
    expect((await admin.get(`/api/equipment/${id}`)).body.set.status).toBe('out-of-service');
  });

  it('refuse an import row tested in the future by the same line and column through the page and the API', async () => {
    const tag = uniqueTag('DOOR');
    const csv = `${CSV_HEADER}\n${tag},Invented,2/0,3,grounding,27,15,ferrule,2024-01-01,in-service,,2999-01-01\n`;
    const page = await admin.form('/equipment', { action: 'import', file: csv });
    expect(page.status).toBe(200);
    expect(page.text).toMatch(/data-testid="import-problems"[\s\S]*line 2\.lastTestedOn[\s\S]*must not be in the future/);
    const api = await postCsv(admin, csv);
    expect(api.status).toBe(400);
    expect(api.body.error.issues).toEqual([{ path: 'line 2.lastTestedOn', message: 'must not be in the future' }]);
    expect((await admin.get(`/api/equipment?q=${tag}`)).body.total).toBe(0);
  });

  it('refuse a crew lead on the admin-only add form with the role named, where the page used to skip the post', async () => {
    const tag = uniqueTag('LEAD');
    const page = await lead.form('/equipment', { action: 'add', ...Object.fromEntries(Object.entries(setBody({ tag })).map(([k, v]) => [k, String(v)])) });
    expect(page.status).toBe(403);
    expect(page.text).toMatch(/needs the Admin role/);
    expect((await admin.get(`/api/equipment?q=${tag}`)).body.total).toBe(0);
  });

  it('store the test interval saved on the page as the API reads it', async () => {
    const page = await admin.form('/equipment/settings', { testIntervalMonths: '9', limits: '2/0, 4 m, 1.2' });
    expect(page.status).toBe(200);
    const api = await admin.get('/api/equipment/settings');
    expect(api.body.settings).toMatchObject({ testIntervalMonths: 9, resistanceLimits: [{ cable: '2/0', maxLengthM: 4, limitMilliohms: 1.2 }] });
  });
});

describe('organisation settings', () => {
  it('store what the page saves as the API reads it, and refuse a bad zone by name through both', async () => {
    expect((await admin.form('/settings', { timeZone: 'America/Chicago', paperSize: 'a4', units: 'metric' })).status).toBe(200);
    expect((await admin.get('/api/organisation/settings')).body.settings).toMatchObject({ timeZone: 'America/Chicago', paperSize: 'a4', units: 'metric' });
    const page = await admin.form('/settings', { timeZone: 'Nowhere/Invented', paperSize: 'a4', units: 'metric' });
    expect(page.text).toContain('must be a time zone name such as America/Chicago');
    const api = await admin.put('/api/organisation/settings', { timeZone: 'Nowhere/Invented', paperSize: 'a4', units: 'metric' });
    expect(api.status).toBe(400);
    expect(api.body.error.issues[0].path).toBe('timeZone');
    expect((await admin.get('/api/organisation/settings')).body.settings.timeZone).toBe('America/Chicago');
  });
});

describe('plans', () => {
  it('refuse a comment pinned to an element the revision lacks, through the review page and the API', async () => {
    const id = (await lead.post('/api/plans', { title: 'Invented two-door pole', document: planDocument() })).body.plan.id;
    expect((await lead.post(`/api/plans/${id}/submit`)).status).toBe(200);
    const page = await reviewer.form(`/plans/${id}/review`, { action: 'comment', body: 'Pinned nowhere.', elementId: 'NOPE' });
    expect(page.status).toBe(200);
    expect(page.text).toContain('Pick an element of this revision.');
    const api = await reviewer.post(`/api/plans/${id}/comments`, { body: 'Pinned nowhere.', elementId: 'NOPE' });
    expect(api.status).toBe(400);
    expect(api.body.error.issues[0].path).toBe('elementId');
    expect((await reviewer.get(`/api/plans/${id}/comments`)).body.comments).toEqual([]);
  });

  it('start a plan from the page as the API does: the first revision carries its check', async () => {
    const page = await lead.form('/plans/new', { starter: 'empty', title: 'Invented page pole', structure: '', nominalKv: '12.47', frequencyHz: '60', faultKa: '', clearingCycles: '', xOverR: '', phaseSpacingM: '0.9' });
    expect(page.status).toBe(303);
    const id = Number(page.headers.get('location')?.match(/^\/plans\/(\d+)$/)?.[1]);
    const plan = (await lead.get(`/api/plans/${id}`)).body.plan;
    expect(plan).toMatchObject({ title: 'Invented page pole', status: 'draft', currentRevision: 1 });
    expect(plan.report.summary.blockers).toBeGreaterThan(0); // no fault current given yet
    expect(plan.blockers).toBe(plan.report.summary.blockers);
  });

  it('open a field record from the plan page on today, as the API does', async () => {
    const approved = await approvedPlan(lead, reviewer);
    const page = await lead.form('/records/start', { planId: String(approved.id) });
    expect(page.status).toBe(303);
    const recordId = Number(page.headers.get('location')?.match(/^\/records\/(\d+)$/)?.[1]);
    const record = (await lead.get(`/api/records/${recordId}`)).body.record;
    expect(record).toMatchObject({ planId: approved.id, revision: approved.revision, workDate: today(), status: 'open' });
    const refused = await reviewer.form('/records/start', { planId: String(approved.id) });
    expect(refused.headers.get('location')).toBe(`/plans/${approved.id}?problem=ROLE_REQUIRED`);
  });
});

/**
 * The field record over HTTP: the whole sequence, every refusal with its code, clientId
 * idempotency under parallel repeats, the close-out and its mail, and isolation.
 */
import { extractText, getDocumentProxy } from 'unpdf';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeOrganization, makePerson, makeTeam, planDocument, PASSWORD } from '../helpers/factories';
import { monthsAgo, setBody } from '../helpers/equipment';
import { approvedPlan, entry, JUMPERS, mailTo, passingTest, readyToInstall } from '../helpers/records';

let team: Awaited<ReturnType<typeof makeTeam>>;
let lead: Client;
let reviewer: Client;
let admin: Client;
let other: Client;
let planId: number;

beforeAll(async () => {
  team = await makeTeam();
  lead = await signedIn(team.lead.email, PASSWORD);
  reviewer = await signedIn(team.reviewer.email, PASSWORD);
  admin = await signedIn(team.admin.email, PASSWORD);
  const elsewhere = await makeOrganization('Elsewhere Invented Co-operative');
  other = await signedIn((await makePerson(elsewhere, 'crew_lead')).email, PASSWORD);
  const otherAdmin = await signedIn((await makePerson(elsewhere, 'admin')).email, PASSWORD);
  expect((await otherAdmin.post('/api/equipment', setBody({ tag: 'ELSEWHERE-1' }))).status).toBe(201);
  planId = await approvedPlan(lead, reviewer);
  // The record takes only sets of the organisation's inventory that are in service and in date.
  for (const tag of ['S1', 'S2', 'S5', ...JUMPERS.map((link) => `SET-${link}`)]) expect((await admin.post('/api/equipment', setBody({ tag }))).status).toBe(201);
  expect((await admin.post('/api/equipment', setBody({ tag: 'OLD-1', lastTestedOn: monthsAgo(13) }))).status).toBe(201);
  expect((await admin.post('/api/equipment', setBody({ tag: 'OUT-1', status: 'out-of-service', statusReason: 'Jacket cut' }))).status).toBe(201);
  expect((await admin.post('/api/equipment', setBody({ tag: 'GONE-1', status: 'retired', statusReason: 'Scrapped' }))).status).toBe(201);
});
afterAll(closeTestDb);

async function openRecord(): Promise<number> {
  const response = await lead.post(`/api/plans/${planId}/records`, { clearanceRef: 'HOLD-0042', location: 'Invented Lane' });
  expect(response.status).toBe(201);
  return response.body.id;
}
const post = (id: number, body: unknown, client = lead) => client.post(`/api/records/${id}/entries`, body);

describe('opening a record', () => {
  it('on an approved plan: 201 fixed to the approved revision', async () => {
    const response = await lead.post(`/api/plans/${planId}/records`, { clearanceRef: 'HOLD-1' });
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({ planId, revision: 1, status: 'open' });
    expect(response.headers.get('location')).toBe(`/api/records/${response.body.id}`);
  });

  it('on a draft or submitted plan: 409 RECORD_PLAN_NOT_APPROVED', async () => {
    const draft = (await lead.post('/api/plans', { title: 'Draft pole', document: planDocument() })).body.plan.id;
    const response = await lead.post(`/api/plans/${draft}/records`);
    expect(response.status).toBe(409);
    expect(response.body.error).toMatchObject({ code: 'RECORD_PLAN_NOT_APPROVED', status: 'draft' });
  });

  it('refuses bad fields by path', async () => {
    const response = await lead.post(`/api/plans/${planId}/records`, { workDate: 'tomorrow' });
    expect(response.status).toBe(400);
    expect(response.body.error.issues).toEqual([expect.objectContaining({ path: 'workDate' })]);
  });
});

describe('the whole sequence', () => {
  it('signs on, briefs, tests, puts every set on and off, closes, and mails the summary', async () => {
    const id = await openRecord();
    await readyToInstall(lead, id, team.lead.id);
    const installed: { flags: { code: string }[] }[] = [];
    for (const link of JUMPERS) {
      const response = await post(id, entry('install', { link, setTag: `SET-${link}`, groundEndFirst: true }));
      expect(response.status).toBe(201);
      installed.push(response.body.entry);
    }
    // Phase sets put on before the set from the cluster bar to the neutral: recorded, flagged.
    expect(installed.map((e) => e.flags.map((f) => f.code))).toEqual([['installed-before-ground'], ['installed-before-ground'], ['installed-before-ground'], []]);
    let record = (await lead.get(`/api/records/${id}`)).body.record;
    expect(record.counts).toEqual({ on: 4, installed: 4, removed: 0 });
    expect(record.next).toEqual({ kind: 'remove', link: 'jN' });
    // Out of order: recorded, flagged, never refused.
    const outOfOrder = await post(id, entry('remove', { link: 'jA' }));
    expect(outOfOrder.status).toBe(201);
    expect(outOfOrder.body.entry.flags).toEqual([expect.objectContaining({ code: 'removed-out-of-order' })]);
    for (const link of ['jN', 'jC', 'jB']) expect((await post(id, entry('remove', { link }))).body.entry.flags).toEqual([]);
    record = (await lead.get(`/api/records/${id}`)).body.record;
    expect(record.counts).toEqual({ on: 0, installed: 4, removed: 4 });
    expect(record.entries.map((e: { type: string }) => e.type)).toEqual(['sign-on', ...Array(5).fill('briefing'), 'voltage-test', ...Array(4).fill('install'), ...Array(4).fill('remove')]);
    const closed = await lead.post(`/api/records/${id}/close`);
    expect(closed.status).toBe(200);
    expect(closed.body.record).toMatchObject({ status: 'closed', closedBy: { id: team.lead.id } });
    const summary = await mailTo(admin, team.reviewer.email, 'Closed out');
    expect(summary.text).toContain('4 on, 4 off');
    expect(summary.text).toContain('HOLD-0042');
    expect(summary.text).toMatch(/Taken off out of order/);
    await mailTo(admin, team.lead.email, 'Closed out');
    // The PDF, Letter by default, read back.
    const pdf = await reviewer.getRaw(`/api/records/${id}/pdf`);
    expect(pdf.headers.get('content-type')).toBe('application/pdf');
    const proxy = await getDocumentProxy(new Uint8Array(await pdf.arrayBuffer()));
    const page = await proxy.getPage(1);
    expect(page.view.slice(2).map(Math.round)).toEqual([612, 792]);
    const { text } = await extractText(proxy, { mergePages: true });
    const flat = text.replace(/\s+/g, ' ');
    for (const part of ['Field record', 'Briefing', 'Invented detector 7', 'ON jA with set SET-jA', 'OFF jB', 'FLAG: Taken off out of order', 'Closed by', 'the clearance can be released', 'approved detector']) expect(flat).toContain(part);
    expect(flat.indexOf('ON jN')).toBeLessThan(flat.indexOf('OFF jA'));
    // The install confirms "ground end first" (the crew ticks it); a removal records no such thing,
    // so the sheet must not say which end came off first.
    expect(flat).toContain('(ground end first)');
    expect(flat).not.toMatch(/line end first/i);
  });
});

describe('refusals', () => {
  it('install before a voltage test, and after a present result', async () => {
    const id = await openRecord();
    const early = await post(id, entry('install', { link: 'jA', setTag: 'S1', groundEndFirst: true }));
    expect(early.status).toBe(409);
    expect(early.body.error.code).toBe('VOLTAGE_TEST_REQUIRED');
    await post(id, entry('sign-on', { people: [team.lead.id] }));
    expect((await post(id, { ...passingTest(), phases: { A: 'absent', B: 'present', C: 'absent' } })).status).toBe(201);
    expect((await post(id, passingTest())).status).toBe(201);
    const after = await post(id, entry('install', { link: 'jA', setTag: 'S1', groundEndFirst: true }));
    expect(after.body.error).toMatchObject({ code: 'VOLTAGE_PRESENT' });
    expect(after.body.error.message).toMatch(/call the system operator/i);
    expect((await lead.get(`/api/records/${id}`)).body.record.next).toEqual({ kind: 'stop' });
  });

  it('a jumper not in the plan, a double install, a set tag already on, a removal of nothing', async () => {
    const id = await openRecord();
    await readyToInstall(lead, id, team.lead.id);
    expect((await post(id, entry('install', { link: 'rA', setTag: 'S9', groundEndFirst: true }))).body.error.code).toBe('LINK_NOT_IN_PLAN');
    expect((await post(id, entry('install', { link: 'jA', setTag: 'S1', groundEndFirst: true }))).status).toBe(201);
    const twice = await post(id, entry('install', { link: 'jA', setTag: 'S2', groundEndFirst: true }));
    expect([twice.status, twice.body.error.code]).toEqual([409, 'SET_ALREADY_ON']);
    expect((await post(id, entry('install', { link: 'jB', setTag: 's1', groundEndFirst: true }))).body.error).toMatchObject({ code: 'SET_TAG_IN_USE', items: ['jA'] });
    expect((await post(id, entry('remove', { link: 'jC' }))).body.error.code).toBe('SET_NOT_ON');
  });

  it('a set the inventory does not know, one out of service or retired, one past its test date', async () => {
    const id = await openRecord();
    await readyToInstall(lead, id, team.lead.id);
    for (const [tag, detail] of [['ELSEWHERE-1', 'ELSEWHERE-1 is not in your organisation'], ['VISITOR-7', 'VISITOR-7 is not in your organisation'], ['OUT-1', 'OUT-1 is out of service: Jacket cut'], ['GONE-1', 'GONE-1 is retired: Scrapped'], ['OLD-1', 'OLD-1 was due for its test on']]) {
      const refused = await post(id, entry('install', { link: 'jA', setTag: tag, groundEndFirst: true }));
      expect([refused.status, refused.body.error.code, tag]).toEqual([409, 'SET_NOT_USABLE', tag]);
      expect(refused.body.error.message).toContain(detail);
    }
    expect((await post(id, entry('install', { link: 'jA', setTag: 's2', groundEndFirst: true }))).status).toBe(201);
  });

  it("the open record carries the organisation's sets for the device, and another organisation's are not among them", async () => {
    const id = await openRecord();
    const { inventory } = (await lead.get(`/api/records/${id}`)).body.record;
    expect(inventory.today).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    expect(inventory.sets.map((s: { tag: string }) => s.tag)).toEqual(expect.arrayContaining(['S1', 'OLD-1', 'OUT-1', 'GONE-1']));
    expect(inventory.sets.find((s: { tag: string }) => s.tag === 'OUT-1')).toMatchObject({ status: 'out-of-service', statusReason: 'Jacket cut' });
    expect(inventory.sets.every((s: { tag: string }) => !s.tag.startsWith('ELSEWHERE'))).toBe(true);
  });

  it('close with a set on lists it; a closed record refuses every write', async () => {
    const id = await openRecord();
    await readyToInstall(lead, id, team.lead.id);
    await post(id, entry('install', { link: 'jB', setTag: 'S1', groundEndFirst: true }));
    const refused = await lead.post(`/api/records/${id}/close`);
    expect(refused.status).toBe(409);
    expect(refused.body.error).toMatchObject({ code: 'SETS_STILL_ON', items: ['jB'] });
    await post(id, entry('remove', { link: 'jB' }));
    expect((await lead.post(`/api/records/${id}/close`)).status).toBe(200);
    for (const body of [entry('note', { text: 'late note' }), entry('install', { link: 'jA', setTag: 'S5', groundEndFirst: true })]) {
      const response = await post(id, body);
      expect([response.status, response.body.error.code]).toEqual([409, 'RECORD_CLOSED']);
    }
    expect((await lead.post(`/api/records/${id}/close`)).body.error.code).toBe('RECORD_CLOSED');
  });

  it('bad entries are 400 by path and record nothing', async () => {
    const id = await openRecord();
    const cases: [unknown, string][] = [
      [{ ...entry('install', { link: 'jA', setTag: 'S1', groundEndFirst: false }) }, 'groundEndFirst'],
      [{ ...entry('note', { text: 'x' }), clientId: 'not-a-uuid' }, 'clientId'],
      [{ ...entry('note', { text: 'x' }), at: 'yesterday' }, 'at'],
      [entry('sideways', {}), 'type'],
      [entry('sign-on', { people: ['nobody-here'] }), 'people[0]'],
    ];
    for (const [body, path] of cases) {
      const response = await post(id, body);
      expect(response.status, path).toBe(400);
      expect(response.body.error.issues.map((i: { path: string }) => i.path)).toContain(path);
    }
    expect((await lead.get(`/api/records/${id}`)).body.record.entries).toEqual([]);
  });
});

describe('idempotency by clientId', () => {
  it('ten parallel repeats of one entry record it once: one 201, the rest 200 with the same entry', async () => {
    const id = await openRecord();
    const body = entry('note', { text: 'Crossing circuit on the far side; extra care.' });
    const responses = await Promise.all(Array.from({ length: 10 }, () => post(id, body)));
    expect(responses.map((r) => r.status).sort()).toEqual([200, 200, 200, 200, 200, 200, 200, 200, 200, 201]);
    expect(new Set(responses.map((r) => r.body.entry.id)).size).toBe(1);
    expect((await lead.get(`/api/records/${id}`)).body.record.entries).toHaveLength(1);
  });

  it('a clientId reused for a different entry is 409 CLIENT_ID_REUSED', async () => {
    const id = await openRecord();
    const body = entry('note', { text: 'first' });
    expect((await post(id, body)).status).toBe(201);
    expect((await post(id, { ...body, text: 'second' })).body.error.code).toBe('CLIENT_ID_REUSED');
  });
});

describe('deviation mail and isolation', () => {
  it('a deviation mails the reviewer who approved the plan', async () => {
    const id = await openRecord();
    expect((await post(id, entry('deviation', { text: 'Pole is a different structure from the plan' }))).status).toBe(201);
    const mail = await mailTo(admin, team.reviewer.email, 'Field deviation');
    expect(mail.text).toContain('Pole is a different structure from the plan');
  });

  it('another organisation gets 404 for every record route', async () => {
    const id = await openRecord();
    for (const response of [
      await other.get(`/api/records/${id}`),
      await post(id, entry('note', { text: 'x' }), other),
      await other.post(`/api/records/${id}/close`),
      await other.post(`/api/plans/${planId}/records`),
    ]) expect(response.status).toBe(404);
    expect((await other.get('/api/records')).body.items.some((r: { id: number }) => r.id === id)).toBe(false);
  });

  it('lists open records with sets on first', async () => {
    const withSets = await openRecord();
    await readyToInstall(lead, withSets, team.lead.id);
    await post(withSets, entry('install', { link: 'jA', setTag: 'S1', groundEndFirst: true }));
    await openRecord();
    const items = (await lead.get('/api/records?pageSize=100')).body.items;
    expect(items[0]).toMatchObject({ id: withSets, setsOn: 1, status: 'open' });
    const firstClosed = items.findIndex((r: { status: string }) => r.status === 'closed');
    const lastOpen = items.map((r: { status: string }) => r.status).lastIndexOf('open');
    expect(firstClosed === -1 || firstClosed > lastOpen).toBe(true);
  });
});

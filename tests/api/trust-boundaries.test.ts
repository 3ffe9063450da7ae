/**
 * Attacks on the newest surfaces, each kept as a test: a way around "only a passing test puts a
 * set back in service", a looser limit than the organisation's, and dates the database would refuse.
 */
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Client } from '../helpers/api';
import { signedIn } from '../helpers/api';
import { addDays } from '@/lib/domain/equipment';
import { CSV_HEADER, monthsAgo, postCsv, setBody, today } from '../helpers/equipment';
import { saveSettings } from '@db/repositories/equipment-settings';
import { closeTestDb, makeOrganization, makePerson, makeTeam, PASSWORD, planDocument, testDb } from '../helpers/factories';
import { approvedPlan, entry, readyToInstall } from '../helpers/records';
import { uniqueTag } from '../helpers/equipment';
import { upload } from '../helpers/photos';
import { healthWhile } from '../helpers/wait';
import { generatePlan } from '../../bench/generate-plan';
import { Client as AnonymousClient } from '../helpers/api';
import { approvedPlan as approvedPracticePlan } from '../helpers/practice';

let team: Awaited<ReturnType<typeof makeTeam>>;
let admin: Client;
let lead: Client;
let reviewer: Client;
beforeAll(async () => {
  team = await makeTeam();
  admin = await signedIn(team.admin.email, PASSWORD);
  lead = await signedIn(team.lead.email, PASSWORD);
  reviewer = await signedIn(team.reviewer.email, PASSWORD);
});
afterAll(closeTestDb);

/** A set that carried fault current: out of service until it passes a test. */
async function faultedSet(overrides: Record<string, unknown> = {}) {
  const body = setBody(overrides);
  const created = await admin.post('/api/equipment', body);
  expect(created.status).toBe(201);
  const id = created.body.set.id as number;
  expect((await admin.patch(`/api/equipment/${id}`, { faultOn: today() })).body.set.status).toBe('out-of-service');
  return { id, body };
}

const csvRow = (b: Record<string, unknown>, status: string) =>
  [b.tag, b.description, b.cable, b.lengthM, b.clampKind, b.clampKa, b.clampCycles, b.connection, b.inServiceOn, status, '', b.lastTestedOn].join(',');

describe('the CSV import and a set that must pass a test', () => {
  it('refuses to put a faulted set back in service by naming it in-service, and changes nothing', async () => {
    const { id, body } = await faultedSet();
    const response = await postCsv(admin, `${CSV_HEADER}\n${csvRow(body, 'in-service')}\n`);
    expect(response.status, response.text).toBe(400);
    expect(response.body.error.issues).toEqual([{ path: 'line 2.status', message: expect.stringMatching(/passes a test/) }]);
    const after = await admin.get(`/api/equipment/${id}`);
    expect(after.body.set.status).toBe('out-of-service');
    expect(after.body.events.filter((e: { kind: string }) => e.kind === 'imported')).toEqual([]);
  });

  it('refuses it too when the file has no status column (which reads as in service)', async () => {
    const { id, body } = await faultedSet();
    const header = 'tag,cable,lengthM,clampKind,clampKa,clampCycles,connection,inServiceOn';
    const row = [body.tag, body.cable, body.lengthM, body.clampKind, body.clampKa, body.clampCycles, body.connection, body.inServiceOn].join(',');
    const response = await postCsv(admin, `${header}\n${row}\n`);
    expect(response.status, response.text).toBe(400);
    expect(response.body.error.issues[0].path).toBe('line 2.status');
    expect((await admin.get(`/api/equipment/${id}`)).body.set.status).toBe('out-of-service');
  });

  it('still lets the import keep it out of service, or retire it', async () => {
    const { id, body } = await faultedSet();
    const out = await postCsv(admin, `${CSV_HEADER}\n${csvRow({ ...body, description: 'Re-labelled' }, 'out-of-service').replace(',out-of-service,,', ',out-of-service,Carried fault current,')}\n`);
    expect(out.status, out.text).toBe(200);
    expect((await admin.get(`/api/equipment/${id}`)).body.set).toMatchObject({ status: 'out-of-service', description: 'Re-labelled' });
  });

  it('so a faulted set cannot go on a jumper after a round trip through the import', async () => {
    const { body } = await faultedSet();
    await postCsv(admin, `${CSV_HEADER}\n${csvRow(body, 'in-service')}\n`);
    const planId = await approvedPlan(lead, reviewer);
    const record = (await lead.post(`/api/plans/${planId}/records`, {})).body.id as number;
    await readyToInstall(lead, record, team.lead.id);
    const install = await lead.post(`/api/records/${record}/entries`, entry('install', { link: 'jA', setTag: body.tag, groundEndFirst: true }));
    expect(install.status, install.text).toBe(409);
    expect(install.body.error.code).toBe('SET_NOT_USABLE');
  });
});

describe("a tester's limit against the organisation's", () => {
  it("refuses a limit looser than the organisation's for the set, and stores no test", async () => {
    const own = await makeTeam();
    const ownAdmin = await signedIn(own.admin.email, PASSWORD);
    const ownLead = await signedIn(own.lead.email, PASSWORD);
    expect((await ownAdmin.put('/api/equipment/settings', { resistanceLimits: [{ cable: '2/0', maxLengthM: 10, limitMilliohms: 1.5 }] })).status).toBe(200);
    const id = (await ownAdmin.post('/api/equipment', setBody({ cable: '2/0', lengthM: 3 }))).body.set.id as number;
    expect((await ownAdmin.patch(`/api/equipment/${id}`, { faultOn: today() })).status).toBe(200);
    const loose = await ownLead.post(`/api/equipment/${id}/tests`, { testedOn: today(), resistanceMilliohms: 5, limitMilliohms: 10 });
    expect(loose.status, loose.text).toBe(400);
    expect(loose.body.error.issues).toEqual([{ path: 'limitMilliohms', message: expect.stringMatching(/1\.5/) }]);
    const detail = await ownAdmin.get(`/api/equipment/${id}`);
    expect(detail.body.set.status).toBe('out-of-service');
    expect(detail.body.tests).toEqual([]);
    // A stricter limit is the tester's to choose; so is any limit where the organisation set none.
    const strict = await ownLead.post(`/api/equipment/${id}/tests`, { testedOn: today(), resistanceMilliohms: 0.9, limitMilliohms: 1 });
    expect(strict.status, strict.text).toBe(201);
    expect(strict.body.test).toMatchObject({ passed: true, limitMilliohms: 1 });
    const other = (await ownAdmin.post('/api/equipment', setBody({ cable: '4/0', lengthM: 3 }))).body.set.id as number;
    expect((await ownLead.post(`/api/equipment/${other}/tests`, { testedOn: today(), resistanceMilliohms: 5, limitMilliohms: 10 })).status).toBe(201);
  });
});

describe('a passing test dated before what took the set out', () => {
  it('is kept in the history but does not put a faulted set back in service', async () => {
    const { id } = await faultedSet();
    const old = await lead.post(`/api/equipment/${id}/tests`, { testedOn: monthsAgo(1), resistanceMilliohms: 0.5, limitMilliohms: 1.5 });
    expect(old.status, old.text).toBe(201);
    expect(old.body.test.passed).toBe(true);
    expect(old.body.set.status).toBe('out-of-service');
    expect((await admin.patch(`/api/equipment/${id}`, { status: 'in-service' })).body.error?.code).toBe('SET_NEEDS_TEST');
    // A test on the day of the fault or after it does.
    const fresh = await lead.post(`/api/equipment/${id}/tests`, { testedOn: today(), resistanceMilliohms: 0.5, limitMilliohms: 1.5 });
    expect(fresh.body.set).toMatchObject({ status: 'in-service', statusReason: null });
  });

  it('nor a set that failed a later test', async () => {
    const created = await admin.post('/api/equipment', setBody());
    const id = created.body.set.id as number;
    const failed = await lead.post(`/api/equipment/${id}/tests`, { testedOn: today(), resistanceMilliohms: 9, limitMilliohms: 1.5 });
    expect(failed.body.set.status).toBe('out-of-service');
    const earlier = await lead.post(`/api/equipment/${id}/tests`, { testedOn: addDays(today(), -1), resistanceMilliohms: 0.5, limitMilliohms: 1.5 });
    expect(earlier.status, earlier.text).toBe(201);
    expect(earlier.body.set.status).toBe('out-of-service');
  });
});

describe('dates the schema lets through', () => {
  it.each(['2026-02-30', '2026-13-01', '0000-00-00'])('a record opened for %s is 400 naming workDate, and nothing is stored', async (workDate) => {
    const planId = await approvedPlan(lead, reviewer);
    const response = await lead.post(`/api/plans/${planId}/records`, { workDate });
    expect(response.status, response.text).toBe(400);
    expect(response.body.error.issues[0].path).toBe('workDate');
    expect(await testDb().models.FieldRecord.count({ where: { planId } })).toBe(0);
  });
});

describe('two equipment-settings saves at once', () => {
  it('keep both: an interval saved beside a save of the limits is not put back (repository, over the pool)', async () => {
    const limits = [{ cable: '2/0' as const, maxLengthM: 10, limitMilliohms: 1.5 }];
    for (let round = 0; round < 6; round += 1) {
      const organizationId = await makeOrganization();
      const actor = await makePerson(organizationId, 'admin');
      await saveSettings(testDb(), organizationId, actor.id, { testIntervalMonths: 12 });
      await Promise.all([saveSettings(testDb(), organizationId, actor.id, { testIntervalMonths: 6 }), saveSettings(testDb(), organizationId, actor.id, { resistanceLimits: limits })]);
      const row = await testDb().models.OrganizationSetting.findByPk(organizationId);
      expect({ round, interval: row?.testIntervalMonths, limits: JSON.parse(row?.resistanceLimits ?? '[]') }).toEqual({ round, interval: 6, limits });
    }
  });
});

describe('device times the database cannot hold', () => {
  it.each(['0000-01-01T00:00:00Z', '9999-12-31T23:59:59-14:00', '0999-06-01T00:00:00Z'])('an entry at %s is 400 naming at; the record still reads and closes', async (at) => {
    const planId = await approvedPlan(lead, reviewer);
    const record = (await lead.post(`/api/plans/${planId}/records`, {})).body.id as number;
    const response = await lead.post(`/api/records/${record}/entries`, { ...entry('note', { text: 'Invented note' }), at });
    expect(response.status, response.text).toBe(400);
    expect(response.body.error.issues[0].path).toBe('at');
    expect((await lead.get(`/api/records/${record}`)).status).toBe(200);
    expect((await lead.post(`/api/records/${record}/close`)).status).toBe(200);
  });
});

describe('a set put in service on a day still to come', () => {
  // Never tested, its first test falls one interval after that day: 2062 for a typed 2061 keeps it "in date" for decades.
  const later = () => addDays(today(), 400);

  it('is refused when added, edited or imported, naming inServiceOn, and nothing is saved', async () => {
    const added = await admin.post('/api/equipment', setBody({ inServiceOn: later(), lastTestedOn: null }));
    expect(added.status, added.text).toBe(400);
    expect(added.body.error.issues).toEqual([{ path: 'inServiceOn', message: 'must not be in the future' }]);
    const id = (await admin.post('/api/equipment', setBody())).body.set.id as number;
    const edited = await admin.patch(`/api/equipment/${id}`, { inServiceOn: later() });
    expect(edited.status, edited.text).toBe(400);
    expect(edited.body.error.issues[0].path).toBe('inServiceOn');
    const body = setBody({ inServiceOn: later(), lastTestedOn: '' });
    const imported = await postCsv(admin, `${CSV_HEADER}\n${csvRow(body, 'in-service')}\n`);
    expect(imported.status, imported.text).toBe(400);
    expect(imported.body.error.issues).toEqual([{ path: 'line 2.inServiceOn', message: 'must not be in the future' }]);
    expect(await testDb().models.GroundingSet.count({ where: { tag: body.tag } })).toBe(0);
  });
});

describe("a set other than the plan's own on a jumper", () => {
  it('goes on, flagged for the reviewer, since the plan was approved with the named set', async () => {
    const [planned, other, spare, neutral] = [uniqueTag('PLAN'), uniqueTag('SUB'), uniqueTag('SPARE'), uniqueTag('NEUT')];
    for (const tag of [planned, other, spare, neutral]) expect((await admin.post('/api/equipment', setBody({ tag, lengthM: 2 }))).status).toBe(201);
    const base = planDocument();
    const document = { ...base, links: base.links.map((l) => (l.id === 'jA' ? { ...l, equipmentId: planned } : l)) };
    const created = await lead.post('/api/plans', { title: `Named-set pole ${planned}`, document });
    expect(created.status, created.text).toBe(201);
    const planId = created.body.plan.id as number;
    expect((await lead.post(`/api/plans/${planId}/submit`)).status).toBe(200);
    expect((await reviewer.post(`/api/plans/${planId}/review`, { decision: 'approve' })).status).toBe(200);
    const record = (await lead.post(`/api/plans/${planId}/records`, {})).body.id as number;
    await readyToInstall(lead, record, team.lead.id);
    // The ground-side set first (cluster bar to neutral), so the phase sets are judged on the set they carry alone.
    expect((await lead.post(`/api/records/${record}/entries`, entry('install', { link: 'jN', setTag: neutral, groundEndFirst: true }))).body.entry.flags).toEqual([]);
    const swapped = await lead.post(`/api/records/${record}/entries`, entry('install', { link: 'jA', setTag: other, groundEndFirst: true }));
    expect(swapped.status, swapped.text).toBe(201);
    expect(swapped.body.entry.flags).toEqual([{ code: 'set-not-as-planned', message: expect.stringContaining(planned) }]);
    // A jumper the plan names no set for takes any fit set without a flag.
    const free = await lead.post(`/api/records/${record}/entries`, entry('install', { link: 'jB', setTag: spare, groundEndFirst: true }));
    expect(free.body.entry.flags).toEqual([]);
    // The plan's own set, in any case, raises none (the neutral set keeps the zone grounded, so no new test is due).
    expect((await lead.post(`/api/records/${record}/entries`, entry('remove', { link: 'jB' }))).status).toBe(201);
    expect((await lead.post(`/api/records/${record}/entries`, entry('remove', { link: 'jA' }))).status).toBe(201);
    const own = await lead.post(`/api/records/${record}/entries`, entry('install', { link: 'jA', setTag: planned.toLowerCase(), groundEndFirst: true }));
    expect(own.status, own.text).toBe(201);
    expect(own.body.entry.flags).toEqual([]);
  });
});

describe("a PNG photo's original", () => {
  it('keeps every colour: the metadata is dropped without turning it into a 256-colour palette', async () => {
    const width = 96;
    const height = 64;
    const pixels = Buffer.alloc(width * height * 3);
    for (let i = 0; i < pixels.length; i += 1) pixels[i] = (i * 7919 + (i >> 5) * 31) % 256;
    const png = await sharp(pixels, { raw: { width, height, channels: 3 } }).png().toBuffer();
    const planId = await approvedPlan(lead, reviewer);
    const record = (await lead.post(`/api/plans/${planId}/records`, {})).body.id as number;
    const stored = await upload(lead, record, png, 'switch.png', 'image/png', 'Invented switch');
    expect(stored.status, stored.text).toBe(201);
    const original = await lead.getRaw(`${stored.body.url}?size=original`);
    expect(original.headers.get('content-type')).toBe('image/png');
    const back = Buffer.from(await original.arrayBuffer());
    const raw = await sharp(back).removeAlpha().raw().toBuffer({ resolveWithObject: true });
    expect(raw.info).toMatchObject({ width, height, channels: 3 });
    expect(Buffer.compare(raw.data, pixels)).toBe(0);
  });
});

describe('a practice attempt', () => {
  it('keeps the answer as graded, not whatever else the body carried beside it', async () => {
    const apprentice = await signedIn(team.apprentice.email, PASSWORD);
    const plan = await approvedPracticePlan(lead, reviewer);
    const made = await reviewer.post('/api/exercises', { planId: plan.id, revision: plan.revision, kind: 'find', removeLinks: ['jB'], prompt: 'Mark what is outside the zone.' });
    expect(made.status, made.text).toBe(201);
    const elements: string[] = made.body.exercise.answerElements;
    const padding = 'x'.repeat(1_500_000);
    const answered = await apprentice.post(`/api/exercises/${made.body.exercise.id}/attempts`, { answer: { elements, padding, more: Array.from({ length: 20_000 }, (_, i) => i) } });
    expect(answered.status, answered.text.slice(0, 300)).toBe(201);
    expect(answered.body.score).toBe(100);
    const row = await testDb().models.PracticeAttempt.findByPk(answered.body.attempt.id);
    expect(JSON.parse(row!.answer)).toEqual({ elements });
  });
});

describe('two imports at once', () => {
  it('never answer 5xx: each lands, or is told to import again, and the tags end up stored once', async () => {
    const own = await makeTeam();
    const first = await signedIn(own.admin.email, PASSWORD);
    const second = await signedIn((await makePerson(own.organizationId, 'admin')).email, PASSWORD);
    for (let round = 0; round < 4; round += 1) {
      const tags = Array.from({ length: 12 }, () => uniqueTag(`R${round}`));
      const file = (list: string[]) => `${CSV_HEADER}\n${list.map((tag) => csvRow(setBody({ tag }), 'in-service')).join('\n')}\n`;
      const answers = await Promise.all([postCsv(first, file(tags)), postCsv(second, file([...tags].reverse()))]);
      for (const a of answers) {
        expect(a.status, a.text.slice(0, 300)).toBeLessThan(500);
        if (a.status !== 200) expect(a.body.error.issues[0].message).toMatch(/import again/);
      }
      expect(answers.some((a) => a.status === 200)).toBe(true);
      expect(await testDb().models.GroundingSet.count({ where: { organizationId: own.organizationId, tag: tags } })).toBe(tags.length);
    }
  });
});

describe('grading a fix attempt', () => {
  it("runs the checker off the main thread: a large handed-in drawing does not stall other requests", async () => {
    const apprentice = await signedIn(team.apprentice.email, PASSWORD);
    const plan = await approvedPracticePlan(lead, reviewer);
    const made = await reviewer.post('/api/exercises', { planId: plan.id, revision: plan.revision, kind: 'fix', removeLinks: ['jB'], prompt: 'Put the zone right.' });
    expect(made.status, made.text).toBe(201);
    // About 12,000 elements: a check of a second or two here, under the 2 MiB body limit.
    const large = generatePlan({ elements: 12_000, seed: 11 });
    const { answer: answered, latencies, tookMs } = await healthWhile(apprentice.post(`/api/exercises/${made.body.exercise.id}/attempts`, { answer: { document: large } }), () => new AnonymousClient().get('/api/health'));
    expect(answered.status, answered.text.slice(0, 300)).toBe(201);
    expect(answered.body.passed).toBe(false);
    expect(latencies.length).toBeGreaterThanOrEqual(3);
    expect(Math.max(...latencies)).toBeLessThan(tookMs / 2);
  });
});

describe('proposing practice gaps for a large approved plan', () => {
  it('runs in the checker pool: other requests are answered while it works', async () => {
    const plan = await approvedPracticePlan(lead, reviewer);
    // An approved revision of ~400 generated elements: the proposals check it once or twice per jumper and bond (seconds).
    await testDb().models.PlanRevision.update({ document: JSON.stringify(generatePlan({ elements: 400, seed: 5 })) }, { where: { planId: plan.id, number: plan.revision } });
    const { answer: answered, latencies, tookMs } = await healthWhile(reviewer.post('/api/exercises/propose', { planId: plan.id }), () => new AnonymousClient().get('/api/health'));
    expect(answered.status, answered.text.slice(0, 300)).toBe(200);
    expect(answered.body.proposals.length).toBeGreaterThan(0);
    expect(latencies.length).toBeGreaterThanOrEqual(3);
    expect(Math.max(...latencies)).toBeLessThan(tookMs / 2);
  });
});

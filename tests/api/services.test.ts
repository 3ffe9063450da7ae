/**
 * The service functions (src/lib/server/services) called in-process, as both doors call them: each
 * decides who may do it itself — the endpoints and form pages no longer check a role before
 * calling — and a refusal writes nothing. The allowed roles are written here from the README's
 * API table, not read from the code.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '@db/connection';
import type { Person } from '@/lib/domain/people';
import type { Role } from '@/lib/domain/roles';
import { createSetBody, patchSetBody, setTestBody } from '@/lib/schemas/equipment';
import { AppError } from '@/lib/server/errors';
import { commentOnPlan, resolveComment } from '@/lib/server/services/comments';
import { addSet, changeSet, importSets, recordSetTest, saveTestSettings } from '@/lib/server/services/equipment';
import { changeOrganisationSettings } from '@/lib/server/services/organisation';
import { changePerson, invitePerson } from '@/lib/server/services/people';
import { recheckPlan, savePlan, startPlan } from '@/lib/server/services/plans';
import { openRecord } from '@/lib/server/services/records';
import { decide, reopen, submitForReview, withdraw } from '@/lib/server/services/review';
import { setBody, today } from '../helpers/equipment';
import { closeTestDb, makePerson, makeTeam, planDocument, testDb } from '../helpers/factories';

const ROLES: Role[] = ['admin', 'reviewer', 'crew_lead', 'apprentice'];
let people: Record<Role, Person>;
let spareId: string;
const ids = { draft: 0, submitted: 0, approved: 0, comment: 0, set: 0 };

beforeAll(async () => {
  const team = await makeTeam();
  people = { admin: team.admin, reviewer: team.reviewer, crew_lead: team.lead, apprentice: team.apprentice };
  spareId = (await makePerson(team.organizationId, 'apprentice')).id;
  const lead = people.crew_lead;
  ids.draft = (await startPlan(lead, { title: 'Invented service draft', document: planDocument() })).id;
  ids.submitted = (await startPlan(lead, { title: 'Invented service submitted', document: planDocument() })).id;
  await submitForReview(lead, ids.submitted);
  ids.approved = (await startPlan(lead, { title: 'Invented service approved', document: planDocument() })).id;
  await submitForReview(lead, ids.approved);
  await decide(people.reviewer, ids.approved, { decision: 'approve' });
  ids.comment = (await commentOnPlan(people.reviewer, ids.submitted, { body: 'Invented service comment.' })).id;
  ids.set = (await addSet(people.admin, createSetBody.parse(setBody()))).id;
});
afterAll(async () => {
  await closeDb();
  await closeTestDb();
});

const TABLES = ['audit_events', 'password_tokens', 'users', 'plans', 'plan_revisions', 'plan_comments', 'plan_decisions', 'grounding_sets', 'set_tests', 'set_events', 'organization_settings', 'field_records', 'mail_outbox'];
async function counts(): Promise<string> {
  const db = testDb().sequelize;
  const rows = await Promise.all(TABLES.map(async (t) => `${t}=${((await db.query(`SELECT COUNT(*) AS n FROM \`${t}\``, { plain: true })) as { n: number }).n}`));
  const plans = (await db.query('CHECKSUM TABLE plans, grounding_sets', { type: 'SELECT' })) as Array<{ Checksum: string }>;
  return [...rows, ...plans.map((p) => p.Checksum)].join(' ');
}

interface Operation {
  name: string;
  allowed: Role[];
  call: (person: Person) => Promise<unknown>;
}

const operations: Operation[] = [
  { name: 'startPlan', allowed: ['crew_lead', 'admin'], call: (p) => startPlan(p, { title: 'Refused pole', document: planDocument() }) },
  { name: 'savePlan', allowed: ['crew_lead', 'admin'], call: (p) => savePlan(p, ids.draft, { expectedRevision: 1, document: planDocument() }) },
  { name: 'submitForReview', allowed: ['crew_lead', 'admin'], call: (p) => submitForReview(p, ids.draft) },
  { name: 'decide', allowed: ['reviewer', 'admin'], call: (p) => decide(p, ids.submitted, { decision: 'return', comment: 'Refused return.' }) },
  { name: 'reopen', allowed: ['crew_lead', 'admin'], call: (p) => reopen(p, ids.approved) },
  { name: 'withdraw', allowed: ['crew_lead', 'admin'], call: (p) => withdraw(p, ids.submitted) },
  { name: 'commentOnPlan', allowed: ['reviewer', 'admin', 'crew_lead'], call: (p) => commentOnPlan(p, ids.submitted, { body: 'Refused comment.' }) },
  { name: 'resolveComment', allowed: ['reviewer', 'admin', 'crew_lead'], call: (p) => resolveComment(p, ids.submitted, ids.comment, true) },
  { name: 'openRecord', allowed: ['crew_lead', 'admin'], call: (p) => openRecord(p, ids.approved, {}) },
  { name: 'addSet', allowed: ['admin'], call: (p) => addSet(p, createSetBody.parse(setBody())) },
  { name: 'importSets', allowed: ['admin'], call: (p) => importSets(p, 'tag,cable\nREFUSED-1,2/0\n') },
  { name: 'recordSetTest', allowed: ['admin', 'crew_lead'], call: (p) => recordSetTest(p, ids.set, setTestBody.parse({ testedOn: today(), resistanceMilliohms: 0.5, passed: true })) },
  { name: 'changeSet', allowed: ['admin'], call: (p) => changeSet(p, ids.set, patchSetBody.parse({ notes: 'Refused note.' })) },
  { name: 'saveTestSettings', allowed: ['admin'], call: (p) => saveTestSettings(p, { testIntervalMonths: 6 }) },
  { name: 'changeOrganisationSettings', allowed: ['admin'], call: (p) => changeOrganisationSettings(p, { timeZone: 'UTC', paperSize: 'a4', units: 'metric' }) },
  { name: 'invitePerson', allowed: ['admin'], call: (p) => invitePerson(p, { email: `refused-${Date.now()}@example.test`, name: 'Refused Person', role: 'apprentice' }) },
  { name: 'changePerson', allowed: ['admin'], call: (p) => changePerson(p, spareId, { role: 'reviewer' }) },
];

describe.each(operations)('$name', (operation) => {
  const refused = ROLES.filter((r) => !operation.allowed.includes(r));
  it.each(refused)('refuses %s with ROLE_REQUIRED naming the roles, and writes nothing', async (role) => {
    const before = await counts();
    const error = await operation.call(people[role]).then(() => null, (e: unknown) => e);
    expect(error).toBeInstanceOf(AppError);
    expect((error as AppError).code).toBe('ROLE_REQUIRED');
    expect((error as AppError).message).toMatch(/needs the .* role/);
    expect(await counts()).toBe(before);
  });
});

describe('services that answer more than a role', () => {
  it('checks a plan again for anyone, storing the report only for those who may edit it', async () => {
    expect((await recheckPlan(people.reviewer, ids.draft)).stored).toBe(false);
    expect((await recheckPlan(people.apprentice, ids.draft)).stored).toBe(false);
    expect((await recheckPlan(people.crew_lead, ids.draft)).stored).toBe(true);
    // A submitted revision is under review: nobody's check replaces its report.
    expect((await recheckPlan(people.admin, ids.submitted)).stored).toBe(false);
  });

  it('refuses a stale save and a save of a plan under review before checking, with the current revision', async () => {
    const stale = await savePlan(people.crew_lead, ids.draft, { expectedRevision: 9, document: planDocument() }).catch((e: AppError) => e);
    expect(stale).toMatchObject({ code: 'STALE_REVISION', extra: { currentRevision: 1, yourRevision: 9 } });
    const locked = await savePlan(people.crew_lead, ids.submitted, { expectedRevision: 1, document: planDocument() }).catch((e: AppError) => e);
    expect(locked).toMatchObject({ code: 'NOT_EDITABLE', extra: { status: 'submitted' } });
  });

  it('names the field of a date in the future, for a new set, a test and a fault alike', async () => {
    const future = '2999-01-01';
    const before = await counts();
    for (const [path, call] of [
      ['lastTestedOn', () => addSet(people.admin, createSetBody.parse(setBody({ lastTestedOn: future })))],
      ['testedOn', () => recordSetTest(people.crew_lead, ids.set, setTestBody.parse({ testedOn: future, resistanceMilliohms: 0.5, passed: true }))],
      ['faultOn', () => changeSet(people.admin, ids.set, patchSetBody.parse({ faultOn: future }))],
    ] as const) {
      const error = await call().catch((e: AppError) => e);
      expect(error, path).toMatchObject({ code: 'VALIDATION', issues: [{ path, message: 'must not be in the future' }] });
    }
    expect(await counts()).toBe(before);
  });

  it('refuses a pin to an element the revision does not have, naming elementId', async () => {
    const error = await commentOnPlan(people.reviewer, ids.submitted, { body: 'Pinned nowhere.', elementId: 'NOPE' }).catch((e: AppError) => e);
    expect(error).toMatchObject({ code: 'VALIDATION', issues: [{ path: 'elementId' }] });
  });

  it('opens a record on today (the organisation zone, UTC here) unless a work date is given, and only on an approved plan', async () => {
    expect((await openRecord(people.crew_lead, ids.approved, {}, new Date('2026-04-30T23:30:00Z'))).workDate).toBe('2026-04-30');
    expect((await openRecord(people.admin, ids.approved, { workDate: '2026-05-04' })).workDate).toBe('2026-05-04');
    expect(await openRecord(people.crew_lead, ids.draft, {}).catch((e: AppError) => e.code)).toBe('RECORD_PLAN_NOT_APPROVED');
  });
});

describe('a record opened without a work date', () => {
  it("takes today in the organisation's time zone, not the server's UTC day", async () => {
    const team = await makeTeam();
    const plan = (await startPlan(team.lead, { title: 'Invented service zone plan', document: planDocument() })).id;
    await submitForReview(team.lead, plan);
    await decide(team.reviewer, plan, { decision: 'approve' });
    // UTC−7 in May (IANA zone rules): 03:00 UTC on 1 May is still the evening of 30 April there.
    await changeOrganisationSettings(team.admin, { timeZone: 'America/Los_Angeles', paperSize: 'letter', units: 'imperial' });
    expect((await openRecord(team.lead, plan, {}, new Date('2026-05-01T03:00:00Z'))).workDate).toBe('2026-04-30');
    // UTC+14: 23:30 UTC on 30 April is already 1 May there.
    await changeOrganisationSettings(team.admin, { timeZone: 'Pacific/Kiritimati', paperSize: 'letter', units: 'imperial' });
    expect((await openRecord(team.lead, plan, {}, new Date('2026-04-30T23:30:00Z'))).workDate).toBe('2026-05-01');
  });
});

/**
 * The daily due-sets message: two app instances (two connection pools) run the job at the same
 * moment, and exactly one message per admin leaves; later days list only what changed.
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { readDbConfig } from '@db/config';
import { createDb, type Db } from '@db/connection';
import { addDays, addMonths } from '@/lib/domain/equipment';
import { DUE_SETS_KIND, runDueSetsMail } from '@/lib/server/due-sets-mail';
import { signedIn } from '../helpers/api';
import { setBody, today } from '../helpers/equipment';
import { closeTestDb, makePerson, makeTeam, testDb, PASSWORD } from '../helpers/factories';

// A day in the future, so the servers' own hourly runs (which claim the real today) never collide.
const DAY = addDays(today(), 200);
const at = (day: string) => new Date(`${day}T06:00:00Z`);
const lastTestFor = (dueOn: string) => addMonths(dueOn, -12);
let organizationId: number;
const instances: Db[] = [];

beforeAll(async () => {
  const team = await makeTeam();
  organizationId = team.organizationId;
  await makePerson(organizationId, 'admin');
  const admin = await signedIn(team.admin.email, PASSWORD);
  const sets = [
    { tag: 'M-OVER', lastTestedOn: lastTestFor(addDays(DAY, -5)) },
    { tag: 'M-SOON', lastTestedOn: lastTestFor(addDays(DAY, 10)) },
    { tag: 'M-LATER', lastTestedOn: lastTestFor(addDays(DAY, 100)) },
    { tag: 'M-RETIRED', lastTestedOn: lastTestFor(addDays(DAY, -1)), status: 'retired', statusReason: 'Worn out' },
  ];
  for (const s of sets) expect((await admin.post('/api/equipment', setBody(s))).status).toBe(201);
  instances.push(createDb({ ...readDbConfig(), poolMax: 3 }), createDb({ ...readDbConfig(), poolMax: 3 }));
});
afterAll(async () => {
  await Promise.all(instances.map((db) => db.sequelize.close()));
  await closeTestDb();
});

const outbox = async () => (await testDb().models.MailOutbox.findAll({ where: { organizationId, kind: DUE_SETS_KIND }, order: [['id', 'ASC']] })).map((m) => ({ to: m.toAddress, subject: m.subject, text: m.textBody }));

it('sends one message per admin when two instances run the job at once', async () => {
  const claimed = await Promise.all(instances.map((db) => runDueSetsMail(db, at(DAY), [organizationId])));
  expect(claimed.sort()).toEqual([0, 1]);
  const mail = await outbox();
  expect(mail).toHaveLength(2);
  expect(new Set(mail.map((m) => m.to)).size).toBe(2);
  expect(mail[0].subject).toBe('Grounding sets: 1 overdue, 1 due within 30 days');
  expect(mail[0].text).toContain('M-OVER');
  expect(mail[0].text).toContain('M-SOON');
  expect(mail[0].text).not.toContain('M-LATER');
  expect(mail[0].text).not.toContain('M-RETIRED');
  // A later run the same day, on either instance, sends nothing more.
  expect(await runDueSetsMail(instances[0], at(DAY), [organizationId])).toBe(0);
  expect(await outbox()).toHaveLength(2);
});

it('lists only what changed since the last run', async () => {
  expect(await runDueSetsMail(instances[1], at(addDays(DAY, 1)), [organizationId])).toBe(1);
  expect(await outbox()).toHaveLength(2); // nothing new on the next day
  await runDueSetsMail(instances[0], at(addDays(DAY, 11)), [organizationId]);
  const mail = await outbox();
  expect(mail).toHaveLength(4);
  expect(mail[3].subject).toBe('Grounding sets: 1 overdue, 0 due within 30 days');
  expect(mail[3].text).toContain('M-SOON');
  expect(mail[3].text).not.toContain('M-OVER');
});

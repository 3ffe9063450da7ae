/**
 * Due dates and "not in the future" are judged on the organisation's own calendar day, not
 * Greenwich's. The test picks a zone whose date differs from UTC's right now (UTC+14 after 11:00
 * UTC, UTC−12 before), so each assertion fails on a server that counts days in UTC.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays } from '@/lib/domain/equipment';
import { formatDate } from '@/lib/time-format';
import { Client, signedIn } from '../helpers/api';
import { setBody } from '../helpers/equipment';
import { closeTestDb, makeTeam, PASSWORD, testDb } from '../helpers/factories';

const now = new Date();
const east = now.getUTCHours() >= 11;
const zone = east ? 'Pacific/Kiritimati' : 'Etc/GMT+12';
const utcDay = now.toISOString().slice(0, 10);
const orgDay = formatDate(now, zone);

let admin: Client;
beforeAll(async () => {
  const team = await makeTeam();
  admin = await signedIn(team.admin.email, PASSWORD);
  expect((await admin.put('/api/organisation/settings', { timeZone: zone, paperSize: 'letter', units: 'metric' })).status).toBe(200);
});
afterAll(closeTestDb);

describe(`the organisation's day (${zone}: ${orgDay}, UTC ${utcDay})`, () => {
  it('differs from the UTC day at this hour (else the test proves nothing)', () => {
    expect(orgDay).toBe(addDays(utcDay, east ? 1 : -1));
  });

  it('counts a set overdue from the day after its due date on the organisation calendar', async () => {
    // Due on the earlier of the two days: overdue where the organisation is only if its day is later.
    const dueOn = east ? utcDay : orgDay;
    const created = await admin.post('/api/equipment', setBody());
    expect(created.status).toBe(201);
    await testDb().models.GroundingSet.update({ testDueOn: dueOn }, { where: { id: created.body.set.id } });
    const overdue = await admin.get('/api/equipment?due=overdue&pageSize=100');
    const tags = overdue.body.items.map((s: { tag: string }) => s.tag);
    if (east) expect(tags).toContain(created.body.set.tag);
    else expect(tags).not.toContain(created.body.set.tag);
  });

  it('takes a test dated today on the organisation calendar and refuses the next day', async () => {
    const created = await admin.post('/api/equipment', setBody());
    const id = created.body.set.id;
    const ok = await admin.post(`/api/equipment/${id}/tests`, { testedOn: orgDay, resistanceMilliohms: 1, limitMilliohms: 2 });
    expect(ok.status, JSON.stringify(ok.body)).toBe(201);
    const ahead = await admin.post(`/api/equipment/${id}/tests`, { testedOn: addDays(orgDay, 1), resistanceMilliohms: 1, limitMilliohms: 2 });
    expect(ahead.status).toBe(400);
    expect(ahead.body.error.issues).toEqual([{ path: 'testedOn', message: 'must not be in the future' }]);
  });
});

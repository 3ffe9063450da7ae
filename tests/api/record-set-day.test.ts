/**
 * The day a set is judged on for the field record is the organisation's calendar day: in a time
 * zone ahead of UTC, a set whose test fell due yesterday (there) is overdue, even while it is still
 * that day in UTC; behind UTC, a set due today (there) is still in date. The copy the record sends
 * to the device carries the same day and the zone, and the equipment pages count the same days.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '@db/connection';
import { saveOrganisationSettings } from '@db/repositories/organisation-settings';
import { createSetBody } from '@/lib/schemas/equipment';
import { inventoryCopy, setStatusLookupFor } from '@/lib/server/field-records';
import { addSet } from '@/lib/server/services/equipment';
import { setBody } from '../helpers/equipment';
import { closeTestDb, makeTeam, testDb } from '../helpers/factories';

let team: Awaited<ReturnType<typeof makeTeam>>;
let tag: string;
// 12:00 UTC on 4 May is 02:00 on 5 May on an island fourteen hours ahead of UTC.
const NOW = new Date('2026-05-04T12:00:00Z');

beforeAll(async () => {
  team = await makeTeam();
  await saveOrganisationSettings(testDb(), team.organizationId, team.admin.id, { timeZone: 'Pacific/Kiritimati', paperSize: 'a4', units: 'metric' });
  // Tested on 4 May 2025 with the 12-month interval used until one is chosen: due on 4 May 2026.
  const set = await addSet(team.admin, createSetBody.parse(setBody({ inServiceOn: '2024-01-10', lastTestedOn: '2025-05-04' })));
  expect(set.testDueOn).toBe('2026-05-04');
  tag = set.tag;
});
afterAll(async () => {
  await closeDb();
  await closeTestDb();
});

describe('the day sets are judged on for a field record', () => {
  it('is the organisation\'s day ahead of UTC, and the copy names the zone', async () => {
    const copy = await inventoryCopy(team.organizationId, NOW);
    expect(copy.today).toBe('2026-05-05');
    expect(copy.timeZone).toBe('Pacific/Kiritimati');
    const status = (await setStatusLookupFor(team.organizationId, NOW)).statusOf(tag);
    expect(status).toMatchObject({ usable: false, reason: 'overdue' });
  });

  it('is the organisation\'s day behind UTC too: a set due today there is still in date', async () => {
    await saveOrganisationSettings(testDb(), team.organizationId, team.admin.id, { timeZone: 'Pacific/Pago_Pago', paperSize: 'a4', units: 'metric' });
    // 05:00 UTC on 5 May is 18:00 on 4 May in Pago Pago (UTC−11): the set is due today there, not overdue.
    const later = new Date('2026-05-05T05:00:00Z');
    expect((await inventoryCopy(team.organizationId, later)).today).toBe('2026-05-04');
    expect((await setStatusLookupFor(team.organizationId, later)).statusOf(tag)).toMatchObject({ usable: true });
    // An hour after midnight there (12:00 UTC on 5 May is 01:00 on 5 May), it is overdue.
    const nextDay = new Date('2026-05-05T12:00:00Z');
    expect((await setStatusLookupFor(team.organizationId, nextDay)).statusOf(tag)).toMatchObject({ usable: false, reason: 'overdue' });
  });
});

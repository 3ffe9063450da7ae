/** The device's view of a record: waiting entries replayed by the shared rules, judged with the server's words. */
import { describe, expect, it } from 'vitest';
import { judgeOnDevice, withPending } from '@/components/records/offline/local-view';
import { judgingDay } from '@/components/records/SetChoice';
import type { Pending } from '@/components/records/offline/outbox';
import type { RecordView } from '@/components/records/types';
import { REFUSALS, recordPlanFrom, type EntryBody } from '@/lib/domain/field-record';
import { planDocument } from '../helpers/factories';

const me = { id: 'u1', name: 'Invented Lead' };
const document = planDocument();
const plan = recordPlanFrom(document);
const base: RecordView = {
  id: 1, planId: 1, planTitle: 'Invented pole', revision: 1, status: 'open', workDate: '2026-05-04', structure: '', location: '', clearanceRef: '', detector: '',
  lead: me, closedAt: null, closedBy: null, counts: { on: 0, installed: 0, removed: 0 }, setsOn: [], voltageFound: false, testPassed: false, briefing: {}, next: { kind: 'sign-on' },
  plan, document, entries: [], photos: [],
  inventory: { today: '2026-05-04', sets: [{ tag: 'INV-1', description: 'x', status: 'in-service', testDueOn: '2999-01-01' }, { tag: 'INV-2', description: 'x', status: 'in-service', testDueOn: '2026-01-01' }] },
};
let seq = 0;
const waiting = (body: EntryBody, refused?: Pending['refused']): Pending => ({ kind: 'entry', key: `k${(seq += 1)}`, personId: 'u1', recordId: 1, seq, entry: { ...body, clientId: `k${seq}`, at: `2026-05-04T07:${String(seq).padStart(2, '0')}:00.000Z` }, ...(refused ? { refused } : {}) });
const test = (): EntryBody => ({ type: 'voltage-test', detector: 'D7', detectorCheckedBefore: true, detectorCheckedAfter: true, phases: Object.fromEntries(plan.phases.map((p) => [p, 'absent'])) });
// The set that grounds the cluster bar, so it is the one that may go on first.
const link = 'jN';
const install = (setTag: string): EntryBody => ({ type: 'install', link, setTag, groundEndFirst: true });
const stamp = (body: EntryBody) => ({ ...body, clientId: 'new', at: '2026-05-04T08:00:00.000Z', actorId: 'u1' }) as Parameters<typeof judgeOnDevice>[1];

describe('the record on the device', () => {
  it('counts waiting entries as the server would, and shows them as waiting', () => {
    const view = withPending(base, [waiting({ type: 'sign-on', people: ['u1'], visitors: [] }), waiting(test()), waiting(install('INV-1'))], me);
    expect(view.counts).toEqual({ on: 1, installed: 1, removed: 0 });
    expect(view.entries.map((e) => e.waiting)).toEqual([true, true, true]);
    expect(view.entries[2].flags.map((f) => f.code)).toEqual(['installed-before-briefing']);
  });

  it('leaves a refused entry out of the counts but keeps it in the log with the refusal', () => {
    const refused = { code: 'SET_ALREADY_ON', message: REFUSALS.SET_ALREADY_ON };
    const view = withPending(base, [waiting({ type: 'sign-on', people: ['u1'], visitors: [] }), waiting(test()), waiting(install('INV-1'), refused)], me);
    expect(view.counts.on).toBe(0);
    expect(view.entries[2].refused).toEqual(refused);
  });

  it('refuses on the device with the server\'s code and words: no test yet, an overdue set, an unknown tag', () => {
    const signedOn = withPending(base, [waiting({ type: 'sign-on', people: ['u1'], visitors: [] })], me);
    expect(judgeOnDevice(signedOn, stamp(install('INV-1')))).toMatchObject({ code: 'VOLTAGE_TEST_REQUIRED', message: REFUSALS.VOLTAGE_TEST_REQUIRED });
    const tested = withPending(base, [waiting({ type: 'sign-on', people: ['u1'], visitors: [] }), waiting(test())], me);
    expect(judgeOnDevice(tested, stamp(install('INV-2')), new Date('2026-05-04T09:00:00Z'))?.message).toContain('INV-2 was due for its test on 2026-01-01');
    expect(judgeOnDevice(tested, stamp(install('VISITING-3')))?.code).toBe('SET_NOT_USABLE');
    expect(judgeOnDevice(tested, stamp(install('INV-1')))).toBeNull();
  });

  it('judges sets on the date of the device\'s own calendar, not the UTC date, and never before the server\'s day', () => {
    const at = new Date('2026-05-04T20:00:00Z'); // 2026-05-05 at 10:00 in UTC+14, 2026-05-04 in UTC
    expect(judgingDay(base, at, 'Pacific/Kiritimati')).toBe('2026-05-05');
    expect(judgingDay(base, at, 'UTC')).toBe('2026-05-04');
    // A device whose calendar is behind the server's day (UTC−12: still 2026-05-04 08:00) takes the server's day.
    expect(judgingDay({ ...base, inventory: { ...base.inventory!, today: '2026-05-05' } }, at, 'Etc/GMT+12')).toBe('2026-05-05');
  });

  it("judges a set on the organisation's day when it is later than UTC's, as the server does", () => {
    // 12:00 UTC on 4 May is 02:00 on 5 May on an island fourteen hours ahead: a set due on 4 May is overdue there.
    const ahead: RecordView = { ...base, inventory: { today: '2026-05-04', timeZone: 'Pacific/Kiritimati', sets: [{ tag: 'DUE-4', description: 'x', status: 'in-service', testDueOn: '2026-05-04' }] } };
    const tested = withPending(ahead, [waiting({ type: 'sign-on', people: ['u1'], visitors: [] }), waiting(test())], me);
    const noon = new Date('2026-05-04T12:00:00Z');
    expect(judgeOnDevice(tested, stamp(install('DUE-4')), noon)).toMatchObject({ code: 'SET_NOT_USABLE' });
    expect(judgingDay(ahead, noon)).toBe('2026-05-05');
    // Without the zone (a copy from before it was sent) the day is the device's own (UTC here), never earlier than the server's.
    expect(judgingDay({ ...base, inventory: { ...ahead.inventory!, timeZone: undefined } }, noon, 'UTC')).toBe('2026-05-04');
  });
});

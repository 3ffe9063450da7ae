/** The field record's log reads each entry's time in the organisation's zone, not in UTC. */
import { render, screen } from '@testing-library/react';
import { expect, it } from 'vitest';
import { RecordLog } from '@/components/records/RecordLog';
import { SyncBar } from '@/components/records/offline/SyncBar';
import type { EntryView, RecordView } from '@/components/records/types';

const me = { id: 'u1', name: 'Invented Lead' };
const note: EntryView = { type: 'note', text: 'Crossing span checked', clientId: 'c1', at: '2026-07-01T03:30:00.000Z', actorId: me.id, id: 1, actorName: me.name, flags: [], recordedAt: '2026-07-01T03:30:01.000Z' };
const record = { id: 1, status: 'open', entries: [note], photos: [] } as unknown as RecordView;

it.each([
  ['UTC', '03:30'],
  ['America/Chicago', '22:30'], // UTC−5 in July (IANA tz database)
  ['Pacific/Kiritimati', '17:30'], // UTC+14
])('shows the entry at %s as %s', (timeZone, shown) => {
  render(<RecordLog record={record} people={[me]} timeZone={timeZone} />);
  expect(screen.getByTestId('record-log').textContent).toContain(shown);
});

it('says when the device was last in step in the organisation zone too', () => {
  render(<SyncBar pending={[]} inStepAt="2026-07-01T03:30:00.000Z" sending="done" timeZone="America/Chicago" />);
  expect(screen.getByTestId('in-step').textContent).toBe('In step with the server at 22:30');
});

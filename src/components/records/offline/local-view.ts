/**
 * The record as this device sees it: what the server last said, plus what waits in the outbox,
 * replayed through the same pure rules the server uses. A new entry is judged here first, with the
 * same messages, against the organisation's sets sent with the record.
 */
import { inventorySetStatus, judgeAppend, nextStep, replay, type FieldEntry, type Refusal } from '@/lib/domain/field-record';
import { judgingDay } from '@/components/records/SetChoice';
import type { CrewPerson, EntryView, RecordView } from '@/components/records/types';
import type { Pending } from './outbox';

/**
 * The server's entries then the waiting ones (not refused, not already recorded), in recorded
 * order; the counts and the next step are worked out again from them, as the server does.
 */
export function withPending(record: RecordView, pending: readonly Pending[], me: CrewPerson): RecordView {
  const known = new Set(record.entries.map((e) => e.clientId));
  const waiting: EntryView[] = pending.flatMap((p) =>
    p.kind === 'entry' && !known.has(p.entry.clientId)
      ? [{ ...p.entry, actorId: me.id, id: -p.seq, actorName: me.name, flags: [], recordedAt: '', waiting: true, ...(p.refused ? { refused: p.refused } : {}) } as EntryView]
      : [],
  );
  const entries = [...record.entries, ...waiting];
  const counted = entries.filter((e) => !e.refused);
  const state = replay(record.plan, counted, record.status === 'closed');
  const flags = new Map(counted.map((e, i) => [e.clientId, state.flags[i] ?? []]));
  return {
    ...record,
    counts: { on: state.on.length, installed: state.installed, removed: state.removed },
    setsOn: state.on,
    voltageFound: state.voltageFound,
    testPassed: state.testPassed,
    briefing: state.briefing,
    next: nextStep(record.plan, state),
    entries: entries.map((e) => (e.waiting ? { ...e, flags: flags.get(e.clientId) ?? [] } : e)),
  };
}

/** The device's verdict on a new entry against the view: null when it may be recorded. */
export function judgeOnDevice(view: RecordView, entry: FieldEntry, now = new Date()): Refusal | null {
  const entries = view.entries.filter((e) => !e.refused) as FieldEntry[];
  const sets = inventorySetStatus(view.inventory?.sets ?? [], judgingDay(view, now));
  const verdict = judgeAppend(view.document, [...entries, entry], view.status === 'closed', sets);
  return verdict.ok ? null : verdict.refusal;
}

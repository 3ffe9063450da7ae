/**
 * The record's log in the order things were done (each entry's device time, so the entries of a
 * device that was offline merge in among the others'), each flag beside its entry, and the photos.
 */
import { BRIEFING_LABELS } from '@/lib/domain/field-record';
import { formatTime } from '@/lib/time-format';
import type { CrewPerson, EntryView, RecordView } from './types';

function describe(e: EntryView, name: (id: string) => string): string {
  switch (e.type) {
    case 'sign-on':
      return `Signed on: ${[...e.people.map(name), ...e.visitors.map((v) => `${v} (visitor)`)].join(', ')}`;
    case 'briefing':
      return `${BRIEFING_LABELS[e.item]} — ${name(e.by)}`;
    case 'voltage-test':
      return `Voltage test (${e.detector}): ${Object.entries(e.phases).map(([p, r]) => `${p} ${r}`).join(', ')}; proved before ${e.detectorCheckedBefore ? 'yes' : 'no'}, after ${e.detectorCheckedAfter ? 'yes' : 'no'}`;
    case 'install':
      return `ON ${e.link} — set ${e.setTag}`;
    case 'remove':
      return `OFF ${e.link}`;
    case 'deviation':
      return `Deviation: ${e.text}`;
    case 'note':
      return `Note: ${e.text}`;
  }
}

export function RecordLog({ record, people, timeZone, onDismiss }: { record: RecordView; people: CrewPerson[]; timeZone: string; onDismiss?: (clientId: string) => void }) {
  const time = (iso: string) => formatTime(new Date(iso), timeZone);
  const names = new Map(people.map((p) => [p.id, p.name]));
  const name = (id: string) => names.get(id) ?? id;
  return (
    <section aria-label="Log" className="space-y-3">
      <h2 className="text-lg font-semibold">Log</h2>
      {record.entries.length === 0 ? <p className="text-note">Nothing recorded yet.</p> : (
        <ol className="divide-y divide-line rounded-lg border border-line bg-white" data-testid="record-log">
          {[...record.entries].sort((a, b) => a.at.localeCompare(b.at)).map((e) => (
            <li key={e.clientId} className="px-3 py-2" data-type={e.type} data-client-id={e.clientId}>
              <span className="num mr-2 text-note">{time(e.at)}</span>
              <span className={e.type === 'voltage-test' && Object.values(e.phases).includes('present') ? 'font-bold text-blocker' : ''}>{describe(e, name)}</span>
              <span className="ml-2 text-sm text-note">{e.actorName}</span>
              {e.waiting && !e.refused && <span className="ml-2 text-sm font-semibold text-note" data-testid="entry-waiting">waiting to send</span>}
              {e.refused && <span className="mt-1 block font-semibold text-blocker" data-testid="entry-refused">Refused by the server: {e.refused.message}{e.refused.items?.length ? ` (${e.refused.items.join(', ')})` : ''}</span>}
              {e.refused && onDismiss && <button type="button" className="mt-1 min-h-[44px] rounded-lg border-2 border-line px-3" onClick={() => onDismiss(e.clientId)}>Read; remove from this device</button>}
              {e.flags.map((f) => <span key={f.code} className="mt-1 block font-semibold text-warning" data-testid="flag">⚑ {f.message}</span>)}
            </li>
          ))}
        </ol>
      )}
      {record.photos.length > 0 && (
        <ul className="grid grid-cols-2 gap-2 sm:grid-cols-3" aria-label="Photos">
          {record.photos.map((p) => (
            <li key={p.id}><a href={p.url} target="_blank" rel="noreferrer"><img src={`${p.url}?size=thumb`} alt={p.caption || 'Field photo'} className="w-full rounded-md border border-line" loading="lazy" /></a><span className="text-sm">{p.caption}</span></li>
          ))}
        </ul>
      )}
    </section>
  );
}

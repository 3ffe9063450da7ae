/**
 * Picking the set that goes on a jumper: the organisation's sets fit to go on today (in service,
 * not past their test date, not on another jumper), big targets, searchable by tag, the plan's own
 * set for this jumper chosen first. There is no free-typed tag: a set the inventory does not know
 * has no test date the record can vouch for, so a visiting crew's set is entered in the inventory first.
 */
import { useState } from 'react';
import { inventoryStatusOf, usableSets } from '@/lib/domain/field-record';
import { formatDate, runtimeTimeZone } from '@/lib/time-format';
import type { RecordView } from './types';

/**
 * The day sets are judged on here: the date on the organisation's calendar (the zone the record's
 * copy carries; the device's own zone for a copy from before it did), never earlier than the
 * organisation's day the server gave when the copy was made.
 */
export function judgingDay(record: RecordView, now = new Date(), zone = record.inventory?.timeZone ?? runtimeTimeZone()): string {
  const device = formatDate(now, zone);
  const server = record.inventory?.today ?? device;
  return device > server ? device : server;
}

/** The set tag the plan names for a jumper, if any. */
export function plannedTag(record: RecordView, link: string): string | undefined {
  const found = record.document?.links?.find((l) => l.id === link);
  return found && 'equipmentId' in found && typeof found.equipmentId === 'string' ? found.equipmentId : undefined;
}

export interface SetChoiceProps {
  record: RecordView;
  link: string;
  value: string;
  onChange: (tag: string) => void;
}

export function SetChoice({ record, link, value, onChange }: SetChoiceProps) {
  const [query, setQuery] = useState('');
  const day = judgingDay(record);
  const sets = record.inventory?.sets ?? [];
  const inUse = new Set(record.setsOn.map((s) => s.setTag.toLowerCase()));
  const choices = usableSets(sets, day).filter((s) => !inUse.has(s.tag.toLowerCase()));
  const shown = choices.filter((s) => s.tag.toLowerCase().includes(query.trim().toLowerCase()));
  const planned = plannedTag(record, link);
  const plannedSet = planned ? sets.find((s) => s.tag.toLowerCase() === planned.toLowerCase()) : undefined;
  const plannedStatus = planned ? inventoryStatusOf(plannedSet, planned, day) : null;
  return (
    <div className="space-y-2">
      {planned && plannedStatus && !plannedStatus.usable && (
        <p className="rounded-lg border-2 border-blocker p-3 text-lg" role="note" data-testid="planned-set-unfit">The plan names {planned}, which cannot go on: {plannedStatus.detail}. Pick another set.</p>
      )}
      <label className="block text-lg">Find a set by tag<input type="search" className="mt-1 min-h-[56px] w-full rounded-lg border-2 border-line px-3" value={query} onChange={(e) => setQuery(e.target.value)} /></label>
      {choices.length === 0 && <p className="text-lg" role="note">No set of your organisation is fit to go on today. Ask the office to enter or test one.</p>}
      <div role="radiogroup" aria-label="Set" className="grid max-h-[22rem] grid-cols-1 gap-2 overflow-y-auto sm:grid-cols-2">
        {shown.map((s) => (
          <label key={s.tag} className={`flex min-h-[56px] items-center gap-3 rounded-lg border-2 px-4 text-lg ${value === s.tag ? 'border-accent bg-paper font-semibold' : 'border-line bg-white'}`}>
            <input type="radio" name={`set-${link}`} className="h-7 w-7" checked={value === s.tag} onChange={() => onChange(s.tag)} />
            <span>{s.tag}<span className="block text-sm text-note">{s.description}{s.tag.toLowerCase() === planned?.toLowerCase() ? ' · named in the plan' : ''}</span></span>
          </label>
        ))}
      </div>
    </div>
  );
}

/** The tag to choose first: the plan's own set when it is fit and free, else none. */
export function firstChoice(record: RecordView, link: string): string {
  const planned = plannedTag(record, link);
  if (!planned) return '';
  const day = judgingDay(record);
  const inUse = new Set(record.setsOn.map((s) => s.setTag.toLowerCase()));
  const fit = usableSets(record.inventory?.sets ?? [], day).find((s) => s.tag.toLowerCase() === planned.toLowerCase() && !inUse.has(s.tag.toLowerCase()));
  return fit?.tag ?? '';
}

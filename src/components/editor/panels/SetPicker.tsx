/**
 * A jumper's grounding set: search the organisation's in-service sets by tag and take one; its
 * cable, length, clamp rating, clamp kind and connection then come from the set (the jumper's
 * `equipmentId` holds the set's tag) and are listed here as coming from it.
 */
import { useEffect, useId, useState } from 'react';
import type { LinkOf, PlanLink } from '@/lib/schemas/plan';
import { dueState, type SetRecord } from '@/lib/domain/equipment';
import { formatLength } from '@/lib/domain/units';
import { useEditor } from '@/components/editor/selectors';
import { runtimeTimeZone, formatDate } from '@/lib/time-format';

type Jumper = LinkOf<'jumper'>;
type ListedSet = SetRecord & { id: number; description: string };

const DUE_WORDS = { overdue: 'test overdue', soon: 'test due soon', ok: '' } as const;
/** The date on the device's own calendar, which the due marks count from. */
const today = () => formatDate(new Date(), runtimeTimeZone());

/** The jumper with the set's figures on it (what the check will use anyway). */
export function withSet(jumper: Jumper, set: SetRecord): Jumper {
  return { ...jumper, equipmentId: set.tag, cable: set.cable, lengthM: set.lengthM, clampKa: set.clampKa, clampCycles: set.clampCycles, clampKind: set.clampKind, connection: set.connection };
}

function useInServiceSets(open: boolean, query: string) {
  const [sets, setSets] = useState<ListedSet[] | null>(null);
  const [failed, setFailed] = useState(false);
  useEffect(() => {
    if (!open) return undefined;
    const controller = new AbortController();
    const timer = setTimeout(() => {
      const params = new URLSearchParams({ status: 'in-service', pageSize: '20', sort: 'tag' });
      if (query.trim()) params.set('q', query.trim());
      fetch(`/api/equipment?${params}`, { signal: controller.signal, credentials: 'same-origin', headers: { accept: 'application/json' } })
        .then((r) => (r.ok ? r.json() : Promise.reject(new Error(String(r.status)))))
        .then((body: { items: ListedSet[] }) => {
          setSets(body.items);
          setFailed(false);
        })
        .catch((e: Error) => e.name !== 'AbortError' && setFailed(true));
    }, 200);
    return () => {
      clearTimeout(timer);
      controller.abort();
    };
  }, [open, query]);
  return { sets, failed };
}

export function SetPicker({ jumper }: { jumper: Jumper }) {
  const id = useId();
  const [query, setQuery] = useState('');
  const [open, setOpen] = useState(false);
  const updateElement = useEditor((s) => s.updateElement);
  const units = useEditor((s) => s.units);
  const { sets, failed } = useInServiceSets(open, query);
  const day = today();
  const take = (set: ListedSet) => {
    updateElement(withSet(jumper, set) as PlanLink);
    setOpen(false);
  };
  const clear = () => {
    const rest: Jumper = { ...jumper };
    delete rest.equipmentId;
    updateElement(rest as PlanLink);
  };

  return (
    <section aria-label="Grounding set" className="mb-4 rounded-md border border-line p-3" data-testid="set-picker">
      <h3 className="mb-1 font-semibold">Grounding set</h3>
      {jumper.equipmentId ? (
        <div className="space-y-1 text-sm" data-testid="set-taken">
          <p>
            Set <span className="font-semibold">{jumper.equipmentId}</span>. From the set's record:
          </p>
          <ul className="list-disc pl-5">
            <li>cable {jumper.cable}, {formatLength(jumper.lengthM, units)}</li>
            {jumper.clampKa !== undefined && <li>clamps {jumper.clampKa} kA for {jumper.clampCycles ?? '—'} cycles{jumper.clampKind ? `, ${jumper.clampKind}` : ''}</li>}
            {jumper.connection && <li>{jumper.connection} connection</li>}
          </ul>
          <p className="text-note">The check uses the set's own figures and warns when the drawing differs.</p>
          <div className="flex gap-2">
            <button type="button" className="btn" onClick={() => setOpen(true)}>Change set</button>
            <button type="button" className="btn" onClick={clear}>No set</button>
          </div>
        </div>
      ) : (
        <button type="button" className="btn w-full" onClick={() => setOpen(true)}>Take a set from the inventory</button>
      )}
      {open && (
        <div className="mt-2 space-y-2">
          <label className="label text-sm" htmlFor={id}>Search in-service sets by tag</label>
          <input id={id} className="field" type="search" value={query} onChange={(e) => setQuery(e.target.value)} autoFocus />
          {failed && <p className="text-sm text-blocker">The inventory could not be loaded; try again.</p>}
          {sets && sets.length === 0 && <p className="text-sm text-note">No in-service set matches.</p>}
          <ul className="max-h-64 divide-y divide-line overflow-y-auto rounded-md border border-line" role="listbox" aria-label="In-service sets">
            {(sets ?? []).map((set) => {
              const due = dueState(set.testDueOn, day);
              return (
                <li key={set.id} role="option" aria-selected={set.tag === jumper.equipmentId}>
                  <button type="button" className="min-h-touch w-full px-3 py-1 text-left hover:bg-paper" onClick={() => take(set)} data-tag={set.tag}>
                    <span className="font-semibold">{set.tag}</span> · {set.cable}, {formatLength(set.lengthM, units)}, {set.clampKa} kA
                    {due !== 'ok' && <span className={`ml-1 font-semibold ${due === 'overdue' ? 'text-blocker' : 'text-warning'}`}>{due === 'overdue' ? '◆' : '⧗'} {DUE_WORDS[due]}</span>}
                  </button>
                </li>
              );
            })}
          </ul>
          <button type="button" className="btn" onClick={() => setOpen(false)}>Close</button>
        </div>
      )}
    </section>
  );
}

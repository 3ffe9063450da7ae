/**
 * Find: the read-only drawing in a "Mark" mode. A tap on an element marks it (a numbered marker)
 * and a second tap unmarks it; the list beside the drawing does the same with 44 px buttons.
 */
import { useEffect, useState } from 'react';
import { useStore } from 'zustand';
import { createEditorStore } from '@/components/editor/store';
import { PracticeCanvas } from './PracticeCanvas';
import { elementName, type LearnerExercise } from './types';

export function MarkElements({ exercise, onSubmit, busy }: { exercise: LearnerExercise; onSubmit: (elements: string[]) => void; busy: boolean }) {
  const doc = exercise.document;
  const [store] = useState(() => createEditorStore({ doc, readOnly: true, report: null }));
  const [marked, setMarked] = useState<string[]>([]);
  const selection = useStore(store, (s) => s.selection);
  const toggle = (id: string) => setMarked((m) => (m.includes(id) ? m.filter((x) => x !== id) : [...m, id]));

  // A tap on a symbol arrives once, through the canvas's tap handler, and toggles its mark. Links
  // are picked through React Flow's selection: it toggles them and the selection is cleared again
  // (node selections are left alone, since React Flow's own click would toggle a node twice).
  const isLink = (id: string) => doc.links.some((l) => l.id === id);
  useEffect(() => {
    const links = selection.filter(isLink);
    if (!links.length) return;
    store.setState({ selection: [] });
    setMarked((m) => links.reduce((acc, id) => (acc.includes(id) ? acc.filter((x) => x !== id) : [...acc, id]), m));
  }, [selection, store]);
  useEffect(() => {
    store.setState({ pins: Object.fromEntries(marked.map((id, i) => [id, [i + 1]])) });
  }, [marked, store]);

  const ids = [...doc.nodes.map((n) => n.id), ...doc.links.map((l) => l.id)];
  return (
    <PracticeCanvas store={store} label="Drawing: tap to mark" onTapNode={toggle}>
      <aside className="w-full space-y-3 lg:w-80">
        <p className="font-semibold" aria-live="polite" data-testid="marked-count">{marked.length} marked</p>
        <ul className="max-h-[50vh] space-y-1 overflow-auto" aria-label="Elements">
          {ids.map((id) => (
            <li key={id}>
              <button type="button" className={`btn w-full justify-start text-left ${marked.includes(id) ? 'border-accent ring-2 ring-accent' : ''}`} aria-pressed={marked.includes(id)} onClick={() => toggle(id)} data-testid={`mark-${id}`}>
                {marked.includes(id) ? `${marked.indexOf(id) + 1}.` : ''} {elementName(doc, id)}
              </button>
            </li>
          ))}
        </ul>
        <button type="button" className="btn-primary w-full" disabled={busy || marked.length === 0} onClick={() => onSubmit(marked)}>Check my marks</button>
      </aside>
    </PracticeCanvas>
  );
}

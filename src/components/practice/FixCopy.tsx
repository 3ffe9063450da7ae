/**
 * Fix: an editable copy on the editor's canvas with its inspector. Nothing is saved: Check runs
 * the server's checker on the copy, and Hand in sends the copy to be graded.
 */
import { useState } from 'react';
import { useStore } from 'zustand';
import { FindingsList } from '@/components/editor/panels/FindingsList';
import { Inspector } from '@/components/editor/panels/Inspector';
import { createEditorStore } from '@/components/editor/store';
import { PracticeCanvas } from './PracticeCanvas';
import type { LearnerExercise } from './types';
import type { PlanDocument } from '@/lib/schemas/plan';

export function FixCopy({ exercise, onSubmit, busy }: { exercise: LearnerExercise; onSubmit: (document: PlanDocument) => void; busy: boolean }) {
  const [store] = useState(() => createEditorStore({ doc: exercise.document, readOnly: false, report: null }));
  const report = useStore(store, (s) => s.report);
  const [problem, setProblem] = useState<string | null>(null);
  const check = async () => {
    setProblem(null);
    const response = await fetch('/api/check', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(store.getState().doc) }).catch(() => null);
    const body = response ? await response.json().catch(() => null) : null;
    if (!response?.ok) return setProblem(body?.error?.issues?.map((i: { path: string; message: string }) => `${i.path}: ${i.message}`).join('; ') ?? 'The check could not run; try again.');
    store.getState().receiveReport(body.report ?? body);
  };
  return (
    <div className="space-y-3">
      <p className="text-sm">Draw a jumper by dragging from one element's edge to another's; select a jumper to change its cable. Nothing here is saved to any plan.</p>
      <PracticeCanvas store={store} label="Your copy of the plan">
        <aside className="w-full space-y-3 lg:w-80">
          <Inspector />
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn" onClick={() => void check()}>Check my copy</button>
            <button type="button" className="btn-primary" disabled={busy} onClick={() => onSubmit(store.getState().doc)}>Hand in</button>
          </div>
          {problem && <p role="alert" className="text-blocker">{problem}</p>}
          {report && <FindingsList findings={report.findings} />}
        </aside>
      </PracticeCanvas>
    </div>
  );
}

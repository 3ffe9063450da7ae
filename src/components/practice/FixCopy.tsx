/**
 * Fix: an editable copy on the editor's canvas with its inspector. Nothing is saved: Check runs
 * the server's checker on the copy, and Hand in sends the copy to be graded. A jumper or bond is
 * drawn with the editor's link tools (tap the tool, then the two ends), so a finger can do it.
 */
import { useState } from 'react';
import { useStore } from 'zustand';
import { FindingsList } from '@/components/editor/panels/FindingsList';
import { Inspector } from '@/components/editor/panels/Inspector';
import { LINK_LABELS } from '@/components/editor/plan-ops';
import { createEditorStore } from '@/components/editor/store';
import { PracticeCanvas } from './PracticeCanvas';
import type { LearnerExercise } from './types';
import type { PlanDocument } from '@/lib/schemas/plan';

export function FixCopy({ exercise, onSubmit, busy }: { exercise: LearnerExercise; onSubmit: (document: PlanDocument) => void; busy: boolean }) {
  const [store] = useState(() => createEditorStore({ doc: exercise.document, readOnly: false, report: null }));
  const report = useStore(store, (s) => s.report);
  const linkTool = useStore(store, (s) => s.linkTool);
  const message = useStore(store, (s) => s.message);
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
      <p className="text-sm">Draw a jumper or bond: tap its tool, then the two elements it joins (or drag from one element's edge to another's). Select a jumper to change its cable. Nothing here is saved to any plan.</p>
      <PracticeCanvas store={store} label="Your copy of the plan">
        <aside className="w-full space-y-3 lg:w-80">
          <div className="grid grid-cols-2 gap-2" role="group" aria-label="Draw a link">
            {(['jumper', 'bond'] as const).map((kind) => (
              <button key={kind} type="button" className={`btn ${linkTool === kind ? 'border-accent bg-accent text-white' : ''}`} aria-pressed={linkTool === kind} onClick={() => store.getState().armLinkTool(linkTool === kind ? null : kind)}>{LINK_LABELS[kind]}</button>
            ))}
          </div>
          {message && <p className="text-sm" aria-live="polite" data-testid="editor-message">{message}</p>}
          {/* The inspector fills its parent's height in the editor; here it takes its own, so the buttons below stay in the exercise. */}
          <div>
            <Inspector />
          </div>
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

/** The editor's top bar: title, status, revision, save state and the actions. */
import { useEffect, useRef, useState } from 'react';
import type { PlanStatus } from '@/lib/domain/plan-status';
import { StatusBadge } from '@/components/ui/StatusBadge';
import { useEditor } from '@/components/editor/selectors';
import { SaveIndicator } from './SaveIndicator';

export interface TopBarProps {
  status: PlanStatus;
  onFit: () => void;
  onCheck: () => void;
  onRetrySave: () => void;
  onExport: (what: 'png' | 'pdf' | 'json') => void;
  onImport: (file: File) => void;
  /** Present when this person may submit the plan for review now. */
  onSubmit?: () => void;
  historyHref: string;
  busy: string | null;
}

function TitleField() {
  const title = useEditor((s) => s.doc.title);
  const readOnly = useEditor((s) => s.readOnly);
  const rename = useEditor((s) => s.renamePlan);
  const [value, setValue] = useState(title);
  useEffect(() => setValue(title), [title]);
  if (readOnly) return <h1 className="truncate text-xl font-bold">{title}</h1>;
  return (
    <input aria-label="Plan title" className="field min-w-0 flex-1 border-transparent text-xl font-bold hover:border-line" value={value}
      onChange={(e) => setValue(e.target.value)} onBlur={() => (value.trim() ? rename(value.trim()) : setValue(title))}
      onKeyDown={(e) => e.key === 'Enter' && (e.target as HTMLInputElement).blur()} />
  );
}

export function TopBar({ status, onFit, onCheck, onRetrySave, onExport, onImport, onSubmit, historyHref, busy }: TopBarProps) {
  const saveState = useEditor((s) => s.saveState);
  const revision = useEditor((s) => s.baseRevision);
  const readOnly = useEditor((s) => s.readOnly);
  const canUndo = useEditor((s) => s.past.length > 0);
  const canRedo = useEditor((s) => s.future.length > 0);
  const undo = useEditor((s) => s.undo);
  const redo = useEditor((s) => s.redo);
  const snap = useEditor((s) => s.snap);
  const toggleSnap = useEditor((s) => s.toggleSnap);
  const file = useRef<HTMLInputElement>(null);
  const [exportOpen, setExportOpen] = useState(false);
  return (
    <div className="no-print relative z-40 flex flex-wrap items-center gap-2 border-b border-line bg-white px-3 py-1" data-testid="topbar">
      <div className="flex min-w-[20rem] flex-1 items-center gap-3">
        <TitleField />
        <StatusBadge status={status} />
        <span className="whitespace-nowrap text-sm text-note num" data-testid="revision">Revision {revision}</span>
        <SaveIndicator state={saveState} onRetry={onRetrySave} />
      </div>
      <div className="flex flex-wrap items-center gap-1">
        {!readOnly && (
          <>
            <button type="button" className="btn" onClick={undo} disabled={!canUndo} title="Undo (Ctrl+Z)">Undo</button>
            <button type="button" className="btn" onClick={redo} disabled={!canRedo} title="Redo (Shift+Ctrl+Z)">Redo</button>
            <button type="button" className="btn" aria-pressed={snap} onClick={toggleSnap} title="Snap to grid">{snap ? 'Grid: on' : 'Grid: off'}</button>
          </>
        )}
        <button type="button" className="btn" onClick={onFit} title="Zoom to fit (Shift+F)">Fit</button>
        <button type="button" className="btn" onClick={onCheck}>Check</button>
        <div className="relative">
          <button type="button" className="btn" aria-expanded={exportOpen} aria-haspopup="menu" onClick={() => setExportOpen(!exportOpen)} disabled={busy !== null}>
            {busy ?? 'Export'}
          </button>
          {exportOpen && (
            <div role="menu" className="absolute right-0 z-30 mt-1 w-48 rounded-lg border border-line bg-white py-1 shadow-lg">
              {(['pdf', 'png', 'json'] as const).map((w) => (
                <button key={w} type="button" role="menuitem" className="flex min-h-touch w-full items-center px-4 font-semibold hover:bg-paper"
                  onClick={() => { setExportOpen(false); onExport(w); }}>
                  {w === 'pdf' ? 'PDF sheet' : w === 'png' ? 'PNG picture' : 'Plan JSON'}
                </button>
              ))}
            </div>
          )}
        </div>
        {!readOnly && (
          <>
            <button type="button" className="btn" onClick={() => file.current?.click()}>Import JSON</button>
            <input ref={file} type="file" accept="application/json,.json" className="sr-only" aria-label="Import a plan JSON file" data-testid="import-file"
              onChange={(e) => { const f = e.target.files?.[0]; if (f) onImport(f); e.target.value = ''; }} />
          </>
        )}
        <button type="button" className="btn" onClick={() => window.print()}>Print</button>
        <a className="btn" href={historyHref}>History</a>
        {onSubmit && <button type="button" className="btn-primary" onClick={onSubmit} disabled={busy !== null} data-testid="submit-plan">Submit for review</button>}
      </div>
    </div>
  );
}

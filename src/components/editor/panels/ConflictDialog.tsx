/**
 * Someone saved the plan since this copy was loaded: say so plainly and offer the two honest
 * choices. Nothing is lost either way until the user picks.
 */
import { useEffect, useRef } from 'react';

export interface ConflictDialogProps {
  yourRevision: number;
  currentRevision: number;
  onReloadTheirs: () => void;
  onKeepMine: () => void;
}

export function ConflictDialog({ yourRevision, currentRevision, onReloadTheirs, onKeepMine }: ConflictDialogProps) {
  const first = useRef<HTMLButtonElement>(null);
  useEffect(() => first.current?.focus(), []);
  return (
    <div className="fixed inset-0 z-50 flex items-center justify-center bg-ink/40 p-4">
      <div role="alertdialog" aria-modal="true" aria-labelledby="conflict-title" aria-describedby="conflict-text" className="card max-w-lg space-y-4 shadow-xl" data-testid="conflict-dialog">
        <h2 id="conflict-title">This plan changed while you were editing</h2>
        <p id="conflict-text">
          Someone saved revision {currentRevision}; your changes were made on revision {yourRevision}. Your changes are still
          on this device. Load their version (your changes are dropped), or keep yours and save them as a new revision on top of theirs.
        </p>
        <div className="flex flex-wrap gap-3">
          <button ref={first} type="button" className="btn" onClick={onReloadTheirs}>Reload theirs</button>
          <button type="button" className="btn-primary" onClick={onKeepMine}>Keep mine as a new revision</button>
        </div>
      </div>
    </div>
  );
}

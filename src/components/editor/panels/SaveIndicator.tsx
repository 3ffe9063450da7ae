/** The save state in words and a shape (screens.md): Saved / Saving… / Offline — kept on this device / Conflict. */
import type { SaveState } from '@/components/editor/store';

const TEXT: Record<SaveState, string> = {
  saved: 'Saved',
  unsaved: 'Unsaved changes',
  saving: 'Saving…',
  offline: 'Offline — kept on this device',
  conflict: 'Conflict',
  invalid: 'Not saved — fix the plan',
  locked: 'Read only',
  'signed-out': 'Signed out — kept on this device',
  forbidden: 'Not allowed — kept on this device',
  'too-large': 'Too large to save',
};
const TONE: Record<SaveState, string> = {
  saved: 'text-clear', unsaved: 'text-note', saving: 'text-note', offline: 'text-warning', conflict: 'text-blocker', invalid: 'text-blocker', locked: 'text-note',
  'signed-out': 'text-blocker', forbidden: 'text-blocker', 'too-large': 'text-blocker',
};

function Shape({ state }: { state: SaveState }) {
  return (
    <svg width="16" height="16" viewBox="0 0 16 16" aria-hidden="true">
      {state === 'saved' && <path d="M3.5 8.5l3 3 6-7" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" strokeLinejoin="round" />}
      {(state === 'saving' || state === 'unsaved') && <circle cx="8" cy="8" r="5.5" fill="none" stroke="currentColor" strokeWidth="2" strokeDasharray={state === 'saving' ? '4 3' : undefined} />}
      {state === 'offline' && <path d="M2 6a9 9 0 0112 0M4.5 8.5a5.5 5.5 0 017 0M7 11a2 2 0 012 0M2 2l12 12" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />}
      {(state === 'conflict' || state === 'invalid' || state === 'signed-out' || state === 'forbidden' || state === 'too-large') && <path d="M8 1.5L15 14H1z M8 6v4 M8 12v.5" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinejoin="round" strokeLinecap="round" />}
      {state === 'locked' && <path d="M4 7h8v7H4zM5.5 7V5a2.5 2.5 0 015 0v2" fill="none" stroke="currentColor" strokeWidth="1.8" />}
    </svg>
  );
}

export function SaveIndicator({ state, onRetry }: { state: SaveState; onRetry?: () => void }) {
  return (
    <span className={`inline-flex items-center gap-1 text-sm font-semibold ${TONE[state]}`} role="status" aria-live="polite" data-testid="save-state" data-state={state}>
      <Shape state={state} />
      {TEXT[state]}
      {state === 'offline' && onRetry && <button type="button" className="btn ml-1" onClick={onRetry}>Try now</button>}
    </span>
  );
}

/**
 * The session ended while editing: say so, keep the work, and let the person sign in again in a
 * new tab without leaving this page (leaving would lose nothing either: the copy on this device
 * comes back on the next load).
 */
import { useEffect, useRef } from 'react';
import { useEditor } from '@/components/editor/selectors';

export function SignedOutDialog({ planId, onResume }: { planId: number; onResume: () => void }) {
  const signedOut = useEditor((s) => s.saveState === 'signed-out' || s.checkState === 'signed-out');
  const first = useRef<HTMLAnchorElement>(null);
  useEffect(() => {
    if (signedOut) first.current?.focus();
  }, [signedOut]);
  if (!signedOut) return null;
  return (
    <div className="fixed inset-0 z-50 flex items-center justify-center bg-ink/40 p-4">
      <div role="alertdialog" aria-modal="true" aria-labelledby="signed-out-title" aria-describedby="signed-out-text" className="card max-w-lg space-y-4 shadow-xl" data-testid="signed-out-dialog">
        <h2 id="signed-out-title">Your session has ended</h2>
        <p id="signed-out-text">
          You were signed out, so your latest changes are not saved on the server yet. They are kept on this device. Sign in
          again in a new tab, then come back here and save.
        </p>
        <div className="flex flex-wrap gap-3">
          <a ref={first} className="btn-primary" href={`/login?next=${encodeURIComponent(`/plans/${planId}`)}`} target="_blank" rel="noopener">Sign in in a new tab</a>
          <button type="button" className="btn" onClick={onResume}>I have signed in: save now</button>
        </div>
      </div>
    </div>
  );
}

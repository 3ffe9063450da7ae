/**
 * Asked before a bond is drawn where a jumper belongs (a phase, or the cluster bar to the neutral
 * or to ground): a bond is a permanent connection and the check rates nothing on it.
 */
import { useEffect, useRef } from 'react';
import { useEditor } from '@/components/editor/selectors';

export function BondCaution() {
  const pending = useEditor((s) => s.pendingBond);
  const settle = useEditor((s) => s.settleBond);
  const first = useRef<HTMLButtonElement>(null);
  useEffect(() => first.current?.focus(), [pending]);
  if (!pending) return null;
  return (
    <div className="fixed inset-0 z-50 flex items-center justify-center bg-ink/40 p-4">
      <div role="alertdialog" aria-modal="true" aria-labelledby="bond-title" aria-describedby="bond-text" className="card max-w-lg space-y-4 shadow-xl" data-testid="bond-caution">
        <h2 id="bond-title">A jumper belongs here, not a bond</h2>
        <p id="bond-text">{pending.caution}</p>
        <p className="text-sm text-note">Between {pending.from} and {pending.to}.</p>
        <div className="flex flex-wrap gap-3">
          <button ref={first} type="button" className="btn-primary" onClick={() => settle('jumper')}>Draw a jumper instead</button>
          <button type="button" className="btn" onClick={() => settle('bond')}>It is a permanent connection: draw the bond</button>
          <button type="button" className="btn" onClick={() => settle('cancel')}>Cancel</button>
        </div>
      </div>
    </div>
  );
}

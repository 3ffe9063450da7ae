/** Always in view on the field screen: what waits on this device, and when it was last in step. */
import { formatTime } from '@/lib/time-format';
import type { FlushOutcome, Pending } from './outbox';

/** Times in the organisation's zone, as in the log beside it. */
export function SyncBar({ pending, inStepAt, sending, timeZone }: { pending: Pending[]; inStepAt: string | null; sending: FlushOutcome; timeZone: string }) {
  const clock = (iso: string) => formatTime(new Date(iso), timeZone);
  const waiting = pending.filter((p) => !p.refused);
  const entries = waiting.filter((p) => p.kind === 'entry').length;
  const photos = waiting.length - entries;
  const refused = pending.length - waiting.length;
  return (
    <div className="rounded-lg border-2 border-line bg-white p-2 text-base" data-testid="sync-bar" aria-live="polite">
      <p>
        Waiting to send: <strong className="num" data-testid="waiting-entries">{entries}</strong> {entries === 1 ? 'entry' : 'entries'}, <strong className="num" data-testid="waiting-photos">{photos}</strong> {photos === 1 ? 'photo' : 'photos'}
        {refused > 0 && <span className="ml-2 font-semibold text-blocker">· {refused} refused by the server (see the log)</span>}
      </p>
      <p className="text-note" data-testid="in-step">{inStepAt ? `In step with the server at ${clock(inStepAt)}` : 'Not yet in step with the server on this device'}</p>
      {sending === 'signed-out' && <p className="font-semibold text-warning" role="alert">Your session has ended. Nothing is lost: <a className="link" href="/login" target="_blank" rel="noreferrer">sign in again</a> as yourself and it will be sent.</p>}
    </div>
  );
}

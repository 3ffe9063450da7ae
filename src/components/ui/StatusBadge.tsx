/** A plan's status as word + shape (screens.md); StatusBadge.astro renders this one for pages. */
import { STATUS_LABELS, type PlanStatus } from '@/lib/domain/plan-status';

const STYLES: Record<PlanStatus, string> = {
  draft: 'border-ink text-ink',
  submitted: 'border-note text-note',
  returned: 'border-warning text-warning',
  approved: 'border-clear text-clear',
};

export function StatusBadge({ status }: { status: PlanStatus }) {
  return (
    <span className={`inline-flex items-center gap-1 rounded-full border bg-white px-2 py-0.5 text-sm font-semibold ${STYLES[status]}`} data-status={status}>
      <svg width="14" height="14" viewBox="0 0 14 14" aria-hidden="true">
        {status === 'draft' && <rect x="2" y="2" width="10" height="10" rx="2" fill="none" stroke="currentColor" strokeWidth="1.5" strokeDasharray="2 1.5" />}
        {status === 'submitted' && (<><circle cx="7" cy="7" r="5.5" fill="none" stroke="currentColor" strokeWidth="1.5" /><path d="M7 4v3.2l2 1.3" fill="none" stroke="currentColor" strokeWidth="1.5" strokeLinecap="round" /></>)}
        {status === 'returned' && <path d="M5 3L2 6l3 3M2.5 6H9a3 3 0 010 6H6" fill="none" stroke="currentColor" strokeWidth="1.5" strokeLinecap="round" strokeLinejoin="round" />}
        {status === 'approved' && (<><path d="M7 1l1.5 1.3 2-.2.5 1.9 1.7 1-.8 1.8.8 1.8-1.7 1-.5 1.9-2-.2L7 13l-1.5-1.3-2 .2-.5-1.9-1.7-1L2.1 7l-.8-1.8 1.7-1 .5-1.9 2 .2z" fill="currentColor" /><path d="M4.8 7l1.5 1.5 3-3" fill="none" stroke="white" strokeWidth="1.4" strokeLinecap="round" /></>)}
      </svg>
      {STATUS_LABELS[status]}
    </span>
  );
}

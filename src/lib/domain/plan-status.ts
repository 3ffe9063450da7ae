/** Plan workflow states: draft → submitted → approved, or → returned → (edited) → submitted. */
export const PLAN_STATUSES = ['draft', 'submitted', 'returned', 'approved'] as const;
export type PlanStatus = (typeof PLAN_STATUSES)[number];

export const STATUS_LABELS: Record<PlanStatus, string> = {
  draft: 'Draft',
  submitted: 'Submitted',
  returned: 'Returned',
  approved: 'Approved',
};

export function isPlanStatus(value: unknown): value is PlanStatus {
  return typeof value === 'string' && (PLAN_STATUSES as readonly string[]).includes(value);
}

/** A crew lead may change the document only while the plan is in their hands. */
export function isEditable(status: PlanStatus): boolean {
  return status === 'draft' || status === 'returned';
}

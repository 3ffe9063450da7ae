/**
 * Plan workflow states: draft → submitted → approved, or → returned → (edited) → submitted; a
 * submitted plan can be withdrawn by its author back to a draft before anyone decides it.
 */
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

/** Everything a person can do to move a plan, and what each does from each state (null: refused). */
export const WORKFLOW_ACTIONS = ['save', 'submit', 'approve', 'return', 'reopen', 'withdraw'] as const;
export type WorkflowAction = (typeof WORKFLOW_ACTIONS)[number];

const TRANSITIONS: Record<PlanStatus, Partial<Record<WorkflowAction, PlanStatus>>> = {
  // Saving keeps the state: a returned plan stays returned (with its comments) until resubmitted.
  draft: { save: 'draft', submit: 'submitted' },
  // Submitting a returned plan unchanged makes a new revision (a copy), so it can be decided again.
  returned: { save: 'returned', submit: 'submitted' },
  // Withdrawing keeps the revision (it was never decided) and hands it back as a draft.
  submitted: { approve: 'approved', return: 'returned', withdraw: 'draft' },
  // Reopening copies the approved document into a new draft revision.
  approved: { reopen: 'draft' },
};

export function nextStatus(status: PlanStatus, action: WorkflowAction): PlanStatus | null {
  return TRANSITIONS[status][action] ?? null;
}

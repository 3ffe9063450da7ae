/**
 * The review workflow's guards: given what the repository read under the plan's row lock, each
 * judge says whether the step may happen and, if so, what it does. The repository only persists
 * the verdict; the transition table itself is `nextStatus` in plan-status.ts. Pure.
 */
import { mailboxKey } from './people';
import { nextStatus, type PlanStatus } from './plan-status';

export type Decision = 'approve' | 'return';

export interface SubmitFacts {
  status: PlanStatus;
  currentRevision: number;
  /** The revision the server checked, when the caller says; a save since then is unchecked. */
  checkedRevision?: number;
  /** Blockers in the server's fresh report. */
  blockers: number;
  /** The current revision already has a decision (a returned plan submitted unchanged). */
  decided: boolean;
}

export type SubmitVerdict =
  | { kind: 'not-submittable'; status: PlanStatus }
  | { kind: 'stale'; revision: number }
  /** Refused; the report is stored on the revision only when that revision is still undecided. */
  | { kind: 'blocked'; storeReport: boolean }
  /** Submitted; `copy` makes revision n+1 from the decided one (each revision is decided once). */
  | { kind: 'submit'; revision: number; copy: boolean; status: PlanStatus };

export function judgeSubmit(facts: SubmitFacts): SubmitVerdict {
  const status = nextStatus(facts.status, 'submit');
  if (!status) return { kind: 'not-submittable', status: facts.status };
  if (facts.checkedRevision !== undefined && facts.currentRevision !== facts.checkedRevision) return { kind: 'stale', revision: facts.currentRevision };
  // A decided revision never changes: a blocked resubmission leaves it (and the plan) as they are.
  if (facts.blockers > 0) return { kind: 'blocked', storeReport: !facts.decided };
  return { kind: 'submit', revision: facts.decided ? facts.currentRevision + 1 : facts.currentRevision, copy: facts.decided, status };
}

export interface SaveFacts {
  status: PlanStatus;
  currentRevision: number;
  /** The revision the crew lead edited from. */
  expectedRevision: number;
}

export type SaveVerdict = { kind: 'not-editable' } | { kind: 'stale' } | { kind: 'save'; revision: number; status: PlanStatus };

/** A save is a new revision n+1 of a plan in the crew lead's hands, made from revision n. */
export function judgeSave(facts: SaveFacts): SaveVerdict {
  const status = nextStatus(facts.status, 'save');
  if (!status) return { kind: 'not-editable' };
  if (facts.currentRevision !== facts.expectedRevision) return { kind: 'stale' };
  return { kind: 'save', revision: facts.currentRevision + 1, status };
}

/**
 * Whether a fresh check report may replace the stored one on a revision: only on the current
 * revision of a plan still in the crew lead's hands (an older revision is fixed once a later one
 * exists, a submitted or approved one is under review), and never on a revision already decided
 * (a returned revision keeps the report it was decided on).
 */
export function mayStoreReport(facts: { status: PlanStatus; currentRevision: number; revision: number; decided: boolean }): boolean {
  return nextStatus(facts.status, 'save') !== null && facts.currentRevision === facts.revision && !facts.decided;
}

export interface PersonLink {
  id: string;
  email: string;
  invitedBy: string | null;
}

/**
 * True when the reviewer is too close to the plan's author or editors to approve it: someone in
 * the chain of people who invited the reviewer is an editor (an admin's second account, or an
 * account made by that account), or the reviewer shares a mailbox with an editor.
 */
export function relatedToEditors(people: readonly PersonLink[], reviewerId: string, editors: ReadonlySet<string>): boolean {
  const byId = new Map(people.map((p) => [p.id, p]));
  const reviewer = byId.get(reviewerId);
  if (!reviewer) return false;
  const editorMailboxes = new Set([...editors].flatMap((id) => {
    const editor = byId.get(id);
    return editor ? [mailboxKey(editor.email)] : [];
  }));
  if (editorMailboxes.has(mailboxKey(reviewer.email))) return true;
  const seen = new Set<string>([reviewerId]);
  for (let inviter = reviewer.invitedBy; inviter && !seen.has(inviter); inviter = byId.get(inviter)?.invitedBy ?? null) {
    if (editors.has(inviter)) return true;
    seen.add(inviter);
  }
  return false;
}

export interface DecisionFacts {
  status: PlanStatus;
  currentRevision: number;
  decision: Decision;
  /** The revision the reviewer looked at. */
  revision: number;
  reviewerId: string;
  /** The plan's author and everyone who created a revision of it. */
  editors: ReadonlySet<string>;
  /** Asked only for approvals, and only when the reviewer is not an editor. */
  related: () => boolean;
}

export type DecisionVerdict =
  | { kind: 'own-plan' }
  | { kind: 'related-reviewer' }
  | { kind: 'not-submitted'; status: PlanStatus }
  | { kind: 'stale'; currentRevision: number }
  | { kind: 'decide'; revision: number; status: PlanStatus; approvedRevision: number | null; commentOnRevision: boolean };

/** Nobody reviews a plan they wrote or edited, nor approves one of someone too close to them. */
export function judgeDecision(facts: DecisionFacts): DecisionVerdict {
  if (facts.editors.has(facts.reviewerId)) return { kind: 'own-plan' };
  if (facts.decision === 'approve' && facts.related()) return { kind: 'related-reviewer' };
  const status = nextStatus(facts.status, facts.decision);
  if (!status) return { kind: 'not-submitted', status: facts.status };
  if (facts.currentRevision !== facts.revision) return { kind: 'stale', currentRevision: facts.currentRevision };
  return {
    kind: 'decide',
    revision: facts.currentRevision,
    status,
    approvedRevision: facts.decision === 'approve' ? facts.currentRevision : null,
    // A return's comment also goes on the revision as a plan-wide comment.
    commentOnRevision: facts.decision === 'return',
  };
}

export interface DecisionRequest {
  decision: Decision;
  comment?: string;
  teachingNote?: string;
  /** The revision the reviewer looked at; the plan's current one when not said. */
  revision?: number;
}

/**
 * What a decision records: the comment when there is one, the teaching note and the hashes of the
 * approved document and report only with an approval (`hash` is asked only then).
 */
export function decisionRecord(request: DecisionRequest, currentRevision: number, hash: () => { documentHash: string; reportHash: string }) {
  const approving = request.decision === 'approve';
  return {
    decision: request.decision,
    comment: request.comment || null,
    teachingNote: approving ? request.teachingNote || null : null,
    ...(approving ? hash() : { documentHash: null, reportHash: null }),
    revision: request.revision ?? currentRevision,
  };
}

export type ReopenVerdict = { kind: 'not-approved'; status: PlanStatus } | { kind: 'reopen'; revision: number; status: PlanStatus };

/** Editing an approved plan starts revision n+1, a copy of the approved one, as a draft. */
export function judgeReopen(status: PlanStatus, currentRevision: number): ReopenVerdict {
  const next = nextStatus(status, 'reopen');
  if (!next) return { kind: 'not-approved', status };
  return { kind: 'reopen', revision: currentRevision + 1, status: next };
}


export interface WithdrawFacts {
  status: PlanStatus;
  currentRevision: number;
  authorId: string;
  actorId: string;
  actorIsAdmin: boolean;
}

export type WithdrawVerdict =
  | { kind: 'not-author' }
  | { kind: 'not-submitted'; status: PlanStatus }
  | { kind: 'withdraw'; revision: number; status: PlanStatus };

/**
 * Only the plan's author (or an admin) takes a submitted plan back before a decision; it returns
 * to a draft at the same revision, which no one has decided.
 */
export function judgeWithdraw(facts: WithdrawFacts): WithdrawVerdict {
  if (facts.authorId !== facts.actorId && !facts.actorIsAdmin) return { kind: 'not-author' };
  const status = nextStatus(facts.status, 'withdraw');
  if (!status) return { kind: 'not-submitted', status: facts.status };
  return { kind: 'withdraw', revision: facts.currentRevision, status };
}

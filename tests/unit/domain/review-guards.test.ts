import { describe, expect, it } from 'vitest';
import { PLAN_STATUSES, nextStatus } from '@/lib/domain/plan-status';
import { decisionRecord, judgeDecision, judgeReopen, judgeSave, judgeWithdraw, judgeSubmit, mayStoreReport, relatedToEditors, type DecisionFacts } from '@/lib/domain/review-guards';

describe('judgeSubmit', () => {
  const base = { status: 'draft' as const, currentRevision: 3, blockers: 0, decided: false };

  it('submits the current revision of a draft or returned plan', () => {
    expect(judgeSubmit(base)).toEqual({ kind: 'submit', revision: 3, copy: false, status: 'submitted' });
    expect(judgeSubmit({ ...base, status: 'returned' })).toEqual({ kind: 'submit', revision: 3, copy: false, status: 'submitted' });
  });

  it('refuses every state the transition table gives no submit', () => {
    for (const status of PLAN_STATUSES.filter((s) => nextStatus(s, 'submit') === null)) {
      expect(judgeSubmit({ ...base, status })).toEqual({ kind: 'not-submittable', status });
    }
    expect(judgeSubmit({ ...base, status: 'approved' }).kind).toBe('not-submittable');
  });

  it('is stale when a save landed after the checked revision, before looking at blockers', () => {
    expect(judgeSubmit({ ...base, checkedRevision: 2, blockers: 4 })).toEqual({ kind: 'stale', revision: 3 });
    expect(judgeSubmit({ ...base, checkedRevision: 3 }).kind).toBe('submit');
  });

  it('is blocked by any blocker, keeping a decided revision\'s report as it was', () => {
    expect(judgeSubmit({ ...base, blockers: 1 })).toEqual({ kind: 'blocked', storeReport: true });
    expect(judgeSubmit({ ...base, status: 'returned', blockers: 1, decided: true })).toEqual({ kind: 'blocked', storeReport: false });
  });

  it('copies a decided (returned, unchanged) revision into the next one', () => {
    expect(judgeSubmit({ ...base, status: 'returned', decided: true })).toEqual({ kind: 'submit', revision: 4, copy: true, status: 'submitted' });
  });
});

describe('judgeDecision', () => {
  const facts = (over: Partial<DecisionFacts> = {}): DecisionFacts => ({
    status: 'submitted', currentRevision: 2, decision: 'approve', revision: 2, reviewerId: 'rev', editors: new Set(['lead']), related: () => false, ...over,
  });

  it('approves or returns the submitted revision', () => {
    expect(judgeDecision(facts())).toEqual({ kind: 'decide', revision: 2, status: 'approved', approvedRevision: 2, commentOnRevision: false });
    expect(judgeDecision(facts({ decision: 'return' }))).toEqual({ kind: 'decide', revision: 2, status: 'returned', approvedRevision: null, commentOnRevision: true });
  });

  it('refuses an author or editor first, whatever the state', () => {
    expect(judgeDecision(facts({ reviewerId: 'lead', status: 'draft' }))).toEqual({ kind: 'own-plan' });
    expect(judgeDecision(facts({ reviewerId: 'lead', decision: 'return' }))).toEqual({ kind: 'own-plan' });
  });

  it('refuses a related reviewer an approval, but lets them return, and asks only when approving', () => {
    expect(judgeDecision(facts({ related: () => true }))).toEqual({ kind: 'related-reviewer' });
    const asked: string[] = [];
    const verdict = judgeDecision(facts({ decision: 'return', related: () => (asked.push('x'), true) }));
    expect(verdict.kind).toBe('decide');
    expect(asked).toEqual([]);
  });

  it('refuses a plan that is not submitted, and a stale revision', () => {
    for (const status of ['draft', 'returned', 'approved'] as const) expect(judgeDecision(facts({ status }))).toEqual({ kind: 'not-submitted', status });
    expect(judgeDecision(facts({ revision: 1 }))).toEqual({ kind: 'stale', currentRevision: 2 });
  });
});

describe('judgeReopen', () => {
  it('starts the next revision as a draft, only from approved', () => {
    expect(judgeReopen('approved', 5)).toEqual({ kind: 'reopen', revision: 6, status: 'draft' });
    for (const status of ['draft', 'submitted', 'returned'] as const) expect(judgeReopen(status, 5)).toEqual({ kind: 'not-approved', status });
  });
});

describe('relatedToEditors', () => {
  const people = [
    { id: 'admin', email: 'boss@example.test', invitedBy: null },
    { id: 'second', email: 'other@example.test', invitedBy: 'admin' },
    { id: 'third', email: 'third@example.test', invitedBy: 'second' },
    { id: 'alias', email: 'Boss+review@example.test', invitedBy: null },
    { id: 'loop-a', email: 'a@example.test', invitedBy: 'loop-b' },
    { id: 'loop-b', email: 'b@example.test', invitedBy: 'loop-a' },
    { id: 'stranger', email: 'stranger@example.test', invitedBy: null },
  ];

  it('follows the invitation chain up to any editor', () => {
    expect(relatedToEditors(people, 'second', new Set(['admin']))).toBe(true);
    expect(relatedToEditors(people, 'third', new Set(['admin']))).toBe(true);
    expect(relatedToEditors(people, 'admin', new Set(['third']))).toBe(false);
  });

  it('treats a shared mailbox as the same person', () => {
    expect(relatedToEditors(people, 'alias', new Set(['admin']))).toBe(true);
  });

  it('ends on an invitation loop and on an unknown reviewer', () => {
    expect(relatedToEditors(people, 'loop-a', new Set(['stranger']))).toBe(false);
    expect(relatedToEditors(people, 'nobody', new Set(['admin']))).toBe(false);
  });
});

describe('judgeWithdraw', () => {
  const facts = { status: 'submitted' as const, currentRevision: 3, authorId: 'lead', actorId: 'lead', actorIsAdmin: false };
  it('the author or an admin takes a submitted plan back to a draft at the same revision', () => {
    expect(judgeWithdraw(facts)).toEqual({ kind: 'withdraw', revision: 3, status: 'draft' });
    expect(judgeWithdraw({ ...facts, actorId: 'admin', actorIsAdmin: true })).toEqual({ kind: 'withdraw', revision: 3, status: 'draft' });
  });
  it('refuses anyone else, and any plan not waiting for review', () => {
    expect(judgeWithdraw({ ...facts, actorId: 'other lead' })).toEqual({ kind: 'not-author' });
    for (const status of ['draft', 'returned', 'approved'] as const) expect(judgeWithdraw({ ...facts, status })).toEqual({ kind: 'not-submitted', status });
  });
});

describe('judgeSave', () => {
  it('makes revision n+1 of a draft or returned plan, keeping its state', () => {
    expect(judgeSave({ status: 'draft', currentRevision: 2, expectedRevision: 2 })).toEqual({ kind: 'save', revision: 3, status: 'draft' });
    expect(judgeSave({ status: 'returned', currentRevision: 4, expectedRevision: 4 })).toEqual({ kind: 'save', revision: 5, status: 'returned' });
  });

  it('refuses every state the transition table gives no save, before looking at the revision', () => {
    for (const status of PLAN_STATUSES.filter((s) => nextStatus(s, 'save') === null)) {
      expect(judgeSave({ status, currentRevision: 2, expectedRevision: 1 })).toEqual({ kind: 'not-editable' });
    }
    expect(judgeSave({ status: 'submitted', currentRevision: 2, expectedRevision: 2 }).kind).toBe('not-editable');
  });

  it('is stale when the revision edited from is not the current one', () => {
    expect(judgeSave({ status: 'draft', currentRevision: 3, expectedRevision: 2 })).toEqual({ kind: 'stale' });
  });
});

describe('mayStoreReport', () => {
  const base = { status: 'draft' as const, currentRevision: 2, revision: 2, decided: false };
  it('lets a fresh report replace the stored one only on the current, editable, undecided revision', () => {
    expect(mayStoreReport(base)).toBe(true);
    expect(mayStoreReport({ ...base, revision: 1 })).toBe(false);
    expect(mayStoreReport({ ...base, status: 'submitted' })).toBe(false);
    expect(mayStoreReport({ ...base, status: 'approved' })).toBe(false);
    expect(mayStoreReport({ ...base, status: 'returned', decided: true })).toBe(false);
    expect(mayStoreReport({ ...base, status: 'returned' })).toBe(true);
  });
});

describe('decisionRecord', () => {
  const hashes = { documentHash: 'd'.repeat(64), reportHash: 'r'.repeat(64) };
  it('records the hashes and teaching note with an approval only', () => {
    expect(decisionRecord({ decision: 'approve', teachingNote: 'Note the bond.' }, 3, () => hashes)).toEqual({ decision: 'approve', comment: null, teachingNote: 'Note the bond.', ...hashes, revision: 3 });
    let asked = false;
    const returned = decisionRecord({ decision: 'return', comment: 'Show the neutral.', teachingNote: 'ignored', revision: 2 }, 3, () => {
      asked = true;
      return hashes;
    });
    expect(returned).toEqual({ decision: 'return', comment: 'Show the neutral.', teachingNote: null, documentHash: null, reportHash: null, revision: 2 });
    expect(asked).toBe(false);
  });

  it('stores an empty comment or note as none', () => {
    expect(decisionRecord({ decision: 'approve', comment: '', teachingNote: '' }, 1, () => hashes)).toMatchObject({ comment: null, teachingNote: null });
  });
});

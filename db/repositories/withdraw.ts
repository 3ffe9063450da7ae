/**
 * Withdrawing a submitted plan before a decision: under the plan's row lock, `judgeWithdraw`
 * says whether it may happen; the plan goes back to a draft at the same revision, with an audit event.
 */
import { Transaction } from 'sequelize';
import type { PlanStatus } from '@/lib/domain/plan-status';
import { judgeWithdraw } from '@/lib/domain/review-guards';
import type { Db } from '@db/connection';
import { recordEvent } from './audit';

export type WithdrawOutcome = { kind: 'ok'; revision: number } | { kind: 'not-found' } | { kind: 'not-author' } | { kind: 'not-submitted'; status: PlanStatus };

export async function withdrawPlan(db: Db, organizationId: number, planId: number, actor: { id: string; isAdmin: boolean }): Promise<WithdrawOutcome> {
  return db.sequelize.transaction({ isolationLevel: Transaction.ISOLATION_LEVELS.READ_COMMITTED }, async (transaction) => {
    const plan = await db.models.Plan.findOne({ where: { id: planId, organizationId }, lock: transaction.LOCK.UPDATE, transaction });
    if (!plan) return { kind: 'not-found' as const };
    const verdict = judgeWithdraw({ status: plan.status, currentRevision: plan.currentRevision, authorId: plan.authorId, actorId: actor.id, actorIsAdmin: actor.isAdmin });
    if (verdict.kind !== 'withdraw') return verdict;
    await plan.update({ status: verdict.status, submittedAt: null }, { transaction });
    await recordEvent(db, { organizationId, actorId: actor.id, action: 'plan.withdrawn', subjectType: 'plan', subjectId: planId, details: { revision: verdict.revision } }, transaction);
    return { kind: 'ok' as const, revision: verdict.revision };
  });
}

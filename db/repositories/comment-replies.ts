/** Replies to review comments: one level deep, on the comment's own plan, inside the organisation. */
import type { Transaction } from 'sequelize';
import type { Db } from '@db/connection';
import { recordEvent } from './audit';

/** The comment answered, as the work done beside the reply (its mail) needs it. */
export interface RepliedComment {
  id: number;
  authorId: string;
  body: string;
}

export type ReplyOutcome =
  | { kind: 'ok'; id: number }
  | { kind: 'plan-not-found' }
  /** No comment with that id on this plan (another plan's and another organisation's look the same). */
  | { kind: 'no-comment' }
  /** The comment answered is itself a reply: threads are one level deep. */
  | { kind: 'nested'; replyTo: number };

/**
 * Adds `body` as a reply to comment `replyTo` of the plan, on the plan's current revision; `then`
 * runs in the same transaction (the mail to the comment's writer), so all of it happens or none.
 */
export async function addReply(
  db: Db,
  organizationId: number,
  planId: number,
  authorId: string,
  input: { replyTo: number; body: string },
  then?: (transaction: Transaction, answered: RepliedComment, revision: number) => Promise<void>,
): Promise<ReplyOutcome> {
  return db.sequelize.transaction(async (transaction) => {
    const plan = await db.models.Plan.findOne({ where: { id: planId, organizationId }, attributes: ['id', 'currentRevision'], transaction });
    if (!plan) return { kind: 'plan-not-found' };
    const answered = await db.models.PlanComment.findOne({ where: { id: input.replyTo, planId }, transaction });
    if (!answered) return { kind: 'no-comment' };
    if (answered.replyTo !== null) return { kind: 'nested', replyTo: answered.replyTo };
    const row = await db.models.PlanComment.create({ planId, revision: plan.currentRevision, elementId: null, authorId, body: input.body, resolvedAt: null, resolvedBy: null, replyTo: answered.id }, { transaction });
    await recordEvent(db, { organizationId, actorId: authorId, action: 'comment.replied', subjectType: 'plan', subjectId: planId, details: { commentId: row.id, replyTo: answered.id, revision: plan.currentRevision } }, transaction);
    await then?.(transaction, { id: answered.id, authorId: answered.authorId, body: answered.body }, plan.currentRevision);
    return { kind: 'ok', id: row.id };
  });
}

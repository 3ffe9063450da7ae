/**
 * Comments on a plan, for the comments endpoints, the review page's comment form and the plan
 * page's resolve and reply forms: one function per operation, each returning the comment as stored.
 */
import { getDb } from '@db/connection';
import { addReply } from '@db/repositories/comment-replies';
import { addComment, listComments, setCommentResolved, type CommentView } from '@db/repositories/revisions';
import type { Person } from '@/lib/domain/people';
import type { z } from 'zod';
import type { commentBody } from '@/lib/schemas/api';
import { AppError } from '@/lib/server/errors';
import { assertCan } from '@/lib/server/guards';
import { queueMail } from '@/lib/server/mail';
import { replyMessage } from '@/lib/server/mail-messages';
import { publicUrl } from '@/lib/server/settings';
import { requirePlan } from './review';

async function storedComment(person: Person, planId: number, commentId: number): Promise<CommentView> {
  const comment = (await listComments(getDb(), person.organizationId, planId))?.find((c) => c.id === commentId);
  if (!comment) throw new AppError('NOT_FOUND');
  return comment;
}

/**
 * Adds a comment on the current revision, pinned to one of its nodes or links when `elementId` is
 * given, or a reply under comment `replyTo` of this plan (one level deep; its writer gets a mail).
 */
export async function commentOnPlan(person: Person, planId: number, input: z.infer<typeof commentBody>, requestUrl?: URL): Promise<CommentView> {
  assertCan(person, 'plan.comment');
  if (input.replyTo) return storedComment(person, planId, await replyToComment(person, planId, { replyTo: input.replyTo, body: input.body }, requestUrl));
  const plan = await requirePlan(person, planId);
  const elementId = input.elementId ?? null;
  const known = new Set([...plan.document.nodes.map((n) => n.id), ...plan.document.links.map((l) => l.id)]);
  if (elementId && !known.has(elementId)) {
    throw new AppError('VALIDATION', { issues: [{ path: 'elementId', message: `no node or link with id "${elementId}" in revision ${plan.currentRevision}` }] });
  }
  const commentId = await addComment(getDb(), person.organizationId, planId, person.id, { elementId, body: input.body, revision: plan.currentRevision });
  if (commentId === null) throw new AppError('NOT_FOUND');
  return storedComment(person, planId, commentId);
}

/** Resolves a comment (the crew lead fixed it) or opens it again. */
export async function resolveComment(person: Person, planId: number, commentId: number, resolved: boolean): Promise<CommentView> {
  assertCan(person, 'comment.resolve');
  if (!(await setCommentResolved(getDb(), person.organizationId, planId, commentId, person.id, resolved))) throw new AppError('NOT_FOUND');
  return storedComment(person, planId, commentId);
}

/**
 * The reply goes under the comment on the plan's current revision, and the comment's writer is told
 * by mail when someone else answered (in the same transaction, so a reply never goes without its mail).
 */
async function replyToComment(person: Person, planId: number, input: { replyTo: number; body: string }, requestUrl?: URL): Promise<number> {
  const db = getDb();
  const outcome = await addReply(db, person.organizationId, planId, person.id, input, async (transaction, answered, revision) => {
    if (answered.authorId === person.id) return;
    const writer = await db.models.User.findOne({ where: { id: answered.authorId, organizationId: person.organizationId }, attributes: ['email', 'disabled'], transaction });
    const plan = await db.models.Plan.findByPk(planId, { attributes: ['title'], transaction });
    if (!writer || writer.disabled || !plan) return;
    const ref = { id: planId, title: plan.title, revision, organizationId: person.organizationId };
    await queueMail([replyMessage(writer.email, ref, person.name, answered.body, input.body, publicUrl(requestUrl))], transaction);
  });
  switch (outcome.kind) {
    case 'ok':
      return outcome.id;
    case 'plan-not-found':
      throw new AppError('NOT_FOUND');
    case 'no-comment':
      throw new AppError('VALIDATION', { issues: [{ path: 'replyTo', message: `no comment ${input.replyTo} on this plan` }] });
    case 'nested':
      throw new AppError('VALIDATION', { issues: [{ path: 'replyTo', message: `comment ${input.replyTo} is itself a reply; answer comment ${outcome.replyTo}, which starts its thread` }] });
  }
}

/**
 * Comments on a plan, for the comments endpoints, the review page's comment form and the plan
 * page's resolve buttons: one function per operation, each returning the comment as stored.
 */
import { getDb } from '@db/connection';
import { addComment, listComments, setCommentResolved, type CommentView } from '@db/repositories/revisions';
import type { Person } from '@/lib/domain/people';
import type { z } from 'zod';
import type { commentBody } from '@/lib/schemas/api';
import { AppError } from '@/lib/server/errors';
import { assertCan } from '@/lib/server/guards';
import { requirePlan } from './review';

async function storedComment(person: Person, planId: number, commentId: number): Promise<CommentView> {
  const comment = (await listComments(getDb(), person.organizationId, planId))?.find((c) => c.id === commentId);
  if (!comment) throw new AppError('NOT_FOUND');
  return comment;
}

/** Adds a comment on the current revision, pinned to one of its nodes or links when `elementId` is given. */
export async function commentOnPlan(person: Person, planId: number, input: z.infer<typeof commentBody>): Promise<CommentView> {
  assertCan(person, 'plan.comment');
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

import { getDb } from '@db/connection';
import { getPlan } from '@db/repositories/plans';
import { addComment, listComments } from '@db/repositories/revisions';
import { commentBody } from '@/lib/schemas/api';
import { replyToComment } from '@/lib/server/comment-replies';
import { AppError } from '@/lib/server/errors';
import { requireRole, requireUser } from '@/lib/server/guards';
import { endpoint, json, pathId, readJson } from '@/lib/server/http';

export const GET = endpoint(async (ctx) => {
  const person = requireUser(ctx);
  const comments = await listComments(getDb(), person.organizationId, pathId(ctx, 'id'));
  if (!comments) throw new AppError('NOT_FOUND');
  return json({ comments });
});

/**
 * Adds a comment on the current revision, pinned to one of its nodes or links when `elementId` is
 * given, or a reply under comment `replyTo` of this plan (one level deep; its writer gets a mail).
 */
export const POST = endpoint(async (ctx) => {
  const person = requireRole(ctx, 'reviewer', 'admin', 'crew_lead');
  const id = pathId(ctx, 'id');
  const body = await readJson(ctx, commentBody, 64 * 1024);
  const db = getDb();
  if (body.replyTo) {
    const replyId = await replyToComment(person, id, { replyTo: body.replyTo, body: body.body }, ctx.url);
    return json({ comment: (await listComments(db, person.organizationId, id))!.find((c) => c.id === replyId) }, 201);
  }
  const plan = await getPlan(db, person.organizationId, id);
  if (!plan) throw new AppError('NOT_FOUND');
  const elementId = body.elementId ?? null;
  const known = new Set([...plan.document.nodes.map((n) => n.id), ...plan.document.links.map((l) => l.id)]);
  if (elementId && !known.has(elementId)) {
    throw new AppError('VALIDATION', { issues: [{ path: 'elementId', message: `no node or link with id "${elementId}" in revision ${plan.currentRevision}` }] });
  }
  const commentId = await addComment(db, person.organizationId, id, person.id, { elementId, body: body.body, revision: plan.currentRevision });
  if (commentId === null) throw new AppError('NOT_FOUND');
  const comments = (await listComments(db, person.organizationId, id))!;
  return json({ comment: comments.find((c) => c.id === commentId) }, 201);
});

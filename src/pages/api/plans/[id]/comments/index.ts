import { getDb } from '@db/connection';
import { listComments } from '@db/repositories/revisions';
import { commentBody } from '@/lib/schemas/api';
import { AppError } from '@/lib/server/errors';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, pathId, readJson } from '@/lib/server/http';
import { commentOnPlan } from '@/lib/server/services/comments';

export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'plan.view');
  const comments = await listComments(getDb(), person.organizationId, pathId(ctx, 'id'));
  if (!comments) throw new AppError('NOT_FOUND');
  return json({ comments });
});

/**
 * Adds a comment on the current revision, pinned to one of its nodes or links when `elementId` is
 * given, or a reply under comment `replyTo` of this plan (one level deep; its writer gets a mail).
 */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'plan.comment');
  const id = pathId(ctx, 'id');
  const body = await readJson(ctx, commentBody, 64 * 1024);
  return json({ comment: await commentOnPlan(person, id, body, ctx.url) }, 201);
});

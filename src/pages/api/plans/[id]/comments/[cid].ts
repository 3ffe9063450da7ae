import { resolveCommentBody } from '@/lib/schemas/api';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, pathId, readJson } from '@/lib/server/http';
import { resolveComment } from '@/lib/server/services/comments';

/** Resolves a comment (the crew lead fixed it) or opens it again: `{resolved}`. */
export const PATCH = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'comment.resolve');
  const id = pathId(ctx, 'id');
  const commentId = pathId(ctx, 'cid', 'commentId');
  const body = await readJson(ctx, resolveCommentBody, 4 * 1024);
  return json({ comment: await resolveComment(person, id, commentId, body.resolved) });
});

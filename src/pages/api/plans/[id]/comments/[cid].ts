import { getDb } from '@db/connection';
import { listComments, setCommentResolved } from '@db/repositories/revisions';
import { resolveCommentBody } from '@/lib/schemas/api';
import { AppError } from '@/lib/server/errors';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, pathId, readJson } from '@/lib/server/http';

/** Resolves a comment (the crew lead fixed it) or opens it again: `{resolved}`. */
export const PATCH = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'comment.resolve');
  const id = pathId(ctx, 'id');
  const commentId = pathId(ctx, 'cid', 'commentId');
  const body = await readJson(ctx, resolveCommentBody, 4 * 1024);
  const db = getDb();
  if (!(await listComments(db, person.organizationId, id))) throw new AppError('NOT_FOUND');
  if (!(await setCommentResolved(db, person.organizationId, id, commentId, person.id, body.resolved))) throw new AppError('NOT_FOUND');
  return json({ comment: (await listComments(db, person.organizationId, id))!.find((c) => c.id === commentId) });
});

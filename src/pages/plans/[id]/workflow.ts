import { readForm } from '@/lib/server/forms';
import type { APIRoute } from 'astro';
import { getDb } from '@db/connection';
import { setCommentResolved } from '@db/repositories/revisions';
import { hasRole } from '@/lib/server/guards';
import { commentBody, idParam } from '@/lib/schemas/api';
import { replyToComment } from '@/lib/server/comment-replies';
import { AppError } from '@/lib/server/errors';
import { reopen, submitForReview, withdraw } from '@/lib/server/workflow';

/**
 * The plan page's workflow buttons post here as plain forms (no JavaScript needed): submit,
 * withdraw a submitted one, reopen an approved plan, resolve or reopen a comment, reply to one. Answers with a redirect back to the plan
 * carrying what happened; the same rules as the JSON API apply, through the same functions.
 */
export const POST: APIRoute = async (ctx) => {
  const person = ctx.locals.person!;
  const id = idParam.safeParse(ctx.params.id);
  if (!id.success) return new Response('Plan not found', { status: 404 });
  const back = (query: string) => ctx.redirect(`/plans/${id.data}?${query}`, 303);
  const form = await readForm(ctx.request);
  if (form instanceof Response) return form;
  const action = String(form.get('action') ?? '');
  try {
    if (action === 'submit' && hasRole(person, 'crew_lead', 'admin')) {
      await submitForReview(person, id.data, ctx.url);
      return back('notice=submitted');
    }
    if (action === 'reopen' && hasRole(person, 'crew_lead', 'admin')) {
      await reopen(person, id.data);
      return back('notice=reopened');
    }
    if (action === 'withdraw' && hasRole(person, 'crew_lead', 'admin')) {
      await withdraw(person, id.data);
      return back('notice=withdrawn');
    }
    if ((action === 'resolve' || action === 'unresolve') && hasRole(person, 'crew_lead', 'admin', 'reviewer')) {
      const commentId = idParam.safeParse(form.get('commentId'));
      if (!commentId.success || !(await setCommentResolved(getDb(), person.organizationId, id.data, commentId.data, person.id, action === 'resolve'))) throw new AppError('NOT_FOUND');
      return back(`notice=${action === 'resolve' ? 'resolved' : 'reopened-comment'}`);
    }
    if (action === 'reply' && hasRole(person, 'crew_lead', 'admin', 'reviewer')) {
      const parsed = commentBody.safeParse({ body: String(form.get('body') ?? ''), replyTo: String(form.get('replyTo') ?? '') });
      if (!parsed.success || !parsed.data.replyTo) throw new AppError('VALIDATION');
      const replyId = await replyToComment(person, id.data, { replyTo: parsed.data.replyTo, body: parsed.data.body }, ctx.url);
      return ctx.redirect(`/plans/${id.data}?notice=replied#comment-${replyId}`, 303);
    }
    return back('problem=ROLE_REQUIRED');
  } catch (error) {
    if (error instanceof AppError) return back(`problem=${error.code}`);
    throw error;
  }
};

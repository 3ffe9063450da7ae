import { readForm } from '@/lib/server/forms';
import type { APIRoute } from 'astro';
import type { Person } from '@/lib/domain/people';
import { commentBody, idParam } from '@/lib/schemas/api';
import { AppError } from '@/lib/server/errors';
import { commentOnPlan, resolveComment } from '@/lib/server/services/comments';
import { reopen, submitForReview, withdraw } from '@/lib/server/services/review';

/**
 * The plan page's workflow buttons post here as plain forms (no JavaScript needed): submit,
 * withdraw a submitted one, reopen an approved plan, resolve or reopen a comment, reply to one. Each calls the
 * same service as the JSON API (src/lib/server/services) and answers with a redirect back to the
 * plan carrying what happened.
 */
const ACTIONS: Record<string, (person: Person, planId: number, form: FormData, url: URL) => Promise<string>> = {
  submit: async (person, planId, _form, url) => (await submitForReview(person, planId, url), 'submitted'),
  reopen: async (person, planId) => (await reopen(person, planId), 'reopened'),
  withdraw: async (person, planId) => (await withdraw(person, planId), 'withdrawn'),
  resolve: async (person, planId, form) => (await resolveComment(person, planId, commentId(form), true), 'resolved'),
  unresolve: async (person, planId, form) => (await resolveComment(person, planId, commentId(form), false), 'reopened-comment'),
  reply: async (person, planId, form, url) => {
    const parsed = commentBody.safeParse({ body: String(form.get('body') ?? ''), replyTo: String(form.get('replyTo') ?? '') });
    if (!parsed.success || !parsed.data.replyTo) throw new AppError('VALIDATION');
    return `replied#comment-${(await commentOnPlan(person, planId, parsed.data, url)).id}`;
  },
};

function commentId(form: FormData): number {
  const parsed = idParam.safeParse(form.get('commentId'));
  if (!parsed.success) throw new AppError('NOT_FOUND');
  return parsed.data;
}

export const POST: APIRoute = async (ctx) => {
  const person = ctx.locals.person!;
  const id = idParam.safeParse(ctx.params.id);
  if (!id.success) return new Response('Plan not found', { status: 404 });
  const back = (query: string) => ctx.redirect(`/plans/${id.data}?${query}`, 303);
  const form = await readForm(ctx.request);
  if (form instanceof Response) return form;
  const name = String(form.get('action') ?? '');
  if (!Object.hasOwn(ACTIONS, name)) return back('problem=ROLE_REQUIRED');
  const action = ACTIONS[name];
  try {
    return back(`notice=${await action(person, id.data, form, ctx.url)}`);
  } catch (error) {
    if (error instanceof AppError) return back(`problem=${error.code}`);
    throw error;
  }
};

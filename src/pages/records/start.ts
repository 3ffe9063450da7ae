import type { APIRoute } from 'astro';
import { idParam } from '@/lib/schemas/api';
import { AppError } from '@/lib/server/errors';
import { readForm } from '@/lib/server/forms';
import { openRecord } from '@/lib/server/services/records';

/**
 * "Start field record" on an approved plan's page posts here as a plain form; it calls the same
 * service as POST /api/plans/:id/records. Answers with the field screen, or back to the plan with why not.
 */
export const POST: APIRoute = async (ctx) => {
  const person = ctx.locals.person!;
  const form = await readForm(ctx.request);
  if (form instanceof Response) return form;
  const planId = idParam.safeParse(form.get('planId'));
  if (!planId.success) return new Response('Plan not found', { status: 404 });
  try {
    const record = await openRecord(person, planId.data, {});
    return ctx.redirect(`/records/${record.id}`, 303);
  } catch (error) {
    if (error instanceof AppError) return ctx.redirect(`/plans/${planId.data}?problem=${error.code}`, 303);
    throw error;
  }
};

import type { APIRoute } from 'astro';
import { idParam } from '@/lib/schemas/api';
import { AppError } from '@/lib/server/errors';
import { openRecord, RECORD_WRITERS } from '@/lib/server/field-records';
import { hasRole } from '@/lib/server/guards';
import { readForm } from '@/lib/server/forms';

/**
 * "Start field record" on an approved plan's page posts here as a plain form; the same rules as
 * POST /api/plans/:id/records apply. Answers with the field screen, or back to the plan with why not.
 */
export const POST: APIRoute = async (ctx) => {
  const person = ctx.locals.person!;
  const form = await readForm(ctx.request);
  if (form instanceof Response) return form;
  const planId = idParam.safeParse(form.get('planId'));
  if (!planId.success) return new Response('Plan not found', { status: 404 });
  if (!hasRole(person, ...RECORD_WRITERS)) return ctx.redirect(`/plans/${planId.data}?problem=ROLE_REQUIRED`, 303);
  try {
    const record = await openRecord(person, planId.data, {}, new Date().toISOString().slice(0, 10));
    return ctx.redirect(`/records/${record.id}`, 303);
  } catch (error) {
    if (error instanceof AppError) return ctx.redirect(`/plans/${planId.data}?problem=${error.code}`, 303);
    throw error;
  }
};

/** Request bodies and query strings of the HTTP API; the islands' forms use the same schemas. */
import { z } from 'zod';
import { PLAN_STATUSES } from '@/lib/domain/plan-status';
import { ROLES } from '@/lib/domain/roles';
import { newPassword } from './password';
import { planDocumentSchema } from './plan';

const email = z
  .string({ required_error: 'is required', invalid_type_error: 'must be a string' })
  .trim()
  .min(3, 'must be an e-mail address')
  .max(254, 'must be at most 254 characters')
  .email('must be an e-mail address');

export const loginBody = z.object({
  email,
  password: z.string({ required_error: 'is required', invalid_type_error: 'must be a string' }).min(1, 'is required').max(1024, 'is too long'),
});

export { PASSWORD_MIN, newPassword } from './password';

export const setPasswordBody = z.object({
  token: z.string({ required_error: 'is required' }).min(10, 'is not a valid link').max(200, 'is not a valid link'),
  password: newPassword,
});

const title = z
  .string({ required_error: 'is required', invalid_type_error: 'must be a string' })
  .trim()
  .min(1, 'must not be empty')
  .max(200, 'must be at most 200 characters');

export const createPlanBody = z.object({
  title,
  structure: z.string({ invalid_type_error: 'must be a string' }).trim().max(200, 'must be at most 200 characters').optional(),
  document: planDocumentSchema,
});

export const savePlanBody = z.object({
  expectedRevision: z.number({ required_error: 'is required', invalid_type_error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1'),
  title: title.optional(),
  structure: z.string({ invalid_type_error: 'must be a string' }).trim().max(200, 'must be at most 200 characters').optional(),
  document: planDocumentSchema,
});

export const PLAN_SORTS = ['updated', 'title', 'status', 'blockers', 'warnings', 'structure', 'created', 'submitted'] as const;
export type PlanSort = (typeof PLAN_SORTS)[number];

/** Dates of change and finding counts list newest/most first; names and the queue's submission time ascend. */
export function defaultSortDir(sort: PlanSort): 'asc' | 'desc' {
  return ['updated', 'created', 'blockers', 'warnings'].includes(sort) ? 'desc' : 'asc';
}

export const listPlansQuery = z.object({
  status: z.enum(PLAN_STATUSES, { errorMap: () => ({ message: `must be one of ${PLAN_STATUSES.join(', ')}` }) }).optional(),
  q: z.string().trim().max(200, 'must be at most 200 characters').optional(),
  sort: z.enum(PLAN_SORTS, { errorMap: () => ({ message: `must be one of ${PLAN_SORTS.join(', ')}` }) }).default('updated'),
  dir: z.enum(['asc', 'desc'], { errorMap: () => ({ message: 'must be asc or desc' }) }).optional(),
  page: z.coerce.number({ invalid_type_error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1').max(100000, 'is too large').default(1),
  pageSize: z.coerce.number({ invalid_type_error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1').max(100, 'must be at most 100').default(20),
});
export type ListPlansQuery = z.infer<typeof listPlansQuery>;

export const createUserBody = z.object({
  email,
  name: z.string({ required_error: 'is required', invalid_type_error: 'must be a string' }).trim().min(1, 'must not be empty').max(200, 'must be at most 200 characters'),
  role: z.enum(ROLES, { errorMap: () => ({ message: `must be one of ${ROLES.join(', ')}` }) }),
});

export const updateUserBody = z
  .object({
    role: z.enum(ROLES, { errorMap: () => ({ message: `must be one of ${ROLES.join(', ')}` }) }).optional(),
    disabled: z.boolean({ invalid_type_error: 'must be true or false' }).optional(),
  })
  .refine((v) => v.role !== undefined || v.disabled !== undefined, { message: 'give role or disabled', path: ['role'] });

/**
 * An id or revision number from a path, query or form: digits only, so `0x1`, `1e0`, ` 1`, `1 `
 * or `%31` are refused rather than read as 1.
 */
export const idParam = z.unknown().transform((value, ctx): number => {
  const text = typeof value === 'number' && Number.isSafeInteger(value) ? String(value) : value;
  if (typeof text !== 'string' || !/^[1-9][0-9]{0,9}$/.test(text)) {
    ctx.addIssue({ code: 'custom', message: 'must be a whole number of 1 or more, written in digits' });
    return z.NEVER;
  }
  const n = Number(text);
  if (n > 2 ** 31) {
    ctx.addIssue({ code: 'custom', message: 'is too large' });
    return z.NEVER;
  }
  return n;
});

const text = (max: number) => z.string({ invalid_type_error: 'must be a string' }).trim().max(max, `must be at most ${max} characters`);

export const reviewBody = z
  .object({
    decision: z.enum(['approve', 'return'], { errorMap: () => ({ message: 'must be approve or return' }) }),
    comment: text(4000).optional(),
    teachingNote: text(4000).optional(),
    /** The revision the reviewer read; a decision on an older one is refused. */
    revision: z.number({ invalid_type_error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1').optional(),
  })
  .superRefine((v, ctx) => {
    if (v.decision === 'return' && !v.comment) ctx.addIssue({ code: 'custom', path: ['comment'], message: 'is required when returning a plan: say what to fix' });
  });

export const commentBody = z
  .object({
    body: text(4000).pipe(z.string().min(1, 'must not be empty')),
    elementId: z.string({ invalid_type_error: 'must be a string' }).trim().min(1, 'must not be empty').max(64, 'is too long').nullable().optional(),
    /** The id of the comment this one answers (a reply); absent or null for a new comment. */
    replyTo: z.union([z.null(), idParam]).optional(),
  })
  .superRefine((v, ctx) => {
    if (v.replyTo && v.elementId) ctx.addIssue({ code: 'custom', path: ['elementId'], message: 'must be left out of a reply: a reply sits under the comment it answers' });
  });

export const resolveCommentBody = z.object({ resolved: z.boolean({ required_error: 'is required', invalid_type_error: 'must be true or false' }) });

export const forgotPasswordBody = z.object({ email });

/** Grounding sets on the wire (the issue's field names), their request bodies and list query. */
import { z } from 'zod';
import { CLAMP_KINDS, CONNECTIONS, isCalendarDate, SET_STATUSES } from '@/lib/domain/equipment';
import { CABLE_SIZES } from './plan';

const oneOf = <T extends readonly [string, ...string[]]>(values: T) =>
  z.enum(values as unknown as [T[number], ...T[number][]], {
    errorMap: (issue) => ({ message: issue.code === 'invalid_type' && issue.received === 'undefined' ? 'is required' : `must be one of ${values.join(', ')}` }),
  });
const num = () => z.number({ invalid_type_error: 'must be a number', required_error: 'is required' }).finite('must be a finite number');
export const calendarDate = () =>
  z
    .string({ invalid_type_error: 'must be a date (YYYY-MM-DD)', required_error: 'is required' })
    .refine(isCalendarDate, 'must be a real date written YYYY-MM-DD');
const text = (max: number) => z.string({ invalid_type_error: 'must be a string' }).trim().max(max, `must be at most ${max} characters`);

export const setTag = z
  .string({ invalid_type_error: 'must be a string', required_error: 'is required' })
  .trim()
  .min(1, 'must not be empty')
  .max(64, 'must be at most 64 characters')
  .regex(/^[\w.\-/#]+$/, 'may hold only letters, digits and . - / # _');

/** The record fields of a set (what an admin enters and what a CSV row carries). */
export const setFields = {
  tag: setTag,
  description: text(200).default(''),
  cable: oneOf(CABLE_SIZES),
  lengthM: num().positive('must be greater than 0').max(1000, 'must be at most 1000 m'),
  clampKind: oneOf(CLAMP_KINDS),
  clampKa: num().positive('must be greater than 0').max(500, 'must be at most 500 kA'),
  clampCycles: num().positive('must be greater than 0').max(300, 'must be at most 300 cycles'),
  connection: oneOf(CONNECTIONS),
  inServiceOn: calendarDate(),
  notes: text(5000).nullable().optional(),
};

const statusRules = <T extends z.ZodTypeAny>(schema: T) =>
  schema.superRefine((v: { status?: string; statusReason?: string | null }, ctx) => {
    if (v.status && v.status !== 'in-service' && !v.statusReason) ctx.addIssue({ code: 'custom', path: ['statusReason'], message: `is required when the status is ${v.status}` });
  });

export const createSetBody = statusRules(
  z.object({
    ...setFields,
    status: oneOf(SET_STATUSES).default('in-service'),
    statusReason: text(500).nullable().optional(),
    lastTestedOn: calendarDate().nullable().optional(),
  }),
);
export type CreateSetBody = z.infer<typeof createSetBody>;

export const patchSetBody = statusRules(
  z
    .object({
      tag: setTag,
      description: text(200),
      cable: oneOf(CABLE_SIZES),
      lengthM: setFields.lengthM,
      clampKind: oneOf(CLAMP_KINDS),
      clampKa: setFields.clampKa,
      clampCycles: setFields.clampCycles,
      connection: oneOf(CONNECTIONS),
      inServiceOn: calendarDate(),
      notes: text(5000).nullable(),
      status: oneOf(SET_STATUSES),
      statusReason: text(500).nullable(),
      /** Records that the set carried fault current on this date: it goes out of service until a passing test. */
      faultOn: calendarDate(),
    })
    .partial()
    .strict('has a field that cannot be changed here'),
);
export type PatchSetBody = z.infer<typeof patchSetBody>;

export const setTestBody = z.object({
  testedOn: calendarDate(),
  resistanceMilliohms: num().min(0, 'must be 0 or more').max(1e6, 'must be at most 1000000 milliohms'),
  limitMilliohms: num().positive('must be greater than 0').max(1e6, 'must be at most 1000000 milliohms').nullable().optional(),
  passed: z.boolean({ invalid_type_error: 'must be true or false' }).optional(),
  notes: text(5000).nullable().optional(),
});
export type SetTestBody = z.infer<typeof setTestBody>;

export const SET_SORTS = ['tag', 'cable', 'length', 'clamp', 'status', 'lastTested', 'due'] as const;
export type SetSort = (typeof SET_SORTS)[number];

export const listSetsQuery = z.object({
  status: oneOf(SET_STATUSES).optional(),
  due: z.enum(['overdue', 'soon'], { errorMap: () => ({ message: 'must be overdue or soon' }) }).optional(),
  /** Sets due within this many days from today (overdue ones included). */
  dueWithinDays: z.coerce.number({ invalid_type_error: 'must be a number' }).int('must be a whole number').min(0, 'must be 0 or more').max(3650, 'must be at most 3650').optional(),
  q: z.string().trim().max(64, 'must be at most 64 characters').optional(),
  sort: z.enum(SET_SORTS, { errorMap: () => ({ message: `must be one of ${SET_SORTS.join(', ')}` }) }).default('tag'),
  dir: z.enum(['asc', 'desc'], { errorMap: () => ({ message: 'must be asc or desc' }) }).default('asc'),
  page: z.coerce.number({ invalid_type_error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1').max(100000, 'is too large').default(1),
  pageSize: z.coerce.number({ invalid_type_error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1').max(500, 'must be at most 500').default(50),
});
export type ListSetsQuery = z.infer<typeof listSetsQuery>;

export const settingsBody = z
  .object({
    testIntervalMonths: z.number({ invalid_type_error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1').max(120, 'must be at most 120'),
    resistanceLimits: z.array(
      z.object({
        cable: oneOf(CABLE_SIZES),
        maxLengthM: setFields.lengthM,
        limitMilliohms: num().positive('must be greater than 0').max(1e6, 'must be at most 1000000 milliohms'),
      }),
      { invalid_type_error: 'must be a list' },
    ).max(200, 'must have at most 200 rows'),
  })
  .partial();
export type SettingsBody = z.infer<typeof settingsBody>;

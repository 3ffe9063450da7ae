/** Bodies and queries of the field-record API; the field screen sends the same shapes. */
import { z } from 'zod';
import { isCalendarDate } from '@/lib/domain/equipment';
import { BRIEFING_ITEMS } from '@/lib/domain/field-record/types';

const str = (max: number) => z.string({ required_error: 'is required', invalid_type_error: 'must be a string' }).trim().max(max, `must be at most ${max} characters`);
const nonEmpty = (max: number) => str(max).pipe(z.string().min(1, 'must not be empty'));

const FIRST_YEAR = 2000;
const LAST_YEAR = 2999;
const inFieldYears = (date: Date) => date.getUTCFullYear() >= FIRST_YEAR && date.getUTCFullYear() <= LAST_YEAR;

const common = {
  clientId: z.string({ required_error: 'is required', invalid_type_error: 'must be a string' }).uuid('must be a UUID made on the device'),
  at: z
    .string({ required_error: 'is required', invalid_type_error: 'must be a string' })
    .datetime({ offset: true, message: 'must be an ISO time such as 2026-05-04T07:30:00Z' })
    // The shape allows year 0 and, with an offset, year 10000 (a 500 from the database); neither is a day of field work.
    .refine((v) => inFieldYears(new Date(v)), `must be a time in the years ${FIRST_YEAR} to ${LAST_YEAR} (is the device's clock right?)`),
};

export const entryBody = z.discriminatedUnion(
  'type',
  [
    z.object({ ...common, type: z.literal('sign-on'), people: z.array(nonEmpty(32), { invalid_type_error: 'must be a list' }).max(50, 'at most 50 people').default([]), visitors: z.array(nonEmpty(200), { invalid_type_error: 'must be a list' }).max(50, 'at most 50 visitors').default([]) })
,
    z.object({ ...common, type: z.literal('briefing'), item: z.enum(BRIEFING_ITEMS, { errorMap: () => ({ message: `must be one of ${BRIEFING_ITEMS.join(', ')}` }) }), by: nonEmpty(200) }),
    z.object({
      ...common,
      type: z.literal('voltage-test'),
      detector: nonEmpty(200),
      detectorCheckedBefore: z.boolean({ required_error: 'is required', invalid_type_error: 'must be true or false' }),
      detectorCheckedAfter: z.boolean({ required_error: 'is required', invalid_type_error: 'must be true or false' }),
      // A key is a phase letter (up to 200 characters), with its conductor id (up to 64) when two share it.
      phases: z.record(nonEmpty(270), z.enum(['absent', 'present'], { errorMap: () => ({ message: 'must be absent or present' }) })).refine((p) => Object.keys(p).length > 0, 'name at least one phase'),
    }),
    z.object({ ...common, type: z.literal('install'), link: nonEmpty(64), setTag: nonEmpty(80), groundEndFirst: z.literal(true, { errorMap: () => ({ message: 'must be true: the ground end goes on first' }) }) }),
    z.object({ ...common, type: z.literal('remove'), link: nonEmpty(64) }),
    z.object({ ...common, type: z.literal('deviation'), text: nonEmpty(4000) }),
    z.object({ ...common, type: z.literal('note'), text: nonEmpty(4000) }),
  ],
  { errorMap: (issue, ctx) => ({ message: issue.code === 'invalid_union_discriminator' ? 'must be one of sign-on, briefing, voltage-test, install, remove, deviation, note' : ctx.defaultError }) },
).superRefine((v, ctx) => {
  if (v.type === 'sign-on' && v.people.length + v.visitors.length === 0) ctx.addIssue({ code: 'custom', path: ['people'], message: 'name at least one person or visitor' });
});
export type EntryInput = z.infer<typeof entryBody>;

export const RECORD_STATUSES = ['open', 'closed'] as const;
export type RecordStatus = (typeof RECORD_STATUSES)[number];

export const createRecordBody = z.object({
  // A real day, not only its shape: 2026-02-30 reached the database as a 500.
  workDate: z.string({ invalid_type_error: 'must be a string' }).refine(isCalendarDate, 'must be a real date such as 2026-05-04').optional(),
  location: str(200).optional(),
  clearanceRef: str(120).optional(),
  detector: str(200).optional(),
});

export const listRecordsQuery = z.object({
  status: z.enum(RECORD_STATUSES, { errorMap: () => ({ message: 'must be open or closed' }) }).optional(),
  page: z.coerce.number({ invalid_type_error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1').max(100000, 'is too large').default(1),
  pageSize: z.coerce.number({ invalid_type_error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1').max(100, 'must be at most 100').default(20),
});

export const photoSizeQuery = z.object({
  size: z.enum(['thumb', 'display', 'original'], { errorMap: () => ({ message: 'must be thumb, display or original' }) }).default('display'),
});

export const photoCaption = str(300).optional();
/** The fields of a photo upload besides the file; clientId makes a repeated upload answer the stored photo. */
export const photoFormFields = z.object({
  caption: photoCaption,
  clientId: common.clientId.optional(),
});


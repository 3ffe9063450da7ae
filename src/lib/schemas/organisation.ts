/** The organisation's general settings (admin): time zone, paper size, default units. */
import { z } from 'zod';
import { isTimeZone } from '@/lib/time-format';

export const PAPER_SIZES = ['letter', 'a4'] as const;
export type PaperSize = (typeof PAPER_SIZES)[number];
export const UNIT_SYSTEMS = ['imperial', 'metric'] as const;

export const organisationSettingsBody = z.object({
  timeZone: z
    .string({ required_error: 'is required', invalid_type_error: 'must be a time zone name' })
    .trim()
    .min(1, 'is required')
    .max(64, 'must be at most 64 characters')
    .refine(isTimeZone, 'must be a time zone name such as America/Chicago'),
  paperSize: z.enum(PAPER_SIZES, { errorMap: () => ({ message: 'must be letter or a4' }) }),
  units: z.enum(UNIT_SYSTEMS, { errorMap: () => ({ message: 'must be imperial or metric' }) }),
});
export type OrganisationSettingsBody = z.infer<typeof organisationSettingsBody>;

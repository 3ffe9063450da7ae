/** Request bodies of the practice API; the practice pages use the same schemas. */
import { z } from 'zod';
import { EXERCISE_KINDS } from '@/lib/domain/practice/types';
import { CABLE_SIZES, planDocumentSchema } from './plan';

const elementId = z.string({ invalid_type_error: 'must be a string' }).trim().min(1, 'must not be empty').max(64, 'must be at most 64 characters');
const positiveInt = () => z.number({ required_error: 'is required', invalid_type_error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1').max(2 ** 31, 'is too large');
const text = (max: number) => z.string({ required_error: 'is required', invalid_type_error: 'must be a string' }).trim().max(max, `must be at most ${max} characters`);

export const createExerciseBody = z.object({
  planId: positiveInt(),
  revision: positiveInt(),
  kind: z.enum(EXERCISE_KINDS, { errorMap: () => ({ message: `must be one of ${EXERCISE_KINDS.join(', ')}` }) }),
  removeLinks: z.array(elementId, { invalid_type_error: 'must be a list of link ids' }).max(50, 'must be at most 50 links').default([]),
  changeLinks: z
    .array(
      z.object({
        id: elementId,
        cable: z.enum(CABLE_SIZES, { errorMap: () => ({ message: `must be one of ${CABLE_SIZES.join(', ')}` }) }),
      }),
      { invalid_type_error: 'must be a list of {id, cable}' },
    )
    .max(50, 'must be at most 50 links')
    .default([]),
  prompt: text(2000).min(1, 'must not be empty'),
  teachingNote: text(4000).optional(),
  /** Published unless said otherwise: making an exercise is publishing it (issue #15). */
  published: z.boolean({ invalid_type_error: 'must be true or false' }).default(true),
});
export type CreateExerciseBody = z.infer<typeof createExerciseBody>;

export const proposeBody = z.object({ planId: positiveInt(), revision: positiveInt().optional() });

export const publishBody = z.object({ published: z.boolean({ required_error: 'is required', invalid_type_error: 'must be true or false' }) });

/** The answer's shape depends on the exercise kind; the endpoint picks the schema. */
export const attemptBody = z.object({ answer: z.unknown() });
export const findAnswer = z.object({ elements: z.array(elementId, { required_error: 'is required', invalid_type_error: 'must be a list of element ids' }).max(500, 'must be at most 500 elements') }, { required_error: 'is required', invalid_type_error: 'must be an object' });
export const fixAnswer = z.object({ document: planDocumentSchema }, { required_error: 'is required', invalid_type_error: 'must be an object' });
export const numbersAnswer = z.object({ choice: z.number({ required_error: 'is required', invalid_type_error: 'must be a number' }).int('must be a whole number').min(0, 'must be 0 to 3').max(3, 'must be 0 to 3') }, { required_error: 'is required', invalid_type_error: 'must be an object' });

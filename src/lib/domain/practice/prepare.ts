/** An exercise of a given kind, ready to store: the built gap plus, for numbers, its question. */
import type { PlanDocument } from '@/lib/schemas/plan';
import { buildExercise, type BuildResult } from './modify';
import { bodyCurrentQuestion, cableRatingQuestion } from './numbers';
import type { ExerciseKind, Modifications } from './types';

export type PrepareResult = BuildResult | { ok: false; reason: 'no-figure' };

/**
 * Builds the exercise and, for numbers, asks about the first swapped cable's rating, or the
 * tolerable body current when no cable was swapped; refuses when four distinct choices cannot be made.
 */
export function prepareExercise(original: PlanDocument, kind: ExerciseKind, mods: Modifications): PrepareResult {
  const built = buildExercise(original, mods);
  if (!built.ok || kind !== 'numbers') return built;
  const { document, key } = built.exercise;
  const changed = mods.changeLinks[0];
  const question = changed ? cableRatingQuestion(document, key.linkIds[changed.id]) : bodyCurrentQuestion(document);
  if (!question) return { ok: false, reason: 'no-figure' };
  return { ok: true, exercise: { ...built.exercise, key: { ...key, numbers: question } } };
}

import { getDb } from '@db/connection';
import { progressCells } from '@db/repositories/practice';
import { idParam } from '@/lib/schemas/api';
import { publishBody } from '@/lib/schemas/practice';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, parseWith, readJson } from '@/lib/server/http';
import { exerciseJson, publishExercise, visibleExercise } from '@/lib/server/practice';

/** One exercise. A learner never receives the answer: no removed links, planted findings or original plan. */
export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'practice.view');
  const exercise = await visibleExercise(person, parseWith(idParam, ctx.params.id));
  const mine = (await progressCells(getDb(), person.organizationId, person.id)).find((c) => c.exerciseId === exercise.id);
  return json({ exercise: exerciseJson(person, exercise, mine) });
});

/** `{published}`: publish or withdraw an exercise (reviewer, admin). */
export const PATCH = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'practice.manage');
  const id = parseWith(idParam, ctx.params.id);
  const body = await readJson(ctx, publishBody, 1024);
  return json({ exercise: exerciseJson(person, await publishExercise(person, id, body.published)) });
});

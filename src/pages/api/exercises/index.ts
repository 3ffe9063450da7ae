import { getDb } from '@db/connection';
import { listExercises, progressCells } from '@db/repositories/practice';
import { createExerciseBody } from '@/lib/schemas/practice';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, readJson } from '@/lib/server/http';
import { exerciseJson, isStaff, makeExercise, staffJson } from '@/lib/server/practice';

/** The organisation's exercises: all of them for reviewers and admins, published ones (no answers) for everyone else. */
export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'practice.view');
  const db = getDb();
  const [exercises, cells] = await Promise.all([
    listExercises(db, person.organizationId, { publishedOnly: !isStaff(person) }),
    progressCells(db, person.organizationId, person.id),
  ]);
  return json({ items: exercises.map((e) => exerciseJson(person, e, cells.find((c) => c.exerciseId === e.id))) });
});

/** Makes an exercise from an approved revision: 201, or 409 EXERCISE_NO_GAP when the change plants no blocker. */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'practice.manage');
  const body = await readJson(ctx, createExerciseBody, 64 * 1024);
  const exercise = await makeExercise(person, body);
  return json({ exercise: staffJson(exercise) }, 201, { location: `/api/exercises/${exercise.id}` });
});

/**
 * The practice workflow between the endpoints and the repository: make an exercise from an
 * approved revision, show it without its answer to learners, grade an attempt with the checker.
 */
import { getDb } from '@db/connection';
import * as repo from '@db/repositories/practice';
import type { ExerciseRecord, ProgressCell } from '@db/repositories/practice';
import type { Person } from '@/lib/domain/people';
import { can } from '@/lib/domain/permissions';
import { assertCan } from '@/lib/server/guards';
import { gradeFind, gradeFix, gradeNumbers, prepareExercise } from '@/lib/domain/practice';
import type { CreateExerciseBody } from '@/lib/schemas/practice';
import { findAnswer, fixAnswer, numbersAnswer } from '@/lib/schemas/practice';
import { z } from 'zod';
import { checkDocument, proposeInPool } from './checking';
import { AppError } from './errors';
import { parseWith } from './http';

/** Whoever makes exercises sees answers, unpublished exercises and everyone's progress. */
export const isStaff = (person: Person) => can(person.role, 'practice.manage');

async function approvedOr404(person: Person, planId: number, revision?: number) {
  const db = getDb();
  const approved = await repo.findApprovedRevision(db, person.organizationId, planId, revision);
  if (approved) return approved;
  if (await repo.planExists(db, person.organizationId, planId)) throw new AppError('REVISION_NOT_APPROVED');
  throw new AppError('NOT_FOUND');
}

export async function makeExercise(person: Person, body: CreateExerciseBody): Promise<ExerciseRecord> {
  const approved = await approvedOr404(person, body.planId, body.revision);
  const modifications = { removeLinks: body.removeLinks, changeLinks: body.changeLinks };
  const built = prepareExercise(approved.document, body.kind, modifications);
  if (!built.ok && built.reason === 'invalid') throw new AppError('VALIDATION', { issues: built.issues });
  if (!built.ok && built.reason === 'no-figure') throw new AppError('VALIDATION', { issues: [{ path: 'kind', message: 'four distinct choices cannot be computed for this plan; pick find or fix' }] });
  if (!built.ok) throw new AppError('EXERCISE_NO_GAP');
  const { document, key, gap } = built.exercise;
  return repo.createExercise(getDb(), person.organizationId, {
    planId: approved.planId,
    revision: approved.revision,
    kind: body.kind,
    gap,
    modifications,
    document,
    key,
    prompt: body.prompt,
    teachingNote: body.teachingNote?.trim() || null,
    published: body.published,
    createdBy: person.id,
  });
}

export async function propose(person: Person, planId: number, revision?: number) {
  const approved = await approvedOr404(person, planId, revision);
  return { planId: approved.planId, revision: approved.revision, proposals: await proposeInPool(approved.document) };
}

/** Publishes an exercise to learners or withdraws it; another organisation's is NOT_FOUND. */
export async function publishExercise(person: Person, id: number, published: boolean): Promise<ExerciseRecord> {
  assertCan(person, 'practice.manage');
  if (!(await repo.setPublished(getDb(), person.organizationId, id, published))) throw new AppError('NOT_FOUND');
  return visibleExercise(person, id);
}

/** The exercise an apprentice (or crew lead) may see, or 404: published, this organisation. */
export async function visibleExercise(person: Person, id: number): Promise<ExerciseRecord> {
  const exercise = await repo.getExercise(getDb(), person.organizationId, id);
  if (!exercise || (!exercise.published && !isStaff(person))) throw new AppError('NOT_FOUND');
  return exercise;
}

export interface MyRecord {
  attempts: number;
  best: number | null;
  latest: number | null;
}

const recordOf = (cell?: ProgressCell): MyRecord => ({ attempts: cell?.attempts ?? 0, best: cell?.best ?? null, latest: cell?.latest ?? null });

/**
 * What a learner receives: the prompt, the modified drawing and, for numbers, the four choices.
 * Never the plan it came from, the modifications, the planted findings, the teaching note or the gap.
 */
export function learnerJson(exercise: ExerciseRecord, mine?: ProgressCell) {
  const q = exercise.key.numbers;
  return {
    id: exercise.id,
    kind: exercise.kind,
    prompt: exercise.prompt,
    document: exercise.document,
    ...(exercise.kind === 'numbers' && q ? { question: { text: q.question, unit: q.unit, choices: q.choices.map((c) => c.label) } } : {}),
    createdAt: exercise.createdAt.toISOString(),
    mine: recordOf(mine),
  };
}

/** Everything, for reviewers and admins. */
export function staffJson(exercise: ExerciseRecord) {
  return {
    ...learnerJson(exercise),
    planId: exercise.planId,
    revision: exercise.revision,
    planTitle: exercise.planTitle,
    gap: exercise.gap,
    modifications: exercise.modifications,
    planted: exercise.key.planted,
    answerElements: exercise.key.elements,
    linkIds: exercise.key.linkIds,
    ...(exercise.key.numbers ? { numbers: exercise.key.numbers } : {}),
    teachingNote: exercise.teachingNote,
    published: exercise.published,
    createdBy: { id: exercise.createdBy, name: exercise.createdByName },
  };
}

export function exerciseJson(person: Person, exercise: ExerciseRecord, mine?: ProgressCell) {
  return isStaff(person) ? staffJson(exercise) : learnerJson(exercise, mine);
}

/** The explanation after an attempt: each planted gap in the checker's own words, and the original. */
export function explanation(exercise: ExerciseRecord) {
  return {
    gaps: exercise.key.planted.map((f) => ({ rule: f.rule, elements: f.elements, message: f.message, basis: f.basis })),
    teachingNote: exercise.teachingNote,
    original: { planId: exercise.planId, revision: exercise.revision, title: exercise.planTitle, href: `/library/${exercise.planId}` },
    ...(exercise.key.numbers ? { numbers: { question: exercise.key.numbers.question, choices: exercise.key.numbers.choices.map((c) => c.label), correctIndex: exercise.key.numbers.correctIndex, reasons: exercise.key.numbers.reasons, basis: exercise.key.numbers.basis } } : {}),
  };
}

/** Parses the answer under the key `answer`, so every issue's path starts with it. */
const parseAnswer = <S extends z.ZodTypeAny>(schema: S, answer: unknown): z.infer<S> => parseWith(z.object({ answer: schema }), { answer }).answer;

/** The grade, and the answer as parsed: what is kept is what was graded, never the rest of the body. */
async function grade(exercise: ExerciseRecord, answer: unknown) {
  if (exercise.kind === 'find') {
    const parsed = parseAnswer(findAnswer, answer);
    const ids = new Set([...exercise.document.nodes.map((n) => n.id), ...exercise.document.links.map((l) => l.id)]);
    const unknown = parsed.elements.map((e, i) => ({ e, i })).filter(({ e }) => !ids.has(e));
    if (unknown.length) throw new AppError('VALIDATION', { issues: unknown.map(({ e, i }) => ({ path: `answer.elements[${i}]`, message: `no element "${e}" on this drawing` })) });
    return { graded: gradeFind(exercise.key, parsed.elements), answer: parsed };
  }
  if (exercise.kind === 'fix') {
    const parsed = parseAnswer(fixAnswer, answer);
    // Both checks in the worker pool, within its time budget: on the main thread a large drawing
    // from any apprentice stalled every other request for the length of its check.
    const [givenReport, fixedReport] = await Promise.all([checkDocument(exercise.document), checkDocument(parsed.document)]);
    const given = givenReport.findings.filter((f) => f.severity === 'blocker');
    return { graded: gradeFix(exercise.key, exercise.document, given, parsed.document, fixedReport), answer: parsed };
  }
  const parsed = parseAnswer(numbersAnswer, answer);
  return { graded: gradeNumbers(exercise.key, parsed.choice), answer: parsed };
}

/** Grades and keeps one attempt; returns the grade, the explanation and the updated record. */
export async function attempt(person: Person, id: number, answer: unknown) {
  const exercise = await visibleExercise(person, id);
  const { graded, answer: kept } = await grade(exercise, answer);
  const db = getDb();
  const saved = await repo.addAttempt(db, person.organizationId, { exerciseId: exercise.id, apprenticeId: person.id, answer: kept, score: graded.score, details: graded });
  const mine = (await repo.progressCells(db, person.organizationId, person.id)).find((c) => c.exerciseId === exercise.id);
  return {
    attempt: { id: saved.id, createdAt: saved.createdAt.toISOString() },
    score: graded.score,
    passed: graded.score === 100,
    found: graded.found,
    missed: graded.missed,
    wrong: graded.wrong,
    explanation: explanation(exercise),
    mine: recordOf(mine),
  };
}

/** The organisation's apprentices × exercises: attempts, best, latest, last attempt. */
export async function progress(person: Person) {
  const db = getDb();
  const [exercises, cells] = await Promise.all([repo.listExercises(db, person.organizationId, { publishedOnly: false }), repo.progressCells(db, person.organizationId)]);
  const people = await repo.practisingPeople(db, person.organizationId, [...new Set(cells.map((c) => c.apprenticeId))]);
  return {
    apprentices: people,
    exercises: exercises.map((e) => ({ id: e.id, kind: e.kind, gap: e.gap, prompt: e.prompt, planTitle: e.planTitle, published: e.published })),
    cells: cells.map((c) => ({ ...c, lastAt: c.lastAt.toISOString() })),
  };
}

const csvField = (value: unknown): string => {
  const text = value === null || value === undefined ? '' : String(value);
  // Quote fields with separators, and defuse spreadsheet formulas (a leading =, +, - or @).
  const safe = /^[=+\-@]/.test(text) ? `'${text}` : text;
  return /[",\n\r]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
};

/** Progress as CSV, one row per apprentice and exercise (exercises not tried show 0 attempts). */
export function progressCsv(data: Awaited<ReturnType<typeof progress>>): string {
  const rows = [['apprentice', 'exercise', 'kind', 'gap', 'plan', 'attempts', 'best', 'latest', 'last attempt (UTC)']];
  for (const a of data.apprentices) {
    for (const e of data.exercises) {
      const c = data.cells.find((x) => x.apprenticeId === a.id && x.exerciseId === e.id);
      rows.push([a.name, `#${e.id} ${e.prompt}`, e.kind, e.gap, e.planTitle, String(c?.attempts ?? 0), c ? String(c.best) : '', c ? String(c.latest) : '', c?.lastAt ?? '']);
    }
  }
  return rows.map((r) => r.map(csvField).join(',')).join('\r\n') + '\r\n';
}

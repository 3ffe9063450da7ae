/**
 * Practice exercises and attempts, always per organisation. An exercise keeps the modified plan
 * and its answer key as written at creation; the approved revision it came from is only read.
 */
import { Op } from 'sequelize';
import { rolesFor } from '@/lib/domain/permissions';
import type { AnswerKey, ExerciseKind, GapKind, Modifications } from '@/lib/domain/practice/types';
import type { PlanDocument } from '@/lib/schemas/plan';
import type { Db } from '@db/connection';
import type { PracticeExercise } from '@db/models/practice';
import { readStoredDocument } from './plans';
import { nameMap } from './review';

export interface ApprovedRevision {
  planId: number;
  revision: number;
  title: string;
  document: PlanDocument;
}

/** The approved revision (`revision`, or the plan's latest approved one), or null when there is none. */
export async function findApprovedRevision(db: Db, organizationId: number, planId: number, revision?: number): Promise<ApprovedRevision | null> {
  const plan = await db.models.Plan.findOne({ where: { id: planId, organizationId }, attributes: ['id', 'title', 'approvedRevision'] });
  const number = revision ?? plan?.approvedRevision;
  if (!plan || !number) return null;
  const decision = await db.models.PlanDecision.findOne({ where: { planId, revision: number, decision: 'approve' }, attributes: ['id'] });
  if (!decision) return null;
  const row = await db.models.PlanRevision.findOne({ where: { planId, number }, attributes: ['document'] });
  return row ? { planId, revision: number, title: plan.title, document: readStoredDocument(row.document) } : null;
}

/** Whether the plan exists in this organisation at all (to tell 404 from "not approved"). */
export async function planExists(db: Db, organizationId: number, planId: number): Promise<boolean> {
  return (await db.models.Plan.count({ where: { id: planId, organizationId } })) > 0;
}

export interface NewExercise {
  planId: number;
  revision: number;
  kind: ExerciseKind;
  gap: GapKind;
  modifications: Modifications;
  document: PlanDocument;
  key: AnswerKey;
  prompt: string;
  teachingNote: string | null;
  published: boolean;
  createdBy: string;
}

export interface ExerciseRecord extends NewExercise {
  id: number;
  planTitle: string;
  createdByName: string;
  createdAt: Date;
}

async function toRecords(db: Db, rows: PracticeExercise[]): Promise<ExerciseRecord[]> {
  const titles = new Map((await db.models.Plan.findAll({ where: { id: [...new Set(rows.map((r) => r.planId))] }, attributes: ['id', 'title'] })).map((p) => [p.id, p.title]));
  const names = await nameMap(db, rows.map((r) => r.createdBy));
  return rows.map((r) => ({
    id: r.id,
    planId: r.planId,
    revision: r.revision,
    planTitle: titles.get(r.planId) ?? '',
    kind: r.kind,
    gap: r.gap as GapKind,
    modifications: JSON.parse(r.modifications) as Modifications,
    document: readStoredDocument(r.document),
    key: JSON.parse(r.answerKey) as AnswerKey,
    prompt: r.prompt,
    teachingNote: r.teachingNote,
    published: r.published,
    createdBy: r.createdBy,
    createdByName: names.get(r.createdBy) ?? '',
    createdAt: r.createdAt,
  }));
}

export async function createExercise(db: Db, organizationId: number, input: NewExercise): Promise<ExerciseRecord> {
  const row = await db.models.PracticeExercise.create({
    organizationId,
    planId: input.planId,
    revision: input.revision,
    kind: input.kind,
    gap: input.gap,
    modifications: JSON.stringify(input.modifications),
    document: JSON.stringify(input.document),
    answerKey: JSON.stringify(input.key),
    prompt: input.prompt,
    teachingNote: input.teachingNote,
    published: input.published,
    createdBy: input.createdBy,
  });
  return (await toRecords(db, [row]))[0];
}

/** The organisation's exercises, newest first; `publishedOnly` for apprentices and crew leads. */
export async function listExercises(db: Db, organizationId: number, options: { publishedOnly: boolean }): Promise<ExerciseRecord[]> {
  const rows = await db.models.PracticeExercise.findAll({ where: { organizationId, ...(options.publishedOnly ? { published: true } : {}) }, order: [['createdAt', 'DESC'], ['id', 'DESC']] });
  return toRecords(db, rows);
}

export async function getExercise(db: Db, organizationId: number, id: number): Promise<ExerciseRecord | null> {
  const row = await db.models.PracticeExercise.findOne({ where: { id, organizationId } });
  return row ? (await toRecords(db, [row]))[0] : null;
}

/**
 * False only when the organisation has no such exercise. MariaDB counts changed rows, not matched
 * ones, so publishing a published exercise updates none and is told apart by looking it up.
 */
export async function setPublished(db: Db, organizationId: number, id: number, published: boolean): Promise<boolean> {
  const [count] = await db.models.PracticeExercise.update({ published }, { where: { id, organizationId } });
  return count > 0 || (await db.models.PracticeExercise.count({ where: { id, organizationId } })) > 0;
}

export interface NewAttempt {
  exerciseId: number;
  apprenticeId: string;
  answer: unknown;
  score: number;
  details: unknown;
}

export async function addAttempt(db: Db, organizationId: number, input: NewAttempt): Promise<{ id: number; createdAt: Date }> {
  const row = await db.models.PracticeAttempt.create({ organizationId, exerciseId: input.exerciseId, apprenticeId: input.apprenticeId, answer: JSON.stringify(input.answer), score: input.score, details: JSON.stringify(input.details) });
  return { id: row.id, createdAt: row.createdAt };
}

/** One apprentice's record on one exercise: best and latest are counted separately. */
export interface ProgressCell {
  apprenticeId: string;
  exerciseId: number;
  attempts: number;
  best: number;
  latest: number;
  lastAt: Date;
}

/** Attempt counts, best and latest scores per (apprentice, exercise), optionally for one apprentice. */
export async function progressCells(db: Db, organizationId: number, apprenticeId?: string): Promise<ProgressCell[]> {
  const rows = await db.models.PracticeAttempt.findAll({
    where: { organizationId, ...(apprenticeId ? { apprenticeId } : {}) },
    attributes: ['apprenticeId', 'exerciseId', 'score', 'createdAt', 'id'],
    order: [['createdAt', 'ASC'], ['id', 'ASC']],
  });
  const cells = new Map<string, ProgressCell>();
  for (const r of rows) {
    const k = `${r.apprenticeId}|${r.exerciseId}`;
    const cell = cells.get(k);
    if (!cell) cells.set(k, { apprenticeId: r.apprenticeId, exerciseId: r.exerciseId, attempts: 1, best: r.score, latest: r.score, lastAt: r.createdAt });
    else Object.assign(cell, { attempts: cell.attempts + 1, best: Math.max(cell.best, r.score), latest: r.score, lastAt: r.createdAt });
  }
  return [...cells.values()];
}

/** Who takes practice (active ones, and anyone of the organisation who has attempts), by name. */
export async function practisingPeople(db: Db, organizationId: number, withAttempts: string[]): Promise<{ id: string; name: string }[]> {
  const rows = await db.models.User.findAll({
    where: { organizationId, [Op.or]: [{ role: [...rolesFor('practice.take')], disabled: false }, { id: withAttempts }] },
    attributes: ['id', 'name'],
    order: [['name', 'ASC'], ['id', 'ASC']],
  });
  return rows.map((r) => ({ id: r.id, name: r.name }));
}

/** Progress summaries: an apprentice's record by kind of gap, and the reviewer's table order. */
import { GAP_KINDS, type GapKind } from './types';

export interface CellLike {
  apprenticeId: string;
  exerciseId: number;
  attempts: number;
  best: number;
  latest: number;
  lastAt: string | Date;
}

export interface GapProgress {
  gap: GapKind;
  exercises: number;
  tried: number;
  /** Exercises whose best score is 100. */
  passed: number;
}

/** Per kind of gap: how many exercises there are, how many were tried and how many passed (best 100). */
export function progressByGap(exercises: { id: number; gap: GapKind }[], cells: CellLike[]): GapProgress[] {
  return GAP_KINDS.map((gap) => {
    const ids = exercises.filter((e) => e.gap === gap).map((e) => e.id);
    const mine = cells.filter((c) => ids.includes(c.exerciseId));
    return { gap, exercises: ids.length, tried: mine.length, passed: mine.filter((c) => c.best === 100).length };
  }).filter((g) => g.exercises > 0);
}

/** The exercises to do next: never tried first, then tried but not passed; passed ones last out. */
export function nextExercises<E extends { id: number }>(exercises: E[], cells: CellLike[], limit = 5): E[] {
  const cell = (id: number) => cells.find((c) => c.exerciseId === id);
  const fresh = exercises.filter((e) => !cell(e.id));
  const retry = exercises.filter((e) => cell(e.id) && cell(e.id)!.best < 100);
  return [...fresh, ...retry].slice(0, limit);
}

export const PROGRESS_SORTS = ['name', 'attempts', 'best', 'last'] as const;
export type ProgressSort = (typeof PROGRESS_SORTS)[number];

export interface ProgressRow {
  id: string;
  name: string;
  attempts: number;
  /** Mean of the best scores over exercises tried; null when none. */
  meanBest: number | null;
  lastAt: string | null;
}

/** One row per apprentice with totals across exercises. */
export function progressRows(people: { id: string; name: string }[], cells: CellLike[]): ProgressRow[] {
  return people.map((p) => {
    const mine = cells.filter((c) => c.apprenticeId === p.id);
    const last = mine.map((c) => new Date(c.lastAt).toISOString()).sort().at(-1) ?? null;
    return { id: p.id, name: p.name, attempts: mine.reduce((n, c) => n + c.attempts, 0), meanBest: mine.length ? Math.round(mine.reduce((n, c) => n + c.best, 0) / mine.length) : null, lastAt: last };
  });
}

/** Sorts rows by a column; empty values go last either way, ties by name. */
export function sortProgressRows(rows: ProgressRow[], sort: ProgressSort, dir: 'asc' | 'desc'): ProgressRow[] {
  const value = (r: ProgressRow): string | number | null => (sort === 'name' ? r.name.toLowerCase() : sort === 'attempts' ? r.attempts : sort === 'best' ? r.meanBest : r.lastAt);
  const sign = dir === 'asc' ? 1 : -1;
  return [...rows].sort((a, b) => {
    const va = value(a);
    const vb = value(b);
    if (va === null || vb === null) return va === vb ? a.name.localeCompare(b.name) : va === null ? 1 : -1;
    return (va < vb ? -1 : va > vb ? 1 : 0) * sign || a.name.localeCompare(b.name);
  });
}

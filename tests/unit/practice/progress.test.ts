import { describe, expect, it } from 'vitest';
import { nextExercises, progressByGap, progressRows, sortProgressRows } from '@/lib/domain/practice';

const cell = (apprenticeId: string, exerciseId: number, best: number, latest: number, attempts: number, lastAt: string) => ({ apprenticeId, exerciseId, best, latest, attempts, lastAt });
const exercises = [
  { id: 1, gap: 'phase-ungrounded' as const },
  { id: 2, gap: 'phase-ungrounded' as const },
  { id: 3, gap: 'bucket-unbonded' as const },
  { id: 4, gap: 'cable-underrated' as const },
];

describe('progressByGap', () => {
  it('counts exercises, tried and passed (best 100) per kind of gap, leaving out kinds with none', () => {
    const cells = [cell('a', 1, 100, 40, 3, '2026-01-02T00:00:00Z'), cell('a', 2, 60, 60, 1, '2026-01-03T00:00:00Z'), cell('a', 3, 100, 100, 1, '2026-01-01T00:00:00Z')];
    expect(progressByGap(exercises, cells)).toEqual([
      { gap: 'phase-ungrounded', exercises: 2, tried: 2, passed: 1 },
      { gap: 'bucket-unbonded', exercises: 1, tried: 1, passed: 1 },
      { gap: 'cable-underrated', exercises: 1, tried: 0, passed: 0 },
    ]);
  });
});

describe('nextExercises', () => {
  it('offers untried exercises first, then those not yet passed; passed ones are done', () => {
    const cells = [cell('a', 1, 100, 0, 2, '2026-01-01T00:00:00Z'), cell('a', 2, 50, 50, 1, '2026-01-01T00:00:00Z')];
    expect(nextExercises(exercises, cells).map((e) => e.id)).toEqual([3, 4, 2]);
  });
});

describe('progress rows', () => {
  const people = [{ id: 'a', name: 'Ansel' }, { id: 'b', name: 'Bea' }, { id: 'c', name: 'Cato' }];
  const cells = [cell('a', 1, 100, 0, 2, '2026-01-05T00:00:00Z'), cell('a', 2, 50, 50, 1, '2026-01-01T00:00:00Z'), cell('b', 1, 90, 90, 5, '2026-01-02T00:00:00Z')];
  const rows = progressRows(people, cells);
  it('totals attempts, the mean of best scores and the last attempt per apprentice', () => {
    expect(rows).toEqual([
      { id: 'a', name: 'Ansel', attempts: 3, meanBest: 75, lastAt: '2026-01-05T00:00:00.000Z' },
      { id: 'b', name: 'Bea', attempts: 5, meanBest: 90, lastAt: '2026-01-02T00:00:00.000Z' },
      { id: 'c', name: 'Cato', attempts: 0, meanBest: null, lastAt: null },
    ]);
  });
  it.each([
    ['attempts', 'desc', ['b', 'a', 'c']],
    ['best', 'asc', ['a', 'b', 'c']],
    ['best', 'desc', ['b', 'a', 'c']],
    ['last', 'desc', ['a', 'b', 'c']],
    ['name', 'desc', ['c', 'b', 'a']],
  ] as const)('sorts by %s %s, empty values last', (sort, dir, order) => {
    expect(sortProgressRows(rows, sort, dir).map((r) => r.id)).toEqual(order);
  });
});

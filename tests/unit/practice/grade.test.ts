import { describe, expect, it } from 'vitest';
import { buildExercise, gradeFind, gradeFix, proposeRemovals } from '@/lib/domain/practice';
import type { PlanDocument, PlanLink } from '@/lib/schemas/plan';
import { bucket, crew } from './plans';

function exercise() {
  const built = buildExercise(bucket(), { removeLinks: ['jB'], changeLinks: [] });
  if (!built.ok) throw new Error(built.reason);
  return built.exercise;
}

describe('gradeFind', () => {
  const { key } = exercise();
  it('a perfect answer scores 100', () => {
    expect(gradeFind(key, key.elements)).toEqual({ score: 100, found: key.elements, missed: [], wrong: [] });
  });
  it('a partial answer scores the share found (Jaccard: found over key ∪ marked)', () => {
    expect(key.elements.length).toBeGreaterThan(1);
    const g = gradeFind(key, [key.elements[0]]);
    expect(g.found).toEqual([key.elements[0]]);
    expect(g.missed).toEqual(key.elements.slice(1));
    expect(g.score).toBe(Math.round(100 / key.elements.length));
  });
  it('wrong marks cost points, and a wrong-only answer scores 0', () => {
    expect(gradeFind(key, ['A', 'C'])).toMatchObject({ score: 0, found: [], wrong: ['A', 'C'] });
    expect(gradeFind(key, [...key.elements, 'A']).score).toBe(Math.round((100 * key.elements.length) / (key.elements.length + 1)));
  });
});

describe('gradeFix', () => {
  const ex = exercise();
  const given = ex.document;
  const blockers = ex.report.findings.filter((f) => f.severity === 'blocker');
  const withLink = (doc: PlanDocument, l: PlanLink): PlanDocument => ({ ...doc, links: [...doc.links, l] });
  const jumperB: PlanLink = { id: 'fixB', kind: 'jumper', from: 'B', to: 'CB', cable: '2/0', lengthM: 3 };

  it('the missing jumper put back passes with 100', () => {
    const g = gradeFix(ex.key, given, blockers, withLink(given, jumperB));
    expect(g).toMatchObject({ score: 100, missed: [], wrong: [] });
    expect(g.found.length).toBe(ex.key.planted.length);
  });
  it('nothing done misses every planted blocker', () => {
    expect(gradeFix(ex.key, given, blockers, given)).toMatchObject({ score: 0, found: [] });
  });
  it('a fix that removes the gap but adds another blocker fails', () => {
    const g = gradeFix(ex.key, given, blockers, withLink(given, { ...jumperB, cable: '4' }));
    expect(g.missed).toEqual([]);
    expect(g.wrong.map((f) => f.rule)).toContain('cable-below-minimum');
    expect(g.score).toBeLessThan(100);
  });
  it('names what a fix changed in the drawing\'s words, not by element ids', () => {
    const labelled: PlanDocument = { ...given, nodes: given.nodes.map((n) => ({ ...n, label: `Label of ${n.id}` })) };
    const cheat = { ...labelled, links: labelled.links.filter((l) => l.kind !== 'reach') };
    const messages = gradeFix(ex.key, labelled, blockers, cheat).wrong.filter((f) => f.rule === 'practice-changed-plan').map((f) => f.message);
    const reaches = labelled.links.filter((l) => l.kind === 'reach');
    expect(messages.length).toBe(reaches.length);
    for (const r of reaches) expect(messages).toContain(`The reach from Label of ${r.from} to Label of ${r.to} was removed; what a worker can touch stays as given.`);
  });
  it('deleting the worker or the reach line is not a fix', () => {
    const cheat = { ...given, nodes: given.nodes.filter((n) => n.id !== 'W1'), links: given.links.filter((l) => l.kind !== 'reach') };
    const g = gradeFix(ex.key, given, blockers, cheat);
    expect(g.wrong.some((f) => f.rule === 'practice-changed-plan' && f.elements.includes('W1'))).toBe(true);
    expect(g.score).toBeLessThan(100);
  });
});

describe('proposeRemovals', () => {
  it('offers gaps that each produce a blocker of a different kind, in the original\'s ids', () => {
    const proposals = proposeRemovals(crew());
    const gaps = proposals.map((p) => p.gap);
    expect(new Set(gaps).size).toBe(gaps.length);
    expect(gaps).toEqual(expect.arrayContaining(['phase-ungrounded', 'bucket-unbonded', 'mat-unbonded', 'cable-underrated', 'pole-ground-only']));
    const ids = new Set([...crew().nodes.map((n) => n.id), ...crew().links.map((l) => l.id)]);
    for (const p of proposals) {
      expect(p.findings.length).toBeGreaterThan(0);
      expect(p.findings.every((f) => f.severity === 'blocker' && f.elements.every((e) => ids.has(e)))).toBe(true);
    }
  });
});

import { describe, expect, it } from 'vitest';
import { checkPlan } from '@/lib/domain/checker';
import { applyModifications, buildExercise, neutralLinkIds } from '@/lib/domain/practice';
import { link, makePlan, bucketNodes, bucketLinks } from '../../helpers/plan-factory';
import { bucket, crew } from './plans';

const none = { removeLinks: [], changeLinks: [] };

describe('applyModifications', () => {
  it('removes and re-cables links in a copy and leaves the original as it was', () => {
    const original = bucket();
    const before = JSON.stringify(original);
    const applied = applyModifications(original, { removeLinks: ['jB'], changeLinks: [{ id: 'jA', cable: '4' }] });
    expect(applied.ok).toBe(true);
    if (!applied.ok) return;
    expect(applied.document.links.map((l) => l.id)).not.toContain('jB');
    expect(applied.document.links.find((l) => l.id === 'jA')).toMatchObject({ cable: '4' });
    expect(JSON.stringify(original)).toBe(before);
  });

  it('refuses reach lines, unknown ids, an unchanged cable and an empty change, naming the field', () => {
    const applied = applyModifications(bucket(), { removeLinks: ['rA', 'nope'], changeLinks: [{ id: 'jA', cable: '2/0' }, { id: 'rB', cable: '2' }] });
    expect(applied).toEqual({
      ok: false,
      issues: [
        { path: 'removeLinks[0]', message: 'no jumper or bond with id "rA" in this revision' },
        { path: 'removeLinks[1]', message: 'no jumper or bond with id "nope" in this revision' },
        { path: 'changeLinks[0].cable', message: 'is already 2/0; pick another size' },
        { path: 'changeLinks[1].id', message: 'no jumper with id "rB" in this revision' },
      ],
    });
    expect(applyModifications(bucket(), none)).toMatchObject({ ok: false, issues: [{ path: 'removeLinks' }] });
  });
});

describe('neutralLinkIds', () => {
  it('numbers the remaining links without a hole, so no original id and no gap shows', () => {
    const applied = applyModifications(bucket(), { removeLinks: ['jB'], changeLinks: [] });
    if (!applied.ok) throw new Error('not applied');
    const { document, linkIds } = neutralLinkIds(applied.document);
    expect(document.links.map((l) => l.id)).toEqual(['L1', 'L2', 'L3', 'L4', 'L5', 'L6', 'L7']);
    expect(linkIds).not.toHaveProperty('jB');
    const text = JSON.stringify(document);
    for (const l of bucket().links) expect(text).not.toContain(`"${l.id}"`);
    expect(document.title).toBe('Practice plan');
  });

  it('picks a prefix no node id starts with', () => {
    const plan = makePlan({ nodes: [...bucketNodes(), { id: 'L1', kind: 'hardware' }], links: bucketLinks() });
    expect(neutralLinkIds(plan).document.links[0].id).toBe('Lk1');
  });
});

describe('buildExercise', () => {
  it('plants the checker\'s blockers for a removed phase jumper and keys the answer on their elements', () => {
    const built = buildExercise(bucket(), { removeLinks: ['jB'], changeLinks: [] });
    if (!built.ok) throw new Error(built.reason);
    const { key, gap, document } = built.exercise;
    expect(gap).toBe('phase-ungrounded');
    expect(key.planted.map((f) => f.rule)).toContain('phase-ungrounded');
    expect(key.planted.every((f) => f.severity === 'blocker')).toBe(true);
    // The answer is every element the planted blockers name: phase B, and the worker who reaches it.
    expect(key.elements).toEqual([...new Set(key.planted.flatMap((f) => f.elements))].sort());
    expect(key.elements).toContain('B');
    // Every key element is on the drawing the apprentice sees.
    const ids = new Set([...document.nodes.map((n) => n.id), ...document.links.map((l) => l.id)]);
    expect(key.elements.every((e) => ids.has(e))).toBe(true);
  });

  it('refuses a change that leaves the plan without a new blocker: an exercise must have a gap', () => {
    const plan = makePlan({ nodes: bucketNodes(), links: [...bucketLinks(), link.jumper('jN2', 'CB', 'N')] });
    expect(checkPlan(plan).summary.blockers).toBe(0);
    expect(buildExercise(plan, { removeLinks: ['jN2'], changeLinks: [] })).toEqual({ ok: false, reason: 'no-gap' });
  });

  it.each([
    ['bucket jumper removed', { removeLinks: ['jBK'], changeLinks: [] }, 'bucket-unbonded', 'surface-outside-zone'],
    ['mat jumper removed', { removeLinks: ['jM'], changeLinks: [] }, 'mat-unbonded', 'surface-outside-zone'],
    ['neutral jumper removed, pole ground left', { removeLinks: ['jN'], changeLinks: [] }, 'pole-ground-only', 'pole-ground-relied'],
    ['No. 4 swapped in', { removeLinks: [], changeLinks: [{ id: 'jA', cable: '4' as const }] }, 'cable-underrated', 'cable-below-minimum'],
  ])('%s → gap %s with a %s blocker', (_name, mods, gap, rule) => {
    const built = buildExercise(crew(), mods);
    if (!built.ok) throw new Error(built.reason);
    expect(built.exercise.gap).toBe(gap);
    expect(built.exercise.key.planted.map((f) => f.rule)).toContain(rule);
  });
});

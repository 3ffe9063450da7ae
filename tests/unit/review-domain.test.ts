import { describe, expect, it } from 'vitest';
import { canonicalHash, canonicalJson } from '@/lib/domain/canonical-json';
import { fingerprint, sha256Hex } from '@/lib/server/fingerprint';
import { explainPlan } from '@/lib/domain/explain';
import { checkPlan } from '@/lib/domain/checker';
import { diffPlans } from '@/lib/domain/plan-diff';
import { diffInWords } from '@/lib/domain/plan-diff-words';
import { planTags } from '@/lib/domain/plan-tags';
import { bucketLinks, bucketNodes, makePlan } from '../helpers/plan-factory';
import type { PlanDocument } from '@/lib/schemas/plan';

const plan = (overrides: Partial<PlanDocument> = {}): PlanDocument =>
  makePlan({ nodes: bucketNodes(), links: bucketLinks(), ...(overrides as object) });

describe('canonical JSON', () => {
  it('ignores key order at every level and drops undefined', () => {
    expect(canonicalJson({ b: 1, a: { d: [1, { z: 1, y: 2 }], c: undefined } })).toBe('{"a":{"d":[1,{"y":2,"z":1}]},"b":1}');
    expect(fingerprint({ x: 1, y: 2 })).toBe(fingerprint({ y: 2, x: 1 }));
    expect(fingerprint({ x: 1 })).not.toBe(fingerprint({ x: 2 }));
  });

  it('hashes with the function it is given (the domain imports none)', () => {
    expect(canonicalHash({ b: 2, a: 1 }, (text) => `<${text}>`)).toBe('<{"a":1,"b":2}>');
    // SHA-256 of "abc", FIPS 180-2 appendix B.1 test vector.
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(fingerprint({ a: 1 })).toBe(sha256Hex('{"a":1}'));
  });
});

describe('plan diff', () => {
  it('names added, removed and changed elements and plan fields', () => {
    const before = plan();
    const after: PlanDocument = {
      ...before,
      title: 'Other title',
      nodes: [...before.nodes.filter((n) => n.id !== before.nodes[0].id), { id: 'NEW', kind: 'hardware' }],
      links: before.links.map((l, i) => (i === 0 && l.kind === 'jumper' ? { ...l, lengthM: l.lengthM + 1 } : l)),
    };
    const diff = diffPlans(before, after);
    expect(diff.added).toEqual([{ id: 'NEW', kind: 'hardware' }]);
    expect(diff.removed).toEqual([{ id: before.nodes[0].id, kind: before.nodes[0].kind }]);
    expect(diff.changed).toEqual([{ id: before.links[0].id, kind: before.links[0].kind, fields: ['lengthM'] }]);
    expect(diff.plan).toEqual(['title']);
    expect(diffPlans(before, before)).toEqual({ added: [], removed: [], changed: [], plan: [] });
  });
});

describe('plan tags', () => {
  it('reads the kind of work from the document', () => {
    expect(planTags(plan())).toEqual(['bucket work']);
    const climber = makePlan({ nodes: [{ id: 'CB', kind: 'cluster-bar' }, { id: 'P', kind: 'structure', material: 'wood' }, { id: 'W', kind: 'worker', standsOn: 'CB' }] });
    expect(planTags(climber)).toEqual(['climber', 'wood']);
    const ground = makePlan({ nodes: [{ id: 'E', kind: 'earth' }, { id: 'R', kind: 'ground-rod', lengthM: 2.4, diameterMm: 16, soilOhmM: 100 }, { id: 'W', kind: 'worker', standsOn: 'E' }, ...['A', 'B', 'C', 'D', 'F', 'G'].map((id) => ({ id, kind: 'phase' }))] });
    expect(planTags(ground)).toEqual(['ground worker', 'driven rod', 'double circuit']);
  });
});

describe('explain', () => {
  it('explains every element, with the zone and the check figures', () => {
    const doc = plan();
    const report = checkPlan(doc);
    const explained = explainPlan(doc, report);
    expect(explained.map((e) => e.id)).toEqual([...doc.nodes.map((n) => n.id), ...doc.links.map((l) => l.id)]);
    const phase = explained.find((e) => doc.nodes.find((n) => n.id === e.id)?.kind === 'phase')!;
    expect(phase.lines.join(' ')).toMatch(/In zone \d+ .* grounded/);
    const jumper = explained.find((e) => doc.links.find((l) => l.id === e.id)?.kind === 'jumper')!;
    expect(jumper.lines.join(' ')).toMatch(/Impedance [\d.]+ mΩ; fault duty [\d.]+ kA/);
  });
});

describe('plan diff in words', () => {
  it('shows before → after values with units and names, never field names', () => {
    const before = plan();
    const jumper = before.links.find((l) => l.kind === 'jumper')!;
    const after: PlanDocument = {
      ...before,
      system: { ...before.system, faultKa: 12 },
      links: before.links.map((l) => (l.id === jumper.id && l.kind === 'jumper' ? { ...l, lengthM: l.lengthM + 1.5, clampKa: 27 } : l)),
    };
    const words = diffInWords(before, after);
    expect(words).toContainEqual({ kind: 'changed', what: 'The plan', changes: [`available fault current ${before.system.faultKa} kA → 12 kA`] });
    const changed = words.find((w) => w.what.includes(jumper.id))!;
    expect(changed.changes).toEqual([`clamp rating ${jumper.kind === 'jumper' && jumper.clampKa !== undefined ? `${jumper.clampKa} kA` : 'none'} → 27 kA`, `length ${jumper.kind === 'jumper' ? jumper.lengthM : ''} m → ${jumper.kind === 'jumper' ? jumper.lengthM + 1.5 : ''} m`]);
    expect(JSON.stringify(words)).not.toMatch(/lengthM|clampKa|faultKa/);
  });

  it('names the surface a worker now stands on, and a move as a move', () => {
    const before = plan();
    const worker = before.nodes.find((n) => n.kind === 'worker')!;
    const other = before.nodes.find((n) => n.kind === 'cluster-bar' || n.kind === 'hardware')!;
    const after: PlanDocument = { ...before, nodes: before.nodes.map((n) => (n.id === worker.id && n.kind === 'worker' ? { ...n, standsOn: other.id, position: { x: 1, y: 2 } } : n)) };
    const [change] = diffInWords(before, after);
    expect(change.changes).toContain('moved on the drawing');
    expect(change.changes.find((c) => c.startsWith('stands on'))).toMatch(new RegExp(`→ .*${other.id}`));
  });
});

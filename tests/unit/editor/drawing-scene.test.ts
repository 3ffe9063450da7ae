import { describe, expect, it } from 'vitest';
import { drawingScene, glyphShapes, type Shape } from '@/components/editor/drawing-scene';
import type { CheckReport } from '@/lib/domain/report';
import { findStarter } from '@/lib/domain/starters';
import { NODE_KINDS, type PlanNode } from '@/lib/schemas/plan';

const doc = findStarter('tangent-bucket')!.build();
const points = (shapes: Shape[]) => shapes.flatMap((s) => (s.t === 'poly' ? s.pts.map((v, i) => [i % 2, v] as const) : [[0, s.x] as const, [1, s.y] as const]));

describe('the export drawing, built from the document', () => {
  it('names every element and every jumper with its cable size, inside the box it is given', () => {
    const shapes = drawingScene(doc, null, 600, 375);
    const words = shapes.flatMap((s) => (s.t === 'text' ? [s.text] : []));
    for (const n of doc.nodes) expect(words).toContain(n.id);
    for (const l of doc.links.filter((x) => x.kind === 'jumper')) expect(words.some((w) => w.startsWith(`${l.label?.trim() || l.id} · `))).toBe(true);
    for (const [axis, v] of points(shapes)) {
      expect(v).toBeGreaterThanOrEqual(-1);
      expect(v).toBeLessThanOrEqual(axis ? 376 : 601);
    }
  });

  it('keeps the drawing where the nodes are: a node to the right of another stays to the right', () => {
    const shapes = drawingScene(doc, null, 1000, 625);
    const at = (id: string) => shapes.find((s): s is Extract<Shape, { t: 'text' }> => s.t === 'text' && s.text === id)!;
    const [a, b] = [...doc.nodes].sort((p, q) => p.position!.x - q.position!.x).filter((n, i, all) => i === 0 || i === all.length - 1);
    expect(at(a.id).x).toBeLessThan(at(b.id).x);
  });

  it('outlines an element with a finding in the severity colour', () => {
    const target = doc.nodes[0].id;
    const report = { findings: [{ rule: 'x', severity: 'blocker', elements: [target], message: 'm', basis: 'b' }] } as unknown as CheckReport;
    const strokes = (r: CheckReport | null) => drawingScene(doc, r, 600, 375).filter((s) => s.t !== 'text' && s.stroke === '#b42318').length;
    expect(strokes(null)).toBe(0);
    expect(strokes(report)).toBe(1);
  });

  it('gives every kind a glyph inside its 40-unit box', () => {
    for (const kind of NODE_KINDS) {
      const shapes = glyphShapes({ id: 'X', kind, position: { x: 0, y: 0 } } as PlanNode);
      expect(shapes.length, kind).toBeGreaterThan(0);
      for (const [, v] of points(shapes)) expect(v >= 0 && v <= 40, kind).toBe(true);
    }
  });
});

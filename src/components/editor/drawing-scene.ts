/**
 * The drawing for export, built from the plan document itself (node positions, links, glyph
 * shapes) instead of copying the page: a list of lines, circles and words fitted into a box,
 * which `paintCanvas` draws for the PNG and `paintPdf` draws as vectors in the PDF. The shapes
 * follow Glyph.tsx and LinkEdge.tsx in a simplified form (hatching as ticks, no shadows).
 */
import type { CheckReport } from '@/lib/domain/report';
import { cableTag } from '@/lib/domain/units';
import type { Material, PlanDocument, PlanNode } from '@/lib/schemas/plan';
import { SEVERITY_COLOUR as SEVERITY } from '@/components/ui/SeverityMark';

export const INK = '#1b2330';

export interface Poly { t: 'poly'; pts: number[]; close?: boolean; fill?: string; stroke?: string; width: number; dash?: number[] }
export interface Circle { t: 'circle'; x: number; y: number; r: number; fill?: string; stroke?: string; width: number }
export interface Text { t: 'text'; x: number; y: number; text: string; size: number; bold?: boolean; colour?: string }
export type Shape = Poly | Circle | Text;

type G = Shape[];
const P = (pts: number[], o: Partial<Poly> = {}): Poly => ({ t: 'poly', pts, width: 2, stroke: INK, ...o });
const R = (x: number, y: number, w: number, h: number, fill = 'white'): Poly => P([x, y, x + w, y, x + w, y + h, x, y + h], { close: true, fill });
const C = (x: number, y: number, r: number, fill = 'white', width = 2): Circle => ({ t: 'circle', x, y, r, fill, stroke: INK, width });
const T = (text: string, x: number, y: number, size: number, bold = true): Text => ({ t: 'text', x, y, text, size, bold });

function materialRect(x: number, y: number, w: number, h: number, m: Material | undefined): G {
  if (m === 'steel') return [R(x, y, w, h, INK)];
  const out: G = [R(x, y, w, h)];
  if (m === 'fiberglass') return out;
  for (let i = 2.5; i < Math.max(w, h); i += 5) {
    const along = w > h;
    if (m === 'concrete') out.push(C(along ? x + i : x + w / 2, along ? y + h / 2 : y + i, 0.9, INK, 0));
    else out.push(P(along ? [x + i - 2, y + h - 1, x + i + 2, y + 1] : [x + 1, y + i + 2, x + w - 1, y + i - 2], { width: 1.2 }));
  }
  return out;
}

const ground = (dash?: number[]): G => [P([20, 4, 20, 14], { dash }), P([9, 14, 31, 14], { dash }), P([13, 20, 27, 20], { dash }), P([17, 26, 23, 26], { dash })];
const letter = (text: string): G => [C(20, 20, 15), T(text, 20, 25.5, text.length > 1 ? 12 : 16)];

/** One glyph in its 40 × 40 box. */
export function glyphShapes(n: PlanNode): G {
  switch (n.kind) {
    case 'phase': return letter((n.phase ?? '?').slice(0, 2));
    case 'neutral': return letter('N');
    case 'shield-wire': return letter('S');
    case 'structure': return materialRect(14, 3, 12, 34, n.material);
    case 'crossarm': return materialRect(3, 15, 34, 10, n.material);
    case 'hardware': return [R(13, 13, 14, 14)];
    case 'cluster-bar': return [R(4, 16, 32, 8, INK), P([11, 16, 11, 10], { width: 3 }), P([20, 16, 20, 10], { width: 3 }), P([29, 16, 29, 10], { width: 3 })];
    case 'ground-rod': return [P([20, 3, 20, 25], { width: 2.5 }), P([18, 22, 20, 25, 22, 22], { width: 2.5 }), P([6, 26, 34, 26]), P([10, 31, 30, 31]), P([14, 36, 26, 36])];
    case 'earth': return ground();
    case 'pole-ground': return ground([3, 2.5]);
    case 'mat': return [R(6, 10, 28, 20), P([6, 20, 34, 20], { width: 1.4 }), P([15.3, 10, 15.3, 30], { width: 1.4 }), P([24.6, 10, 24.6, 30], { width: 1.4 })];
    case 'bucket': return [P([8, 10, 32, 10, 29, 32, 11, 32], { close: true, fill: 'white' })];
    case 'truck': return [R(3, 12, 22, 14), P([25, 17, 32, 17, 37, 22, 37, 26, 25, 26], { close: true, fill: 'white' }), C(10, 30, 3.5), C(30, 30, 3.5)];
    case 'supply-end': return [P([4, 20, 28, 20], { width: 2.5 }), P([20, 12, 28, 20, 20, 28], { width: 2.5 }), P([32, 8, 32, 32], { width: 2.5 })];
    case 'worker': return [C(20, 8, 4.5), P([20, 13, 20, 26]), P([11, 18, 20, 16, 29, 18]), P([20, 26, 14, 36]), P([20, 26, 26, 36])];
    default: return [R(10, 10, 20, 20)];
  }
}

const move = (s: Shape, dx: number, dy: number, k: number): Shape =>
  s.t === 'poly' ? { ...s, pts: s.pts.map((v, i) => (i % 2 ? dy + v * k : dx + v * k)), width: s.width * k, dash: s.dash?.map((d) => d * k) }
    : s.t === 'circle' ? { ...s, x: dx + s.x * k, y: dy + s.y * k, r: s.r * k, width: s.width * k }
      : { ...s, x: dx + s.x * k, y: dy + s.y * k, size: s.size * k };

/**
 * The whole drawing fitted into `width` × `height` (any unit), centred, at most natural size
 * ×2. `widths` are the nodes' rendered widths when the canvas is on screen (a label widens a
 * node); without them a node is the 56-unit glyph box.
 */
export function drawingScene(doc: PlanDocument, report: CheckReport | null, width: number, height: number, widths: Record<string, number> = {}): Shape[] {
  const worst = new Map<string, 'blocker' | 'warning' | 'note'>();
  const rank = { blocker: 3, warning: 2, note: 1 } as const;
  for (const f of report?.findings ?? []) for (const e of f.elements) if (!worst.has(e) || rank[worst.get(e)!] < rank[f.severity]) worst.set(e, f.severity);
  const centre = new Map<string, { x: number; y: number }>();
  for (const n of doc.nodes) centre.set(n.id, { x: (n.position?.x ?? 0) + (widths[n.id] ?? 56) / 2, y: (n.position?.y ?? 0) + 28 });
  const world: Shape[] = [];
  for (const l of doc.links) {
    const a = centre.get(l.from);
    const b = centre.get(l.to);
    if (!a || !b) continue;
    const sev = worst.get(l.id);
    if (sev) world.push(P([a.x, a.y, b.x, b.y], { stroke: SEVERITY[sev], width: 12 }));
    if (l.kind === 'reach') world.push(P([a.x, a.y, b.x, b.y], { width: 2.5, dash: [2, 6] }));
    else world.push(P([a.x, a.y, b.x, b.y], { width: l.kind === 'jumper' ? 5 : 1.5 }));
    const name = l.label?.trim() || l.id;
    const tag = l.kind === 'jumper' ? `${name} · ${cableTag(l.cable)}` : l.kind === 'bond' ? `${name} bond` : null;
    if (tag) {
      const mx = (a.x + b.x) / 2;
      const my = (a.y + b.y) / 2;
      world.push({ ...R(mx - tag.length * 4 - 6, my - 10, tag.length * 8 + 12, 20), width: l.kind === 'jumper' ? 1.5 : 1 });
      world.push(T(tag, mx, my + 4.5, l.kind === 'jumper' ? 13 : 11, l.kind === 'jumper'));
    }
  }
  for (const n of doc.nodes) {
    const c = centre.get(n.id)!;
    const sev = worst.get(n.id);
    world.push({ ...R(c.x - 28, c.y - 28, 56, 56), stroke: sev ? SEVERITY[sev] : 'white', width: sev ? 3 : 0.1, dash: sev === 'warning' ? [6, 4] : undefined });
    for (const s of glyphShapes(n)) world.push(move(s, c.x - 20, c.y - 20, 1));
    world.push(T(n.id, c.x, c.y + 44, 12));
    if (n.label && n.label !== n.id) world.push({ ...T(n.label.slice(0, 24), c.x, c.y + 58, 11, false), colour: '#475467' });
  }
  if (!doc.nodes.length) return [];
  const xs = [...centre.values()].map((p) => p.x);
  const ys = [...centre.values()].map((p) => p.y);
  const [x0, x1, y0, y1] = [Math.min(...xs) - 70, Math.max(...xs) + 70, Math.min(...ys) - 40, Math.max(...ys) + 70];
  const k = Math.min(width / (x1 - x0), height / (y1 - y0), 2);
  const dx = (width - (x1 - x0) * k) / 2 - x0 * k;
  const dy = (height - (y1 - y0) * k) / 2 - y0 * k;
  return world.map((s) => move(s, dx, dy, k));
}

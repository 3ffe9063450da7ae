import { describe, expect, it } from 'vitest';
import { toFlowEdges, toFlowNodes, withDragPositions, worstContact } from '@/components/editor/selectors';
import type { CheckReport, ReportContact } from '@/lib/domain/report';
import { findStarter } from '@/lib/domain/starters';

const doc = () => findStarter('tangent-bucket')!.build('Views');

describe('what the canvas hands React Flow', () => {
  it('draws the links of selected elements in a layer of their own, below the nodes', () => {
    const d = doc();
    const link = d.links[0];
    const edges = toFlowEdges(d, [link.from]);
    const layer = (id: string) => edges.find((e) => e.id === id)!.zIndex;
    for (const l of d.links) expect(layer(l.id)).toBe(l.from === link.from || l.to === link.from ? 0 : -1);
    expect(new Set(edges.map((e) => e.zIndex))).toEqual(new Set([0, -1]));
    // A selected link is lifted too; nothing selected, every link in the one lower layer.
    expect(toFlowEdges(d, [link.id]).find((e) => e.id === link.id)!.zIndex).toBe(0);
    expect(new Set(toFlowEdges(d, []).map((e) => e.zIndex))).toEqual(new Set([-1]));
  });

  it('a drag in progress gives new objects to the dragged nodes only', () => {
    const d = doc();
    const nodes = toFlowNodes(d, []);
    const moved = withDragPositions(nodes, new Map([[d.nodes[1].id, { x: 900, y: 40 }]]));
    expect(moved[1].position).toEqual({ x: 900, y: 40 });
    expect(moved.filter((n, i) => n !== nodes[i])).toHaveLength(1);
    expect(withDragPositions(nodes, null)).toBe(nodes);
  });

  it("finds each worker's worst contact (highest share of its limit) once per report", () => {
    const c = (worker: string, surface: string, bodyAmps: number | null, limitAmps: number | null): ReportContact => ({ worker, surface, touchVolts: null, bodyAmps, limitAmps });
    const report = { findings: [], contacts: [c('W1', 'A', 0.05, 0.1), c('W1', 'B', 0.09, 0.3), c('W1', 'C', 0.2, 0.25), c('W2', 'A', null, 0.1), c('W2', 'B', 0.01, null)] } as unknown as CheckReport;
    expect(worstContact(report, 'W1')?.surface).toBe('C'); // 0.8 of its limit against 0.5 and 0.3
    expect(worstContact(report, 'W2')).toBeNull(); // neither contact was solved with a limit
    expect(worstContact(null, 'W1')).toBeNull();
  });
});

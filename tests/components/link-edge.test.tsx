import { act, render } from '@testing-library/react';
import { ReactFlowProvider, type EdgeProps } from 'reactflow';
import { describe, expect, it } from 'vitest';
import { LinkEdge } from '@/components/editor/edges/LinkEdge';
import { EditorStoreContext } from '@/components/editor/selectors';
import { createEditorStore } from '@/components/editor/store';
import { findStarter } from '@/lib/domain/starters';
import type { PlanLink } from '@/lib/schemas/plan';

const draw = (link: PlanLink, store = createEditorStore({ doc: findStarter('tangent-bucket')!.build() })) => {
  const props = { id: link.id, source: link.from, target: link.to, sourceX: 0, sourceY: 0, targetX: 200, targetY: 0, sourcePosition: 'top', targetPosition: 'top', data: link, selected: false } as unknown as EdgeProps<PlanLink>;
  return render(
    <EditorStoreContext.Provider value={store}>
      <ReactFlowProvider><svg><LinkEdge {...props} /></svg></ReactFlowProvider>
    </EditorStoreContext.Provider>,
  ).container.textContent;
};

describe('links on the drawing', () => {
  it('show the name the findings use: the label, else the id, beside the cable size', () => {
    expect(draw({ id: 'j11', kind: 'jumper', from: 'A', to: 'CB', cable: '2/0', lengthM: 3 })).toContain('j11 · 2/0');
    expect(draw({ id: 'j12', kind: 'jumper', from: 'B', to: 'CB', cable: '4/0', lengthM: 3, label: 'Lead B' })).toContain('Lead B · 4/0');
    expect(draw({ id: 'b3', kind: 'bond', from: 'BK', to: 'CB' })).toContain('b3 bond');
  });
});

describe('"Show" on a finding', () => {
  it('selects the elements and flashes them on the drawing', () => {
    const store = createEditorStore({ doc: findStarter('tangent-bucket')!.build() });
    const link: PlanLink = { id: 'jA', kind: 'jumper', from: 'A', to: 'CB', cable: '2/0', lengthM: 3 };
    const { container } = render(
      <EditorStoreContext.Provider value={store}>
        <ReactFlowProvider><svg><LinkEdge {...({ id: 'jA', source: 'A', target: 'CB', sourceX: 0, sourceY: 0, targetX: 100, targetY: 0, data: link, selected: false } as unknown as EdgeProps<PlanLink>)} /></svg></ReactFlowProvider>
      </EditorStoreContext.Provider>,
    );
    const g = () => container.querySelector('[data-testid="link-jA"]')!;
    expect(g().getAttribute('class')).toBeNull();
    act(() => store.getState().flash(['jA']));
    expect(store.getState().selection).toEqual(['jA']);
    expect(g().getAttribute('class')).toBe('bm-flash');
  });
});

import { act, render } from '@testing-library/react';
import { ReactFlowProvider, useStoreApi } from 'reactflow';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { Canvas } from '@/components/editor/Canvas';
import { EditorStoreContext } from '@/components/editor/selectors';
import { createEditorStore } from '@/components/editor/store';
import { findStarter } from '@/lib/domain/starters';
import type { PlanDocument } from '@/lib/schemas/plan';

class NoResize { observe() {} unobserve() {} disconnect() {} }
beforeAll(() => vi.stubGlobal('ResizeObserver', NoResize));
afterAll(() => vi.unstubAllGlobals());

function drawCanvas(doc: PlanDocument, onDrawn: () => void) {
  let flow: ReturnType<typeof useStoreApi> | null = null;
  function Grab() {
    flow = useStoreApi();
    return null;
  }
  render(
    <EditorStoreContext.Provider value={createEditorStore({ doc })}>
      <ReactFlowProvider>
        <Grab />
        <Canvas onInit={() => undefined} onDrawn={onDrawn} />
      </ReactFlowProvider>
    </EditorStoreContext.Provider>,
  );
  /** What React Flow does when it has measured every node (jsdom lays nothing out, so it never does). */
  const measureAll = () => act(() => {
    const s = flow!.getState();
    s.setNodes(s.getNodes().map((n) => ({ ...n, width: 56, height: 80 })));
  });
  return { measureAll };
}

const frame = () => act(() => new Promise<void>((r) => requestAnimationFrame(() => r())));

describe('the canvas says when it has drawn the plan', () => {
  it('once every element is measured, after that frame, and only once', async () => {
    const onDrawn = vi.fn();
    const { measureAll } = drawCanvas(findStarter('tangent-bucket')!.build('Drawn'), onDrawn);
    await frame();
    expect(onDrawn).not.toHaveBeenCalled();
    measureAll();
    await frame();
    expect(onDrawn).toHaveBeenCalledTimes(1);
    measureAll();
    await frame();
    expect(onDrawn).toHaveBeenCalledTimes(1);
  });

  it('at once for an empty plan', async () => {
    const onDrawn = vi.fn();
    drawCanvas({ ...findStarter('tangent-bucket')!.build('Empty'), nodes: [], links: [] }, onDrawn);
    await frame();
    expect(onDrawn).toHaveBeenCalledTimes(1);
  });
});

import { act, fireEvent, render } from '@testing-library/react';
import { ReactFlowProvider } from 'reactflow';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { Canvas } from '@/components/editor/Canvas';
import { EditorStoreContext } from '@/components/editor/selectors';
import { createEditorStore, type EditorStore } from '@/components/editor/store';
import { startSync } from '@/components/editor/sync';
import type { EditorApi } from '@/components/editor/api-client';
import { findStarter } from '@/lib/domain/starters';
import type { PlanDocument } from '@/lib/schemas/plan';

// jsdom has no ResizeObserver (React Flow only needs one to exist) and lays nothing out: the canvas
// gets a box of its own, or React Flow would see the pointer at its edge and pan while dragging.
class NoResize { observe() {} unobserve() {} disconnect() {} }
beforeAll(() => {
  vi.stubGlobal('ResizeObserver', NoResize);
  vi.spyOn(HTMLElement.prototype, 'getBoundingClientRect').mockReturnValue(DOMRect.fromRect({ x: 0, y: 0, width: 800, height: 600 }));
});
afterAll(() => {
  vi.unstubAllGlobals();
  vi.restoreAllMocks();
});

const positionOf = (store: EditorStore, id: string) => store.getState().doc.nodes.find((n) => n.id === id)!.position;

function drawCanvas() {
  const store = createEditorStore({ doc: findStarter('tangent-bucket')!.build('Drag') });
  const view = render(
    <EditorStoreContext.Provider value={store}>
      <ReactFlowProvider>
        <div style={{ width: 800, height: 600 }}><Canvas onInit={() => undefined} /></div>
      </ReactFlowProvider>
    </EditorStoreContext.Provider>,
  );
  const node = (id: string) => view.container.querySelector<HTMLElement>(`.react-flow__node[data-id="${id}"]`)!;
  return { store, node };
}

/** A mouse event as a browser makes it: `view` is the window (jsdom refuses vitest's window in the init). */
function mouse(type: string, target: Element | Window, at: { clientX: number; clientY: number }) {
  const e = new MouseEvent(type, { bubbles: true, cancelable: true, button: 0, ...at });
  Object.defineProperty(e, 'view', { value: window });
  act(() => { fireEvent(target, e); });
}

/** A mouse drag the way a browser delivers it: down on the node, then moves and the release on the window. */
function dragBy(el: HTMLElement, steps: { x: number; y: number }[], onMove?: (i: number) => void) {
  const at = { clientX: 100, clientY: 100 };
  mouse('mousedown', el, at);
  steps.forEach((d, i) => {
    mouse('mousemove', window, { clientX: at.clientX + d.x, clientY: at.clientY + d.y });
    onMove?.(i);
  });
  const last = steps[steps.length - 1];
  mouse('mouseup', window, { clientX: at.clientX + last.x, clientY: at.clientY + last.y });
}

describe('dragging a node on the canvas', () => {
  it('moves the drawn node with the pointer but writes the document only at the drop, as one undo step', () => {
    const { store, node } = drawCanvas();
    const start = positionOf(store, 'CB')!;
    const docBefore = store.getState().doc;
    const versions: number[] = [];
    const transforms: string[] = [];
    dragBy(node('CB'), [{ x: 20, y: 0 }, { x: 40, y: 20 }, { x: 60, y: 40 }, { x: 80, y: 60 }], () => {
      versions.push(store.getState().version);
      transforms.push(node('CB').style.transform);
    });
    // During the drag the node followed the pointer on the drawing, and the document stayed as it was.
    expect(new Set(transforms).size).toBe(4);
    expect(versions).toEqual([0, 0, 0, 0]);
    // At the drop: the final position (on the 20 grid) in the document, once.
    expect(positionOf(store, 'CB')).toEqual({ x: start.x + 80, y: start.y + 60 });
    expect(store.getState().version).toBe(1);
    expect(store.getState().past).toEqual([docBefore]);
    expect(node('CB').style.transform).toBe(`translate(${start.x + 80}px,${start.y + 60}px)`);
    // One undo puts it back where the drag began; redo returns it.
    act(() => store.getState().undo());
    expect(positionOf(store, 'CB')).toEqual(start);
    expect(node('CB').style.transform).toBe(`translate(${start.x}px,${start.y}px)`);
    act(() => store.getState().redo());
    expect(positionOf(store, 'CB')).toEqual({ x: start.x + 80, y: start.y + 60 });
  });

  it('the check and autosave hear of the drop once, with the final position', async () => {
    vi.useFakeTimers();
    try {
      const { store, node } = drawCanvas();
      const start = positionOf(store, 'CB')!;
      const checked: { x: number; y: number }[] = [];
      const saved: { x: number; y: number }[] = [];
      const at = (doc: PlanDocument) => doc.nodes.find((n) => n.id === 'CB')!.position!;
      const api = {
        check: async (doc: PlanDocument) => { checked.push(at(doc)); return { kind: 'ok', report: { findings: [], contacts: [], summary: { blockers: 0, warnings: 0, notes: 0 } } }; },
        save: async (_id: number, body: { document: PlanDocument }) => { saved.push(at(body.document)); return { kind: 'saved', plan: { currentRevision: 4 } }; },
      } as unknown as EditorApi;
      const sync = startSync(store, { planId: 1, api, checkDelayMs: 150, saveDelayMs: 1500 });
      // Moves slower than the check's wait: each would have started a check before the drop.
      dragBy(node('CB'), [{ x: 20, y: 20 }, { x: 40, y: 40 }, { x: 60, y: 60 }], () => vi.advanceTimersByTime(400));
      await act(async () => { await vi.advanceTimersByTimeAsync(2000); });
      sync.stop();
      const final = { x: start.x + 60, y: start.y + 60 };
      expect(checked).toEqual([final]);
      expect(saved).toEqual([final]);
    } finally {
      vi.useRealTimers();
    }
  });

  it('a press on a node without moving it changes nothing and adds no undo step', () => {
    const { store, node } = drawCanvas();
    const doc = store.getState().doc;
    dragBy(node('CB'), [{ x: 0, y: 0 }]);
    expect(store.getState().doc).toBe(doc);
    expect(store.getState().past).toHaveLength(0);
  });
});

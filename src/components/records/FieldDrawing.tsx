/**
 * The plan's drawing on the field screen: the editor's canvas, read-only, with the jumpers that
 * have a set on now selected (highlighted), so the crew sees at a glance what is on.
 */
import { useEffect, useState } from 'react';
import { ReactFlowProvider } from 'reactflow';
import 'reactflow/dist/base.css';
import '@/components/editor/editor.css';
import type { PlanDocument } from '@/lib/schemas/plan';
import { Canvas } from '@/components/editor/Canvas';
import { EditorStoreContext } from '@/components/editor/selectors';
import { createEditorStore } from '@/components/editor/store';

export function FieldDrawing({ document, on }: { document: PlanDocument; on: string[] }) {
  const [store] = useState(() => createEditorStore({ doc: document, baseRevision: 1, readOnly: true, report: null }));
  const key = on.join(',');
  // The highlight is the sets on, nothing else: a tap on the drawing selects what it touched, so
  // the selection is put back at once (else a tap showed a set as on, or the ones on as off).
  useEffect(() => {
    const shown = key ? key.split(',') : [];
    store.setState({ selection: shown });
    return store.subscribe((s) => {
      if (s.selection.join(',') !== key) store.setState({ selection: shown });
    });
  }, [store, key]);
  return (
    <EditorStoreContext.Provider value={store}>
      <ReactFlowProvider>
        <div className="bm-editor h-80 rounded-lg border border-line bg-paper" data-testid="field-drawing" data-on={key}>
          <Canvas onInit={(rf) => setTimeout(() => rf.fitView({ padding: 0.15 }), 30)} />
        </div>
      </ReactFlowProvider>
    </EditorStoreContext.Provider>
  );
}

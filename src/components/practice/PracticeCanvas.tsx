/**
 * The editor's canvas, store and inspector reused for practice without the editor's saving: a
 * read-only drawing whose taps mark elements (find), or an editable copy that is only checked (fix).
 */
import { useEffect, useRef, useState, type ReactNode } from 'react';
import { ReactFlowProvider, type ReactFlowInstance } from 'reactflow';
import 'reactflow/dist/base.css';
import '@/components/editor/editor.css';
import { Canvas } from '@/components/editor/Canvas';
import { EditorStoreContext } from '@/components/editor/selectors';
import { createEditorStore, type EditorStore } from '@/components/editor/store';
import type { PlanDocument } from '@/lib/schemas/plan';

export function PracticeCanvas({ store, children, label, onTapNode }: { store: EditorStore; children?: ReactNode; label: string; onTapNode?: (id: string) => void }) {
  const rf = useRef<ReactFlowInstance | null>(null);
  useEffect(() => {
    const fit = () => rf.current?.fitView({ padding: 0.2 });
    window.addEventListener('resize', fit);
    return () => window.removeEventListener('resize', fit);
  }, []);
  return (
    <EditorStoreContext.Provider value={store}>
      <ReactFlowProvider>
        <div className="bm-editor flex flex-col gap-3 lg:flex-row" aria-label={label}>
          <div className="h-[60vh] min-h-[420px] flex-1 rounded-lg border border-line bg-paper" data-testid="practice-canvas">
            <Canvas onInit={(inst) => { rf.current = inst; }} onTapNode={onTapNode} />
          </div>
          {children}
        </div>
      </ReactFlowProvider>
    </EditorStoreContext.Provider>
  );
}

/** The drawing alone, read-only, with no figures: the context of a numbers question. */
export function ReadOnlyDrawing({ document }: { document: PlanDocument }) {
  const [store] = useState(() => createEditorStore({ doc: document, readOnly: true, report: null }));
  return <PracticeCanvas store={store} label="The plan, read-only" />;
}

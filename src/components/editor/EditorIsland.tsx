/**
 * The editor as pages mount it: first loads the device's unsaved drafts from IndexedDB (see
 * draft-store.ts), then renders the editor with those drafts, and registers the service worker
 * once the canvas has drawn the plan: on a first visit the worker fetches every file of the app
 * for offline use, and on a tablet that download held the first canvas back by about 0.7 s.
 */
import { useCallback, useEffect, useRef, useState } from 'react';
import { registerWorker } from '@/components/offline/register-worker';
import { loadDraftStorage, type DraftStorage } from './draft-store';
import Editor, { type EditorProps } from './Editor';

export default function EditorIsland(props: EditorProps) {
  const [drafts, setDrafts] = useState<DraftStorage | null | undefined>(props.readOnly ? null : undefined);
  const registered = useRef(false);
  const onCanvasDrawn = useCallback(() => {
    if (registered.current) return;
    registered.current = true;
    void registerWorker();
  }, []);
  useEffect(() => {
    if (props.readOnly) return;
    // Without IndexedDB (a locked-down browser) the editor falls back to localStorage.
    loadDraftStorage().then(setDrafts, () => setDrafts(typeof localStorage === 'undefined' ? null : localStorage));
  }, [props.readOnly]);
  if (drafts === undefined) return <p className="text-note" data-testid="editor-loading">Opening the plan…</p>;
  return <Editor {...props} drafts={drafts} onCanvasDrawn={onCanvasDrawn} />;
}

/**
 * The editor as pages mount it: first loads the device's unsaved drafts from IndexedDB (see
 * draft-store.ts) and registers the service worker, then renders the editor with those drafts.
 */
import { useEffect, useState } from 'react';
import { registerWorker } from '@/components/offline/register-worker';
import { loadDraftStorage, type DraftStorage } from './draft-store';
import Editor, { type EditorProps } from './Editor';

export default function EditorIsland(props: EditorProps) {
  const [drafts, setDrafts] = useState<DraftStorage | null | undefined>(props.readOnly ? null : undefined);
  useEffect(() => {
    void registerWorker();
    if (props.readOnly) return;
    // Without IndexedDB (a locked-down browser) the editor falls back to localStorage.
    loadDraftStorage().then(setDrafts, () => setDrafts(typeof localStorage === 'undefined' ? null : localStorage));
  }, [props.readOnly]);
  if (drafts === undefined) return <p className="text-note" data-testid="editor-loading">Opening the plan…</p>;
  return <Editor {...props} drafts={drafts} />;
}

/**
 * Keeps the editor and the server in step: the live check ~150 ms after changes pause, autosave
 * ~1.5 s after changes stop, a copy of unsaved work in localStorage (keyed by plan id and base
 * revision) so a reload or a lost connection loses nothing, and a retry when the connection
 * returns. Framework-free: takes the store, the API and the browser objects it needs.
 */
import { canonicalJson } from '@/lib/domain/canonical-json';
import type { PlanDocument } from '@/lib/schemas/plan';
import type { EditorApi } from './api-client';
import type { EditorStore } from './store';

export interface SyncOptions {
  planId: number;
  api: EditorApi;
  storage?: Pick<Storage, 'getItem' | 'setItem' | 'removeItem' | 'key' | 'length'> | null;
  target?: Pick<Window, 'addEventListener' | 'removeEventListener'> | null;
  checkDelayMs?: number;
  saveDelayMs?: number;
  retryMs?: number;
  /** Run the check once at start (when the stored report is missing or a draft was restored). */
  checkNow?: boolean;
}

const PREFIX = 'bondmap:draft:';
export const draftKey = (planId: number, baseRevision: number) => `${PREFIX}${planId}:${baseRevision}`;

interface StoredDraft { doc: PlanDocument; savedAt: string }

/** The newest unsaved copy of a plan kept on this device, with the revision it was edited from. */
export function readLocalDraft(storage: SyncOptions['storage'], planId: number): { doc: PlanDocument; baseRevision: number } | null {
  if (!storage) return null;
  let best: { doc: PlanDocument; baseRevision: number } | null = null;
  for (let i = 0; i < storage.length; i++) {
    const key = storage.key(i);
    if (!key?.startsWith(`${PREFIX}${planId}:`)) continue;
    const rev = Number(key.slice(`${PREFIX}${planId}:`.length));
    try {
      const draft = JSON.parse(storage.getItem(key) ?? 'null') as StoredDraft | null;
      if (draft?.doc && (!best || rev > best.baseRevision)) best = { doc: draft.doc, baseRevision: rev };
    } catch {
      storage.removeItem(key);
    }
  }
  return best;
}

/**
 * The unsaved copy to restore when the editor opens, or null: none is kept, or the server already
 * holds exactly that document (its save went through and only the answer was lost), in which case
 * the copy is dropped.
 */
export function draftToRestore(storage: SyncOptions['storage'], planId: number, serverDoc: PlanDocument): { doc: PlanDocument; baseRevision: number } | null {
  const draft = readLocalDraft(storage, planId);
  if (!draft || canonicalJson(draft.doc) !== canonicalJson(serverDoc)) return draft;
  clearLocalDrafts(storage, planId);
  return null;
}

export function clearLocalDrafts(storage: SyncOptions['storage'], planId: number): void {
  if (!storage) return;
  const keys: string[] = [];
  for (let i = 0; i < storage.length; i++) {
    const key = storage.key(i);
    if (key?.startsWith(`${PREFIX}${planId}:`)) keys.push(key);
  }
  keys.forEach((k) => storage.removeItem(k));
}

export interface SyncHandle {
  saveNow(): Promise<void>;
  /** Saves again after the person signed in anew (in another tab or the dialog). */
  resumeAfterSignIn(): Promise<void>;
  checkNow(): void;
  stop(): void;
}

export function startSync(store: EditorStore, opts: SyncOptions): SyncHandle {
  const { planId, api, storage = null, target = null, checkDelayMs = 150, saveDelayMs = 1500, retryMs = 10000 } = opts;
  let checkTimer: ReturnType<typeof setTimeout> | undefined;
  let saveTimer: ReturnType<typeof setTimeout> | undefined;
  let localTimer: ReturnType<typeof setTimeout> | undefined;
  let checkAbort: AbortController | null = null;
  let checkSeq = 0;
  let saving = false;
  let refusedVersion = -1;
  let stopped = false;

  const runCheck = async () => {
    const seq = ++checkSeq;
    checkAbort?.abort();
    checkAbort = new AbortController();
    store.getState().setCheckState('checking', store.getState().checkIssues);
    try {
      const r = await api.check(store.getState().doc, checkAbort.signal, store.getState().units);
      if (seq !== checkSeq || stopped) return;
      if (r.kind === 'ok') store.getState().receiveReport(r.report);
      else if (r.kind === 'invalid') store.getState().setCheckState('invalid', r.issues);
      else if (r.kind === 'signed-out') store.getState().setCheckState('signed-out');
      else if (r.kind === 'too-large') store.getState().setCheckState('too-large');
      else store.getState().setCheckState('offline');
    } catch {
      // aborted by a newer check
    }
  };
  const scheduleCheck = () => {
    clearTimeout(checkTimer);
    checkTimer = setTimeout(runCheck, checkDelayMs);
  };

  const writeLocal = () => {
    const s = store.getState();
    if (!storage || s.readOnly || s.version === s.savedVersion) return;
    try {
      clearLocalDrafts(storage, planId);
      storage.setItem(draftKey(planId, s.baseRevision), JSON.stringify({ doc: s.doc, savedAt: new Date().toISOString() } satisfies StoredDraft));
    } catch {
      // storage full or disabled: the server copy is the only one
    }
  };

  const save = async (): Promise<void> => {
    const s = store.getState();
    if (stopped || s.readOnly || s.saveState === 'conflict' || s.saveState === 'locked' || s.version === s.savedVersion) return;
    // After a refusal, saving waits for the user (sign in again, or make the plan smaller).
    if (s.saveState === 'signed-out' || s.saveState === 'forbidden' || (s.saveState === 'too-large' && s.version === refusedVersion)) return;
    if (saving) {
      scheduleSave();
      return;
    }
    saving = true;
    const version = s.version;
    store.getState().setSaveState('saving');
    const r = await api.save(planId, { expectedRevision: s.baseRevision, title: s.doc.title, document: s.doc });
    saving = false;
    if (stopped) return;
    const now = store.getState();
    // The server holds `version` at `revision`: later changes, if any, go out next.
    const settled = (revision: number) => {
      now.markSaved(version, revision);
      if (store.getState().version === version) clearLocalDrafts(storage, planId);
      else {
        writeLocal();
        scheduleSave();
      }
    };
    switch (r.kind) {
      case 'saved':
        settled(r.plan.currentRevision);
        break;
      case 'stale':
        // A save whose answer was lost (the signal dropped after the server stored it) comes back
        // as stale with the server holding exactly what is being sent: that is saved, not a conflict.
        if (r.current && canonicalJson(r.current.document) === canonicalJson(s.doc)) {
          settled(r.currentRevision);
          break;
        }
        now.setSaveState('conflict', { conflict: { currentRevision: r.currentRevision, document: r.current?.document ?? null } });
        break;
      case 'not-editable':
        now.setSaveState('locked');
        now.showMessage('This plan can no longer be edited (it was submitted or approved). Your changes stay on this device; export them as JSON if you need them.');
        break;
      case 'invalid':
        now.setSaveState('invalid', { issues: r.issues });
        break;
      case 'signed-out':
        writeLocal();
        now.setSaveState('signed-out');
        break;
      case 'forbidden':
        writeLocal();
        now.setSaveState('forbidden');
        now.showMessage(`${r.message} Your changes stay on this device; export them as JSON if you need them.`);
        break;
      case 'too-large':
        // Tried again only after the next change: the same document would be refused again.
        refusedVersion = version;
        writeLocal();
        now.setSaveState('too-large');
        now.showMessage(r.message);
        break;
      case 'offline':
      case 'error':
        now.setSaveState('offline');
        clearTimeout(saveTimer);
        saveTimer = setTimeout(save, retryMs);
        break;
    }
  };
  const scheduleSave = () => {
    clearTimeout(saveTimer);
    saveTimer = setTimeout(save, saveDelayMs);
  };

  const unsubscribe = store.subscribe((state, prev) => {
    // The findings' sentences follow the unit choice, so a switch asks for them again.
    if (state.doc !== prev.doc || state.units !== prev.units) scheduleCheck();
    if (state.version !== prev.version && !state.readOnly) {
      clearTimeout(localTimer);
      localTimer = setTimeout(writeLocal, 200);
      scheduleSave();
    }
  });
  const onOnline = () => {
    if (store.getState().saveState === 'offline') void save();
    if (store.getState().checkState === 'offline') void runCheck();
  };
  const onOffline = () => {
    const s = store.getState();
    if (s.version !== s.savedVersion && !s.readOnly && s.saveState !== 'conflict') s.setSaveState('offline');
  };
  // Back from signing in in another tab: try again once this page has the focus.
  const onFocus = () => {
    if (store.getState().saveState === 'signed-out') void handle.resumeAfterSignIn();
  };
  target?.addEventListener('online', onOnline);
  target?.addEventListener('offline', onOffline);
  target?.addEventListener('focus', onFocus);
  if (opts.checkNow) void runCheck();

  const handle: SyncHandle = {
    resumeAfterSignIn: () => {
      const s = store.getState();
      if (s.saveState === 'signed-out' || s.saveState === 'forbidden') s.setSaveState('unsaved');
      if (store.getState().checkState === 'signed-out') void runCheck();
      clearTimeout(saveTimer);
      return save();
    },
    saveNow: () => {
      clearTimeout(saveTimer);
      writeLocal();
      return save();
    },
    checkNow: () => void runCheck(),
    stop() {
      stopped = true;
      clearTimeout(checkTimer);
      clearTimeout(saveTimer);
      clearTimeout(localTimer);
      writeLocal();
      unsubscribe();
      target?.removeEventListener('online', onOnline);
      target?.removeEventListener('offline', onOffline);
      target?.removeEventListener('focus', onFocus);
    },
  };
  return handle;
}

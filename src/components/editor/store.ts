/**
 * The editor's state: an initial state plus thin verb-named actions that call the pure edits in
 * plan-ops.ts. A vanilla zustand store, so tests drive it without React; the island reads it
 * through `useEditor` (selectors.ts).
 */
import { createStore, type StoreApi } from 'zustand/vanilla';
import type { CheckReport } from '@/lib/domain/report';
import type { UnitSystem } from '@/lib/domain/units';
import type { LinkKind, NodeKind, PlanCriteria, PlanDocument, PlanIssue, PlanLink, PlanNode, PlanSystem } from '@/lib/schemas/plan';
import * as ops from './plan-ops';

export type SaveState = 'saved' | 'unsaved' | 'saving' | 'offline' | 'conflict' | 'invalid' | 'locked' | 'signed-out' | 'forbidden' | 'too-large';
export type CheckState = 'idle' | 'checking' | 'done' | 'invalid' | 'offline' | 'signed-out' | 'too-large';

/** What the server holds when a save was refused as stale. */
export interface ConflictInfo {
  currentRevision: number;
  document: PlanDocument | null;
}

export interface EditorState {
  doc: PlanDocument;
  selection: string[];
  past: PlanDocument[];
  future: PlanDocument[];
  clipboard: ops.Clipboard | null;
  pasteCount: number;
  units: UnitSystem;
  snap: boolean;
  /** A link kind armed for drawing by tapping two elements; `linkFrom` is the first one tapped. */
  linkTool: LinkKind | null;
  linkFrom: string | null;
  message: string | null;
  readOnly: boolean;
  report: CheckReport | null;
  checkState: CheckState;
  checkIssues: PlanIssue[];
  /** Bumped on every document change; the saver compares it with `savedVersion`. */
  version: number;
  savedVersion: number;
  baseRevision: number;
  saveState: SaveState;
  saveIssues: PlanIssue[];
  conflict: ConflictInfo | null;
  /** A bond drawn where a jumper belongs, waiting for the user to choose (see bondCaution). */
  pendingBond: { from: string; to: string; caution: string } | null;
  /** Review comments pinned to elements: element id → the comment numbers shown on the canvas. */
  pins: Record<string, number[]>;
  /** For reading an approved plan: element id → sentences on what it does in the zone. */
  explanations: Record<string, string[]>;
  /** Elements briefly flashed on the drawing after "Show", and a counter so a repeat flashes again. */
  flashing: { ids: string[]; seq: number };
}

export interface EditorActions {
  addNode(kind: NodeKind, position: ops.Point): string;
  /** Puts nodes where a drag (or a programmatic move) left them: one undo step; no step when nothing moved. */
  moveNodes(moves: ReadonlyMap<string, ops.Point>): void;
  nudgeSelection(dx: number, dy: number): void;
  deleteSelection(): void;
  connect(kind: LinkKind, from: string, to: string, parallel?: boolean): string | null;
  /** A second lead beside an existing jumper or bond, same ends and same properties. */
  addParallel(linkId: string): string | null;
  /** Settles a pending bond: draw it as a jumper instead, draw the bond anyway, or draw nothing. */
  settleBond(choice: 'jumper' | 'bond' | 'cancel'): string | null;
  armLinkTool(kind: LinkKind | null): void;
  tapElement(id: string, additive?: boolean): void;
  updateElement(element: PlanNode | PlanLink): void;
  updateSystem(system: PlanSystem): void;
  updateCriteria(criteria: PlanCriteria): void;
  renamePlan(title: string): void;
  select(ids: string[], additive?: boolean): void;
  selectAll(): void;
  clearSelection(): void;
  undo(): void;
  redo(): void;
  copySelection(): void;
  paste(): void;
  duplicateSelection(): void;
  replaceDocument(doc: PlanDocument): void;
  setUnits(units: UnitSystem): void;
  toggleSnap(): void;
  showMessage(message: string | null): void;
  /** Selects these elements and flashes them on the drawing. */
  flash(ids: string[]): void;
  receiveReport(report: CheckReport): void;
  setCheckState(state: CheckState, issues?: PlanIssue[]): void;
  setSaveState(state: SaveState, extra?: { issues?: PlanIssue[]; conflict?: ConflictInfo | null }): void;
  markSaved(version: number, revision: number): void;
  reloadFromServer(doc: PlanDocument, revision: number): void;
  keepMine(): void;
}

export type EditorStore = StoreApi<EditorState & EditorActions>;

export const HISTORY_LIMIT = 100;
export const GRID = 20;

export interface EditorInit {
  doc: PlanDocument;
  baseRevision?: number;
  readOnly?: boolean;
  units?: UnitSystem;
  report?: CheckReport | null;
  pins?: Record<string, number[]>;
  explanations?: Record<string, string[]>;
}

export function createEditorStore(init: EditorInit): EditorStore {
  return createStore<EditorState & EditorActions>()((set, get) => {
    /** Records the current document for undo and installs the next one. */
    const commit = (doc: PlanDocument, selection?: string[]) => {
      const s = get();
      if (s.readOnly || doc === s.doc) return;
      set({
        doc,
        past: [...s.past, s.doc].slice(-HISTORY_LIMIT),
        future: [],
        version: s.version + 1,
        saveState: s.saveState === 'conflict' || s.saveState === 'locked' ? s.saveState : 'unsaved',
        ...(selection ? { selection } : {}),
      });
    };
    const place = (p: ops.Point) => (get().snap ? ops.snapPoint(p, GRID) : p);

    return {
      doc: ops.placeUnpositioned(init.doc),
      selection: [],
      past: [],
      future: [],
      clipboard: null,
      pasteCount: 0,
      units: init.units ?? 'imperial',
      snap: true,
      linkTool: null,
      linkFrom: null,
      message: null,
      readOnly: init.readOnly ?? false,
      report: init.report ?? null,
      checkState: 'idle',
      checkIssues: [],
      version: 0,
      savedVersion: 0,
      baseRevision: init.baseRevision ?? 1,
      saveState: init.readOnly ? 'locked' : 'saved',
      saveIssues: [],
      conflict: null,
      pendingBond: null,
      pins: init.pins ?? {},
      explanations: init.explanations ?? {},
      flashing: { ids: [], seq: 0 },

      addNode(kind, position) {
        const { doc, id } = ops.addNode(get().doc, kind, place(position), undefined, get().units);
        commit(doc, [id]);
        return id;
      },
      moveNodes(moves) {
        const { doc } = get();
        const changed = new Map<string, ops.Point>();
        for (const n of doc.nodes) {
          const to = moves.get(n.id);
          if (!to) continue;
          const p = place(to);
          if (!n.position || n.position.x !== p.x || n.position.y !== p.y) changed.set(n.id, p);
        }
        if (changed.size) commit(ops.moveNodes(doc, changed));
      },
      nudgeSelection(dx, dy) {
        const { doc, selection } = get();
        const moves = new Map<string, ops.Point>();
        for (const n of doc.nodes) if (selection.includes(n.id) && n.position) moves.set(n.id, { x: n.position.x + dx, y: n.position.y + dy });
        if (moves.size) commit(ops.moveNodes(doc, moves));
      },
      deleteSelection() {
        const { doc, selection } = get();
        if (selection.length) commit(ops.removeElements(doc, selection), []);
      },
      connect(kind, from, to, parallel = false) {
        const caution = kind === 'bond' && !ops.linkProblem(get().doc, kind, from, to) ? ops.bondCaution(get().doc, from, to) : null;
        if (caution) {
          set({ pendingBond: { from, to, caution }, message: null });
          return null;
        }
        const result = ops.addLink(get().doc, kind, from, to, parallel, get().units);
        if ('error' in result) {
          set({ message: result.error });
          return null;
        }
        commit(result.doc, [result.id]);
        set({ message: null });
        return result.id;
      },
      settleBond(choice) {
        const pending = get().pendingBond;
        set({ pendingBond: null, linkFrom: null });
        if (!pending || choice === 'cancel') return null;
        const result = ops.addLink(get().doc, choice, pending.from, pending.to, false, get().units);
        if ('error' in result) {
          set({ message: result.error });
          return null;
        }
        commit(result.doc, [result.id]);
        return result.id;
      },
      addParallel(linkId) {
        const link = get().doc.links.find((l) => l.id === linkId);
        if (!link || link.kind === 'reach') return null;
        const result = ops.addLink(get().doc, link.kind, link.from, link.to, true);
        if ('error' in result) {
          set({ message: result.error });
          return null;
        }
        // Same cable, length and clamp as the lead beside it; its own set number and label.
        const copy = { ...link, id: result.id } as Record<string, unknown>;
        delete copy.label;
        delete copy.equipmentId;
        commit(ops.replaceElement(result.doc, copy as PlanLink), [result.id]);
        set({ message: `Added ${result.id}, a parallel lead beside ${link.id}.` });
        return result.id;
      },
      armLinkTool(kind) {
        set({ linkTool: kind, linkFrom: null, message: kind ? `Tap the first element of the ${kind}.` : null });
      },
      tapElement(id, additive = false) {
        const s = get();
        if (s.linkTool && s.doc.nodes.some((n) => n.id === id)) {
          if (!s.linkFrom) {
            set({ linkFrom: id, selection: [id], message: `Now tap the element at the other end.` });
            return;
          }
          const made = get().connect(s.linkTool, s.linkFrom, id);
          set({ linkFrom: made || get().pendingBond ? null : s.linkFrom });
          return;
        }
        get().select([id], additive);
      },
      updateElement(element) {
        commit(ops.replaceElement(get().doc, element));
      },
      updateSystem(system) {
        commit({ ...get().doc, system });
      },
      updateCriteria(criteria) {
        commit({ ...get().doc, criteria });
      },
      renamePlan(title) {
        if (title.trim() && title !== get().doc.title) commit({ ...get().doc, title });
      },
      select(ids, additive = false) {
        const current = get().selection;
        if (!additive) {
          if (ids.length === current.length && ids.every((id, i) => id === current[i])) return;
          set({ selection: ids });
          return;
        }
        const next = new Set(current);
        for (const id of ids) {
          if (next.has(id)) next.delete(id);
          else next.add(id);
        }
        set({ selection: [...next] });
      },
      selectAll() {
        const { doc } = get();
        set({ selection: [...doc.nodes.map((n) => n.id), ...doc.links.map((l) => l.id)] });
      },
      clearSelection() {
        if (get().selection.length || get().linkFrom) set({ selection: [], linkFrom: null });
      },
      undo() {
        const s = get();
        if (!s.past.length || s.readOnly) return;
        const doc = s.past[s.past.length - 1];
        set({ doc, past: s.past.slice(0, -1), future: [s.doc, ...s.future], version: s.version + 1, saveState: 'unsaved', selection: s.selection.filter((id) => ops.allIds(doc).has(id)) });
      },
      redo() {
        const s = get();
        if (!s.future.length || s.readOnly) return;
        const [doc, ...future] = s.future;
        set({ doc, past: [...s.past, s.doc], future, version: s.version + 1, saveState: 'unsaved', selection: s.selection.filter((id) => ops.allIds(doc).has(id)) });
      },
      copySelection() {
        const { doc, selection } = get();
        if (selection.length) set({ clipboard: ops.copyElements(doc, selection), pasteCount: 0 });
      },
      paste() {
        const { clipboard, pasteCount } = get();
        if (!clipboard || !clipboard.nodes.length) return;
        const step = 40 * (pasteCount + 1);
        const { doc, ids } = ops.pasteClipboard(get().doc, clipboard, { x: step, y: step });
        commit(doc, ids);
        set({ pasteCount: pasteCount + 1 });
      },
      duplicateSelection() {
        const { doc, selection } = get();
        if (!selection.length) return;
        const result = ops.pasteClipboard(doc, ops.copyElements(doc, selection));
        commit(result.doc, result.ids);
      },
      replaceDocument(doc) {
        commit(ops.placeUnpositioned(doc), []);
      },
      setUnits(units) {
        set({ units });
      },
      toggleSnap() {
        set({ snap: !get().snap });
      },
      showMessage(message) {
        set({ message });
      },
      flash(ids) {
        get().select(ids);
        set({ flashing: { ids, seq: get().flashing.seq + 1 } });
      },
      receiveReport(report) {
        set({ report, checkState: 'done', checkIssues: [] });
      },
      setCheckState(checkState, issues = []) {
        set({ checkState, checkIssues: issues });
      },
      setSaveState(saveState, extra = {}) {
        set({ saveState, saveIssues: extra.issues ?? [], ...(extra.conflict !== undefined ? { conflict: extra.conflict } : {}) });
      },
      markSaved(version, revision) {
        const s = get();
        set({ savedVersion: version, baseRevision: revision, saveState: s.version === version ? 'saved' : 'unsaved', saveIssues: [], conflict: null });
      },
      reloadFromServer(doc, revision) {
        const s = get();
        set({ doc: ops.placeUnpositioned(doc), past: [], future: [], selection: [], baseRevision: revision, version: s.version + 1, savedVersion: s.version + 1, saveState: 'saved', conflict: null });
      },
      keepMine() {
        const s = get();
        if (!s.conflict) return;
        set({ baseRevision: s.conflict.currentRevision, conflict: null, saveState: 'unsaved', version: s.version + 1 });
      },
    };
  });
}

/** True while changes exist that the server does not have yet. */
export const hasUnsavedWork = (s: EditorState): boolean => s.version !== s.savedVersion && !s.readOnly;

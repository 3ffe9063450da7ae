/**
 * The plan editor island (client:only="react" on /plans/[id]): palette, canvas, inspector,
 * drawer, and the wiring to the live check, autosave and exports. Read-only for anyone who may
 * not edit this plan; the same island then shows the drawing and the check.
 */
import { useCallback, useEffect, useRef, useState } from 'react';
import { flushSync } from 'react-dom';
import { useStore } from 'zustand';
import { ReactFlowProvider, type ReactFlowInstance } from 'reactflow';
import 'reactflow/dist/base.css';
import './editor.css';
import type { PlanStatus } from '@/lib/domain/plan-status';
import type { CheckReport } from '@/lib/domain/report';
import { parsePlan, type NodeKind, type PlanDocument, type PlanIssue } from '@/lib/schemas/plan';
import { createApi } from './api-client';
import { Canvas } from './Canvas';
import { buildPdf, downloadBlob, fileBase, planJsonText, nodeWidths, renderPlanPng, type SheetMeta } from './export';
import { commandFor, isTypingTarget } from './keyboard';
import { BondCaution } from './panels/BondCaution';
import { SignedOutDialog } from './panels/SignedOutDialog';
import { ConflictDialog } from './panels/ConflictDialog';
import { Drawer } from './panels/Drawer';
import { ImportProblems } from './panels/ImportDialog';
import { Inspector } from './panels/Inspector';
import { Palette } from './panels/Palette';
import { PrintSheet } from './panels/PrintSheet';
import { TopBar } from './panels/TopBar';
import { nearestInDirection, readingOrder } from './plan-ops';
import { EditorStoreContext } from './selectors';
import type { UnitSystem } from '@/lib/domain/units';
import type { PaperSize } from '@/lib/schemas/organisation';
import { createEditorStore, GRID, hasUnsavedWork, type EditorStore } from './store';
import { draftToRestore, startSync, type SyncHandle } from './sync';
import type { DraftStorage } from './draft-store';

export interface EditorProps {
  plan: { id: number; title: string; status: PlanStatus; currentRevision: number; document: PlanDocument; report: CheckReport | null; structure?: string; preparer?: string; date?: string; units?: UnitSystem; paperSize?: PaperSize };
  readOnly: boolean;
  role: string;
  /** The approval of the revision shown, for the print sheet and PDF (null until approved). */
  approval?: SheetMeta['approval'];
  /** Review comments pinned to elements: element id → comment numbers. */
  pins?: Record<string, number[]>;
  /** May this person submit the plan for review from the top bar? */
  canSubmit?: boolean;
  /** Element id → what it does in the zone, shown when it is selected (the library's Explain). */
  explanations?: Record<string, string[]>;
  /** Where unsaved work is kept on the device (EditorIsland passes IndexedDB's); localStorage when not given. */
  drafts?: DraftStorage | null;
  /** Called once the canvas has first drawn the plan's elements (EditorIsland registers the service worker then). */
  onCanvasDrawn?: () => void;
}

function initStore(plan: EditorProps['plan'], readOnly: boolean, pins: EditorProps['pins'], explanations: EditorProps['explanations'], drafts: DraftStorage | null): { store: EditorStore; restored: boolean } {
  const store = createEditorStore({ doc: plan.document, baseRevision: plan.currentRevision, readOnly, report: plan.report, pins, explanations, units: plan.units });
  if (readOnly || !drafts) return { store, restored: false };
  const draft = draftToRestore(drafts, plan.id, plan.document);
  if (!draft) return { store, restored: false };
  const s = store.getState();
  // A draft edited from a later revision than the page shows means the page is an older copy (the
  // worker's, offline): the draft and its revision stand, and the save checks them with the server.
  store.setState({ doc: draft.doc, version: s.version + 1, saveState: 'unsaved', ...(draft.baseRevision > plan.currentRevision ? { baseRevision: draft.baseRevision } : {}) });
  if (draft.baseRevision < plan.currentRevision) {
    store.setState({ baseRevision: draft.baseRevision, saveState: 'conflict', conflict: { currentRevision: plan.currentRevision, document: plan.document } });
  }
  s.showMessage('Restored changes kept on this device that the server did not have yet.');
  return { store, restored: true };
}

export default function Editor({ plan, readOnly, approval = null, pins, canSubmit = false, explanations, drafts: given, onCanvasDrawn }: EditorProps) {
  const [drafts] = useState(() => (given !== undefined ? given : typeof localStorage === 'undefined' ? null : localStorage));
  const [{ store, restored }] = useState(() => initStore(plan, readOnly, pins, explanations, drafts));
  const rf = useRef<ReactFlowInstance | null>(null);
  const sync = useRef<SyncHandle | null>(null);
  const canvasBox = useRef<HTMLDivElement>(null);
  const conflict = useStore(store, (s) => s.conflict);
  const message = useStore(store, (s) => s.message);
  const baseRevision = useStore(store, (s) => s.baseRevision);
  // The print sheet is drawn only when it is needed (print, PNG), so dragging never re-renders it.
  const [sheetOpen, setSheetOpen] = useState(false);
  // Side panels fold away; on a phone they start folded and open over the drawing.
  const [panels, setPanels] = useState(() => {
    const wide = typeof window === 'undefined' || window.innerWidth >= 768;
    return { tools: wide, props: wide };
  });
  const fold = (key: 'tools' | 'props') => setPanels((p) => ({ ...p, [key]: !p[key] }));
  const columns = panels.tools && panels.props ? 'md:grid-cols-[13rem_1fr_20rem]' : panels.tools ? 'md:grid-cols-[13rem_1fr]' : panels.props ? 'md:grid-cols-[1fr_20rem]' : 'md:grid-cols-1';
  const [busy, setBusy] = useState<string | null>(null);
  const [importIssues, setImportIssues] = useState<{ name: string; issues: PlanIssue[] } | null>(null);
  // A page around the island (the review page's "Pin to") hears which element was tapped.
  useEffect(() => store.subscribe((s, prev) => {
    if (s.selection !== prev.selection && s.selection.length === 1) window.dispatchEvent(new CustomEvent('bondmap:element-selected', { detail: { id: s.selection[0] } }));
  }), [store]);
  useEffect(() => {
    const before = () => flushSync(() => setSheetOpen(true));
    const after = () => setSheetOpen(false);
    window.addEventListener('beforeprint', before);
    window.addEventListener('afterprint', after);
    return () => {
      window.removeEventListener('beforeprint', before);
      window.removeEventListener('afterprint', after);
    };
  }, []);

  useEffect(() => {
    const handle = startSync(store, { planId: plan.id, api: createApi(), storage: readOnly ? null : drafts, target: window, checkNow: restored || !plan.report });
    sync.current = handle;
    // Restored work is sent at once (offline, it waits for the connection like any change).
    if (restored && store.getState().saveState === 'unsaved') void handle.saveNow();
    return () => handle.stop();
  }, [store, plan.id, plan.report, readOnly, restored, drafts]);

  useEffect(() => {
    const warn = (e: BeforeUnloadEvent) => {
      if (!hasUnsavedWork(store.getState())) return;
      e.preventDefault();
      e.returnValue = '';
    };
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [store]);

  const centreOn = useCallback((ids: string[]) => {
    const s = store.getState();
    const nodeIds = new Set<string>();
    for (const id of ids) {
      const link = s.doc.links.find((l) => l.id === id);
      if (link) {
        nodeIds.add(link.from);
        nodeIds.add(link.to);
      } else nodeIds.add(id);
    }
    s.flash(ids);
    // Legible after the move: never zoomed out below 0.8 to fit, the drawing scrolls instead.
    rf.current?.fitView({ nodes: [...nodeIds].map((id) => ({ id })), padding: 0.6, minZoom: 0.8, maxZoom: 1.3, duration: 300 });
  }, [store]);

  const placeKind = useCallback((kind: NodeKind) => {
    const box = canvasBox.current?.getBoundingClientRect();
    const centre = box && rf.current ? rf.current.screenToFlowPosition({ x: box.left + box.width / 2, y: box.top + box.height / 2 }) : { x: 0, y: 0 };
    const taken = store.getState().doc.nodes.map((n) => n.position);
    const start = { x: Math.round(centre.x / GRID) * GRID - 20, y: Math.round(centre.y / GRID) * GRID - 20 };
    const free = (q: { x: number; y: number }) => !taken.some((t) => t && Math.abs(t.x - q.x) < 110 && Math.abs(t.y - q.y) < 110);
    let p = start;
    // Walk outward ring by ring from the middle of the view to the first free spot.
    search: for (let ring = 0; ring < 12; ring++) {
      for (let dx = -ring; dx <= ring; dx++) {
        for (let dy = -ring; dy <= ring; dy++) {
          if (Math.max(Math.abs(dx), Math.abs(dy)) !== ring) continue;
          const q = { x: start.x + dx * 120, y: start.y + dy * 120 };
          if (free(q)) {
            p = q;
            break search;
          }
        }
      }
    }
    store.getState().addNode(kind, p);
  }, [store]);

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (isTypingTarget(e.target) || document.querySelector('[role="alertdialog"]')) return;
      const cmd = commandFor(e);
      if (!cmd) return;
      const s = store.getState();
      const inCanvas = canvasBox.current?.contains(document.activeElement) ?? false;
      const nav = (id: string | null) => {
        if (!id) return;
        s.select([id]);
        const n = s.doc.nodes.find((x) => x.id === id);
        if (n?.position && rf.current) {
          const z = rf.current.getZoom();
          const vp = rf.current.getViewport();
          const box = canvasBox.current!.getBoundingClientRect();
          const sx = n.position.x * z + vp.x;
          const sy = n.position.y * z + vp.y;
          if (sx < 40 || sy < 40 || sx > box.width - 80 || sy > box.height - 80) rf.current.setCenter(n.position.x + 28, n.position.y + 28, { zoom: z, duration: 200 });
        }
      };
      const order = () => readingOrder(s.doc);
      const current = s.selection.find((id) => s.doc.nodes.some((n) => n.id === id)) ?? null;
      switch (cmd) {
        case 'undo': s.undo(); break;
        case 'redo': s.redo(); break;
        case 'copy': if (!s.selection.length) return; s.copySelection(); break;
        case 'paste': s.paste(); break;
        case 'duplicate': s.duplicateSelection(); break;
        case 'select-all': if (!inCanvas) return; s.selectAll(); break;
        case 'delete': if (!s.selection.length) return; s.deleteSelection(); break;
        case 'escape': s.armLinkTool(null); s.clearSelection(); break;
        case 'fit': rf.current?.fitView({ padding: 0.2, duration: 200 }); break;
        case 'next':
        case 'previous': {
          if (!inCanvas) return;
          const list = order();
          const i = current ? list.indexOf(current) : -1;
          const j = cmd === 'next' ? i + 1 : (i < 0 ? list.length : i) - 1;
          if (j < 0 || j >= list.length) return;
          nav(list[j]);
          break;
        }
        case 'left': case 'right': case 'up': case 'down':
          if (!inCanvas) return;
          nav(current ? nearestInDirection(s.doc, current, cmd) : order()[0] ?? null);
          break;
        default: {
          if (!inCanvas) return;
          const d = { 'nudge-left': [-GRID, 0], 'nudge-right': [GRID, 0], 'nudge-up': [0, -GRID], 'nudge-down': [0, GRID] }[cmd];
          s.nudgeSelection(d[0], d[1]);
        }
      }
      e.preventDefault();
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [store]);

  const meta: SheetMeta = { planId: plan.id, revision: baseRevision, status: plan.status, approval, structure: plan.structure, preparer: plan.preparer, date: plan.date, paper: plan.paperSize };
  // Submitting saves first (the server checks what it has), then reloads into the read-only view.
  const doSubmit = async () => {
    const blockers = store.getState().report?.summary.blockers ?? 0;
    const ask = `Submit revision ${store.getState().baseRevision} of "${store.getState().doc.title}" for review? It cannot be edited while a reviewer decides.${blockers ? ` The check still finds ${blockers} blocker${blockers === 1 ? '' : 's'}, so the server will refuse it.` : ''}`;
    if (!window.confirm(ask)) return;
    setBusy('Submitting…');
    try {
      await sync.current?.saveNow();
      const s = store.getState();
      if (s.saveState !== 'saved') return s.showMessage('Save the plan first: it has changes the server does not have yet.');
      const response = await fetch(`/api/plans/${plan.id}/submit`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{}' });
      if (response.ok) return window.location.reload();
      const body = (await response.json().catch(() => null)) as { error?: { message?: string; blockers?: { message: string }[] } } | null;
      const blockers = body?.error?.blockers ?? [];
      s.showMessage(`${body?.error?.message ?? 'The plan could not be submitted.'}${blockers.length ? ` First: ${blockers[0].message}` : ''}`);
    } catch {
      store.getState().showMessage('The plan could not be submitted: the server cannot be reached. Try again when the connection is back.');
    } finally {
      setBusy(null);
    }
  };
  const doExport = async (what: 'png' | 'pdf' | 'json') => {
    const s = store.getState();
    const base = fileBase(s.doc, meta);
    if (what === 'json') return downloadBlob(new Blob([planJsonText(s.doc)], { type: 'application/json' }), `${base}.json`);
    setBusy(what === 'pdf' ? 'Making PDF…' : 'Making PNG…');
    try {
      const widths = nodeWidths(canvasBox.current);
      if (what === 'pdf') downloadBlob(await buildPdf(s.doc, s.report, meta, widths, s.units), `${base}.pdf`);
      else downloadBlob(await renderPlanPng(s.doc, s.report, meta, widths), `${base}.png`);
    } catch (err) {
      s.showMessage(`Export failed: ${(err as Error).message}`);
    } finally {
      setBusy(null);
    }
  };
  const doImport = async (file: File) => {
    let data: unknown;
    try {
      data = JSON.parse(await file.text());
    } catch {
      return setImportIssues({ name: file.name, issues: [{ path: '(document)', message: 'is not valid JSON' }] });
    }
    const parsed = parsePlan(data);
    if (!parsed.ok) return setImportIssues({ name: file.name, issues: parsed.issues });
    store.getState().replaceDocument(parsed.plan);
    store.getState().showMessage(`Imported ${file.name}. Undo puts the previous drawing back.`);
    setTimeout(() => rf.current?.fitView({ padding: 0.2 }), 50);
  };

  return (
    <EditorStoreContext.Provider value={store}>
      <ReactFlowProvider>
        <div className="bm-editor flex flex-col bg-paper md:h-[calc(100vh-57px)] md:min-h-[560px]" data-testid="editor" data-ready="true">
          <TopBar status={plan.status} busy={busy} onFit={() => rf.current?.fitView({ padding: 0.2, duration: 200 })} onCheck={() => sync.current?.checkNow()}
            onRetrySave={() => void sync.current?.saveNow()} onExport={(w) => void doExport(w)} onImport={(f) => void doImport(f)}
            onSubmit={canSubmit && !readOnly ? () => void doSubmit() : undefined} historyHref={`/plans/${plan.id}/history`} />
          <div className={`relative grid min-h-0 flex-1 grid-cols-1 ${columns}`}>
            {/* Over the drawing, not above it: a message that pushed the canvas down would move
                every symbol between a finger's two taps. */}
            {message && (
              <div className="no-print absolute left-1/2 top-2 z-20 flex max-w-[min(36rem,90%)] -translate-x-1/2 items-center gap-3 rounded-md border border-line bg-white px-3 py-1 text-sm shadow" role="status" data-testid="editor-message">
                <span className="flex-1">{message}</span>
                <button type="button" className="btn" onClick={() => { store.getState().showMessage(null); store.getState().armLinkTool(null); }}>Dismiss</button>
              </div>
            )}
            {panels.tools && (readOnly
              ? <div className="no-print absolute inset-y-0 left-0 z-30 w-52 border-r border-line bg-white p-3 text-sm text-note shadow md:static md:w-auto md:shadow-none" data-testid="tools-panel">Read only: {plan.status === 'draft' || plan.status === 'returned' ? 'your role may view this plan, not change it.' : `the plan is ${plan.status}.`}</div>
              : <div className="no-print absolute inset-y-0 left-0 z-30 w-52 min-h-0 shadow md:static md:w-auto md:shadow-none" data-testid="tools-panel"><Palette onPlace={placeKind} /></div>)}
            <div ref={canvasBox} className="bm-canvas-box relative min-h-[55vh] min-w-0 md:min-h-0">
              <div className="no-print absolute bottom-2 right-2 z-10 flex gap-1">
                <button type="button" className="btn bg-white text-sm" aria-pressed={panels.tools} onClick={() => fold('tools')}>{panels.tools ? 'Fold tools' : 'Tools'}</button>
                <button type="button" className="btn bg-white text-sm" aria-pressed={panels.props} onClick={() => fold('props')}>{panels.props ? 'Fold details' : 'Details'}</button>
              </div>
              <Canvas onInit={(inst) => (rf.current = inst)} onDrawn={onCanvasDrawn} />
            </div>
            {panels.props && <div className="no-print absolute inset-y-0 right-0 z-30 w-72 min-h-0 shadow md:static md:w-auto md:shadow-none" data-testid="details-panel"><Inspector /></div>}
          </div>
          <div className="no-print"><Drawer onShow={centreOn} /></div>
        </div>
        <div className="bm-print-only" aria-hidden="true">
          {sheetOpen && <PrintSheet doc={store.getState().doc} report={store.getState().report} meta={meta} units={store.getState().units} widths={nodeWidths(canvasBox.current)} />}
        </div>
        {conflict && (
          <ConflictDialog yourRevision={baseRevision} currentRevision={conflict.currentRevision}
            onReloadTheirs={() => {
              if (conflict.document) store.getState().reloadFromServer(conflict.document, conflict.currentRevision);
              else window.location.reload();
            }}
            onKeepMine={() => { store.getState().keepMine(); void sync.current?.saveNow(); }} />
        )}
        <BondCaution />
        <SignedOutDialog planId={plan.id} onResume={() => void sync.current?.resumeAfterSignIn()} />
        {importIssues && <ImportProblems fileName={importIssues.name} issues={importIssues.issues} onClose={() => setImportIssues(null)} />}
      </ReactFlowProvider>
    </EditorStoreContext.Provider>
  );
}

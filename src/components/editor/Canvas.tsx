/**
 * The canvas: React Flow drawing the plan document from the store. Drag, tap, box-select,
 * pinch and pan come from React Flow; placing, linking, long-press menus and keyboard moves
 * call store verbs.
 */
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import ReactFlow, { Background, ConnectionMode, Controls, type NodeChange, type EdgeChange, type Connection, type ReactFlowInstance } from 'reactflow';
import type { NodeKind } from '@/lib/schemas/plan';
import { edgeTypes } from './edges/LinkEdge';
import { nodeTypes } from './nodes/PlanNodeView';
import { ContextMenu, type MenuItem } from './panels/ContextMenu';
import { DRAG_TYPE } from './panels/Palette';
import { ZoomBand } from './ZoomBand';
import { useWhenDrawn } from './when-drawn';
import { GRID } from './store';
import { toFlowEdges, toFlowNodes, useEditor, useEditorStore, withDragPositions, type NodeSize, type NodeSizes } from './selectors';
import type { Point } from './plan-ops';

export interface CanvasProps {
  onInit: (rf: ReactFlowInstance) => void;
  /** When given, a tap on a node (no link tool armed) calls this instead of selecting it: once per gesture. */
  onTapNode?: (id: string) => void;
  /** Called once, after the frame in which every element was first drawn (measured by React Flow). */
  onDrawn?: () => void;
}

interface MenuState { x: number; y: number; id: string | null }
const LONG_PRESS_MS = 550;
/** How far a finger may wander and still tap, px. */
const TAP_SLOP = 10;
const nodeIdAt = (target: EventTarget | null): string | null =>
  ((target as HTMLElement | null)?.closest?.('.react-flow__node') as HTMLElement | null)?.dataset.id ?? null;

// Props React Flow copies into its own store whenever their identity changes, and every such copy
// re-renders all nodes and edges: so constants live here and handlers below are stable callbacks.
const SNAP_GRID: [number, number] = [GRID, GRID];
const MULTI_SELECT_KEYS = ['Meta', 'Control', 'Shift'];
const FIT_VIEW_OPTIONS = { padding: 0.2, maxZoom: 1.2 };
const PRO_OPTIONS = { hideAttribution: true };

export function Canvas({ onInit, onTapNode, onDrawn }: CanvasProps) {
  const store = useEditorStore();
  const doc = useEditor((s) => s.doc);
  const selection = useEditor((s) => s.selection);
  const readOnly = useEditor((s) => s.readOnly);
  const snap = useEditor((s) => s.snap);
  const linkTool = useEditor((s) => s.linkTool);
  const rf = useRef<ReactFlowInstance | null>(null);
  const onInitRef = useRef(onInit);
  onInitRef.current = onInit;
  const onTapNodeRef = useRef(onTapNode);
  onTapNodeRef.current = onTapNode;
  const wrapper = useRef<HTMLDivElement>(null);
  const [menu, setMenu] = useState<MenuState | null>(null);
  const press = useRef<{ timer: ReturnType<typeof setTimeout>; x: number; y: number } | null>(null);
  // The one pointer gesture that can become a tap: where it went down and on which node.
  const tap = useRef<{ pointerId: number; x: number; y: number; t: number; node: string | null } | null>(null);

  // Sizes React Flow measured, handed back on the nodes (see toFlowNodes); a new map only when one changes.
  const [sizes, setSizes] = useState<NodeSizes>(() => new Map());

  // A drag lives here and in React Flow until the drop: each pointer move re-renders the canvas
  // alone (the store, its subscribers, the check and autosave do not hear of it), and the drop
  // writes the final positions into the document as one undo step.
  const drag = useRef<Map<string, Point> | null>(null);
  const [dragPositions, setDragPositions] = useState<ReadonlyMap<string, Point> | null>(null);
  const endDrag = useCallback(() => {
    const moved = drag.current;
    if (!moved) return;
    drag.current = null;
    store.getState().moveNodes(moved);
    setDragPositions(null);
  }, [store]);

  const docNodes = useMemo(() => toFlowNodes(doc, selection, !readOnly, sizes), [doc, selection, readOnly, sizes]);
  const nodes = useMemo(() => withDragPositions(docNodes, dragPositions), [docNodes, dragPositions]);
  // Keyed on the links, not the document: moving a node keeps `doc.links`, so the edges array
  // stays the same object and React Flow is not handed (and does not re-process) a new one.
  const links = doc.links;
  const edges = useMemo(() => toFlowEdges({ links }, selection), [links, selection]);
  const large = doc.nodes.length + doc.links.length > 400;

  const onNodesChange = useCallback((changes: NodeChange[]) => {
    const moves = new Map<string, Point>();
    let dragged: Map<string, Point> | null = null;
    let dropped = false;
    let selected: Set<string> | null = null;
    let measured: Map<string, NodeSize> | null = null;
    for (const c of changes) {
      if (c.type === 'position') {
        // While dragging React Flow sends positions with `dragging`; at the drop, one without a position.
        if (c.position && c.dragging) (dragged ??= new Map(drag.current ?? [])).set(c.id, c.position);
        else if (c.position) moves.set(c.id, c.position);
        else if (!c.dragging) dropped = true;
      }
      if (c.type === 'dimensions' && c.dimensions) (measured ??= new Map()).set(c.id, c.dimensions);
      if (c.type === 'select') {
        selected ??= new Set(store.getState().selection);
        if (c.selected) selected.add(c.id);
        else selected.delete(c.id);
      }
    }
    if (measured) {
      const next = measured;
      setSizes((prev) => {
        let changed: Map<string, NodeSize> | null = null;
        for (const [id, d] of next) {
          const was = prev.get(id);
          if (was && was.width === d.width && was.height === d.height) continue;
          (changed ??= new Map(prev)).set(id, { width: d.width, height: d.height });
        }
        return changed ?? prev;
      });
    }
    if (dragged) {
      drag.current = dragged;
      setDragPositions(dragged);
    }
    if (dropped) endDrag();
    if (moves.size) store.getState().moveNodes(moves);
    if (selected && !store.getState().linkTool) store.getState().select([...selected]);
  }, [store, endDrag]);

  const onEdgesChange = useCallback((changes: EdgeChange[]) => {
    let selected: Set<string> | null = null;
    for (const c of changes) {
      if (c.type === 'select') {
        selected ??= new Set(store.getState().selection);
        if (c.selected) selected.add(c.id);
        else selected.delete(c.id);
      }
    }
    if (selected && !store.getState().linkTool) store.getState().select([...selected]);
  }, [store]);

  const onConnect = useCallback((c: Connection) => {
    if (!c.source || !c.target) return;
    const s = store.getState();
    const fromWorker = s.doc.nodes.find((n) => n.id === c.source)?.kind === 'worker';
    s.connect(s.linkTool ?? (fromWorker ? 'reach' : 'jumper'), c.source, c.target);
  }, [store]);

  const onDrop = useCallback((e: React.DragEvent) => {
    const kind = e.dataTransfer.getData(DRAG_TYPE) as NodeKind;
    if (!kind || !rf.current || store.getState().readOnly) return;
    e.preventDefault();
    const p = rf.current.screenToFlowPosition({ x: e.clientX, y: e.clientY });
    store.getState().addNode(kind, { x: p.x - 28, y: p.y - 28 });
  }, [store]);

  const openMenuAt = useCallback((x: number, y: number, target: EventTarget | null) => {
    const el = target as HTMLElement | null;
    const nodeEl = el?.closest?.('.react-flow__node') as HTMLElement | null;
    const edgeEl = el?.closest?.('.react-flow__edge') as HTMLElement | null;
    const id = nodeEl?.dataset.id ?? edgeEl?.getAttribute('data-testid')?.replace(/^rf__edge-/, '') ?? null;
    if (id && !store.getState().selection.includes(id)) store.getState().select([id]);
    setMenu({ x, y, id });
  }, [store]);
  const onFlowInit = useCallback((inst: ReactFlowInstance) => { rf.current = inst; onInitRef.current(inst); }, []);
  const onPaneClick = useCallback(() => { store.getState().clearSelection(); setMenu(null); }, [store]);
  const onElementContextMenu = useCallback((e: React.MouseEvent) => { e.preventDefault(); openMenuAt(e.clientX, e.clientY, e.target); }, [openMenuAt]);
  const onPaneContextMenu = useCallback((e: React.MouseEvent) => { e.preventDefault(); openMenuAt(e.clientX, e.clientY, null); }, [openMenuAt]);
  const cancelPress = () => {
    if (press.current) clearTimeout(press.current.timer);
    press.current = null;
  };
  const onPointerDown = (e: React.PointerEvent) => {
    if (e.isPrimary) tap.current = { pointerId: e.pointerId, x: e.clientX, y: e.clientY, t: Date.now(), node: nodeIdAt(e.target) };
    else tap.current = null; // a second finger: a pinch, never a tap
    if (e.pointerType === 'mouse') return;
    cancelPress();
    const { clientX, clientY, target } = e;
    press.current = { x: clientX, y: clientY, timer: setTimeout(() => openMenuAt(clientX, clientY, target), LONG_PRESS_MS) };
  };
  const onPointerMove = (e: React.PointerEvent) => {
    if (press.current && Math.hypot(e.clientX - press.current.x, e.clientY - press.current.y) > 10) cancelPress();
  };
  /**
   * Every tap on a node, from a mouse, a finger or a pen, arrives here exactly once (one
   * pointerdown–pointerup pair on the same node, short and still). Taps with a link tool armed
   * draw links only here, so no input can deliver the same gesture twice; without a tool a tap
   * selects the node wherever on its symbol it lands.
   */
  const onPointerUp = (e: React.PointerEvent) => {
    cancelPress();
    // A drag React Flow gave up (a second finger) sends no drop: the lifted pointer ends it.
    endDrag();
    const t = tap.current;
    tap.current = null;
    if (!t || t.pointerId !== e.pointerId || !t.node || e.button > 0) return;
    if (Math.hypot(e.clientX - t.x, e.clientY - t.y) > TAP_SLOP || Date.now() - t.t > LONG_PRESS_MS) return;
    if (nodeIdAt(document.elementFromPoint(e.clientX, e.clientY)) !== t.node) return;
    const s = store.getState();
    if (s.linkTool) s.tapElement(t.node, e.shiftKey);
    else if (onTapNodeRef.current) onTapNodeRef.current(t.node);
    else if (!e.shiftKey && !e.ctrlKey && !e.metaKey) s.select([t.node]);
  };
  useEffect(() => cancelPress, []);

  useWhenDrawn(onDrawn);

  const menuItems = (id: string | null): MenuItem[] => {
    const s = store.getState();
    if (s.readOnly) return [{ label: 'Zoom to fit', onSelect: () => rf.current?.fitView({ padding: 0.2 }) }];
    if (!id) {
      return [
        { label: 'Paste', onSelect: s.paste, disabled: !s.clipboard },
        { label: 'Select all', onSelect: s.selectAll },
        { label: 'Zoom to fit', onSelect: () => rf.current?.fitView({ padding: 0.2 }) },
      ];
    }
    const node = s.doc.nodes.find((n) => n.id === id);
    const items: MenuItem[] = [];
    if (node) {
      const kinds = node.kind === 'worker' ? (['reach'] as const) : (['jumper', 'bond'] as const);
      for (const k of kinds) items.push({ label: `Draw ${k} from ${id}`, onSelect: () => { s.armLinkTool(k); store.getState().tapElement(id); } });
      items.push({ label: 'Add to selection', onSelect: () => store.getState().select([...store.getState().selection.filter((x) => x !== id), id]) });
    }
    const link = s.doc.links.find((l) => l.id === id);
    if (link && link.kind !== 'reach') items.push({ label: 'Add a parallel lead', onSelect: () => store.getState().addParallel(id) });
    items.push(
      { label: 'Copy', onSelect: () => store.getState().copySelection() },
      { label: 'Duplicate', onSelect: () => store.getState().duplicateSelection() },
      { label: `Delete ${store.getState().selection.length > 1 ? `${store.getState().selection.length} elements` : id}`, onSelect: () => store.getState().deleteSelection() },
    );
    return items;
  };

  return (
    <div
      ref={wrapper}
      className={`bm-canvas relative h-full w-full ${linkTool ? 'bm-linking' : ''}`}
      data-testid="canvas"
      onPointerDown={onPointerDown}
      onPointerMove={onPointerMove}
      onPointerUp={onPointerUp}
      onPointerCancel={() => { cancelPress(); endDrag(); }}
      onDragOver={(e) => { if (e.dataTransfer.types.includes(DRAG_TYPE)) { e.preventDefault(); e.dataTransfer.dropEffect = 'copy'; } }}
      onDrop={onDrop}
    >
      <ReactFlow
        nodes={nodes}
        edges={edges}
        nodeTypes={nodeTypes}
        edgeTypes={edgeTypes}
        onInit={onFlowInit}
        onNodesChange={onNodesChange}
        onEdgesChange={onEdgesChange}
        onPaneClick={onPaneClick}
        onNodeContextMenu={onElementContextMenu}
        onEdgeContextMenu={onElementContextMenu}
        onPaneContextMenu={onPaneContextMenu}
        onConnect={onConnect}
        connectionMode={ConnectionMode.Loose}
        connectOnClick={false}
        connectionRadius={36}
        nodesConnectable={!readOnly && !linkTool}
        nodesDraggable={!readOnly && !linkTool}
        elementsSelectable={!linkTool}
        snapToGrid={snap}
        snapGrid={SNAP_GRID}
        deleteKeyCode={null}
        selectionKeyCode="Shift"
        multiSelectionKeyCode={MULTI_SELECT_KEYS}
        disableKeyboardA11y
        // The editor's own keys move between elements; focusable edges would be buttons whose name
        // ("Edge from A to CB") does not contain their visible cable tag (axe: label-content-name-mismatch).
        edgesFocusable={false}
        onlyRenderVisibleElements={large}
        minZoom={0.1}
        maxZoom={3}
        fitView
        fitViewOptions={FIT_VIEW_OPTIONS}
        proOptions={PRO_OPTIONS}
        zoomOnDoubleClick={false}
      >
        <Background gap={GRID} size={1} color="#d0d5dd" />
        <Controls showInteractive={false} className="no-print" />
        <ZoomBand target={wrapper} />
      </ReactFlow>
      {menu && <ContextMenu x={menu.x} y={menu.y} title={menu.id ?? 'Canvas'} items={menuItems(menu.id)} onClose={() => setMenu(null)} />}
    </div>
  );
}

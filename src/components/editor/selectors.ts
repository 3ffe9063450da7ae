/**
 * Reading the editor store from React, and the derived views the canvas needs: React Flow nodes
 * and edges built from the plan document (identity kept per element so memo'd nodes skip
 * re-rendering), and the worst finding severity per element.
 */
import { createContext, useContext } from 'react';
import type { Edge, Node } from 'reactflow';
import { useStore } from 'zustand';
import type { CheckReport, ReportContact, Severity } from '@/lib/domain/report';
import type { PlanDocument, PlanLink, PlanNode } from '@/lib/schemas/plan';
import type { EditorActions, EditorState, EditorStore } from './store';

export const EditorStoreContext = createContext<EditorStore | null>(null);

export function useEditor<T>(selector: (s: EditorState & EditorActions) => T): T {
  const store = useContext(EditorStoreContext);
  if (!store) throw new Error('useEditor outside <EditorStoreContext.Provider>');
  return useStore(store, selector);
}

export function useEditorStore(): EditorStore {
  const store = useContext(EditorStoreContext);
  if (!store) throw new Error('useEditorStore outside <EditorStoreContext.Provider>');
  return store;
}

const RANK: Record<Severity, number> = { blocker: 3, warning: 2, note: 1 };

const severityCache = new WeakMap<CheckReport, Map<string, Severity>>();
/** The worst severity of any finding naming each element. */
export function severityByElement(report: CheckReport | null): Map<string, Severity> {
  if (!report) return new Map();
  let map = severityCache.get(report);
  if (!map) {
    map = new Map();
    for (const f of report.findings) {
      for (const id of f.elements) {
        const prev = map.get(id);
        if (!prev || RANK[f.severity] > RANK[prev]) map.set(id, f.severity);
      }
    }
    severityCache.set(report, map);
  }
  return map;
}

const worstCache = new WeakMap<CheckReport, Map<string, ReportContact>>();
/**
 * The contact with the highest share of its limit for each worker (only contacts that were
 * solved), worked out once per report: every worker's badge reads it on every store change.
 */
export function worstContactByWorker(report: CheckReport | null): ReadonlyMap<string, ReportContact> {
  if (!report) return NO_CONTACTS;
  let map = worstCache.get(report);
  if (!map) {
    map = new Map();
    for (const c of report.contacts) {
      if (c.bodyAmps === null || !c.limitAmps) continue;
      const was = map.get(c.worker);
      if (!was || c.bodyAmps / c.limitAmps > was.bodyAmps! / was.limitAmps!) map.set(c.worker, c);
    }
    worstCache.set(report, map);
  }
  return map;
}
const NO_CONTACTS: ReadonlyMap<string, ReportContact> = new Map();

/** The contact with the highest share of its limit for a worker, or null when none was solved. */
export const worstContact = (report: CheckReport | null, workerId: string): ReportContact | null => worstContactByWorker(report).get(workerId) ?? null;

export const selectSeverityOf = (id: string) => (s: EditorState) => severityByElement(s.report).get(id) ?? null;
export const selectSelection = (s: EditorState) => s.selection;
export const selectDoc = (s: EditorState) => s.doc;

/** A node's drawn size as React Flow measured it; kept beside the document, never saved. */
export interface NodeSize { width: number; height: number }
export type NodeSizes = ReadonlyMap<string, NodeSize>;
const NO_SIZES: NodeSizes = new Map();

interface CachedNode { selected: boolean; draggable: boolean; size: NodeSize | undefined; rf: Node<PlanNode> }
const nodeCache = new WeakMap<PlanNode, CachedNode[]>();
/**
 * React Flow nodes for the document; `data` is the plan node itself (saveable data only). The
 * measured `width`/`height` go on the React Flow node (a controlled flow must hand them back, or
 * React Flow treats every node as unmeasured on each update and measures them all again), and an
 * element whose plan node, selection, size and draggability are unchanged keeps its object.
 */
export function toFlowNodes(doc: PlanDocument, selection: readonly string[], draggable = true, sizes: NodeSizes = NO_SIZES): Node<PlanNode>[] {
  const selected = new Set(selection);
  return doc.nodes.map((n) => {
    const isSelected = selected.has(n.id);
    const size = sizes.get(n.id);
    const entries = nodeCache.get(n);
    const cached = entries?.find((c) => c.selected === isSelected && c.draggable === draggable && c.size === size);
    if (cached) return cached.rf;
    const rf: Node<PlanNode> = { id: n.id, type: n.kind, position: n.position ?? { x: 0, y: 0 }, data: n, selected: isSelected, draggable, ...(size ? { width: size.width, height: size.height } : {}) };
    nodeCache.set(n, [...(entries ?? []).slice(-1), { selected: isSelected, draggable, size, rf }]);
    return rf;
  });
}

/**
 * The nodes with the positions of a drag in progress laid over them: only the dragged nodes get
 * new objects, so React Flow re-renders those alone. The document is not touched until the drop.
 */
export function withDragPositions(nodes: Node<PlanNode>[], positions: ReadonlyMap<string, { x: number; y: number }> | null): Node<PlanNode>[] {
  if (!positions?.size) return nodes;
  return nodes.map((n) => {
    const p = positions.get(n.id);
    return p ? { ...n, position: p } : n;
  });
}

/**
 * The links of selected elements are drawn in a layer of their own (React Flow puts each z-index in
 * its own SVG), both below the nodes: dragging a node then redraws that small layer, and the
 * browser keeps the big one of all other links as it was painted.
 */
const LINK_LAYER = -1;
const LIFTED_LINK_LAYER = 0;

const edgeCache = new WeakMap<PlanLink, { selected: boolean; lifted: boolean; rf: Edge<PlanLink> }[]>();
export function toFlowEdges(doc: Pick<PlanDocument, 'links'>, selection: readonly string[]): Edge<PlanLink>[] {
  const selected = new Set(selection);
  return doc.links.map((l) => {
    const isSelected = selected.has(l.id);
    const lifted = isSelected || selected.has(l.from) || selected.has(l.to);
    const entries = edgeCache.get(l);
    const cached = entries?.find((c) => c.selected === isSelected && c.lifted === lifted);
    if (cached) return cached.rf;
    const rf: Edge<PlanLink> = { id: l.id, type: l.kind, source: l.from, target: l.to, data: l, selected: isSelected, zIndex: lifted ? LIFTED_LINK_LAYER : LINK_LAYER };
    edgeCache.set(l, [...(entries ?? []).slice(-1), { selected: isSelected, lifted, rf }]);
    return rf;
  });
}

export function findElement(doc: PlanDocument, id: string): PlanNode | PlanLink | undefined {
  return doc.nodes.find((n) => n.id === id) ?? doc.links.find((l) => l.id === id);
}

export const isLink = (e: PlanNode | PlanLink): e is PlanLink => e.kind === 'jumper' || e.kind === 'bond' || e.kind === 'reach';

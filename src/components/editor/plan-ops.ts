/**
 * Pure edits of a plan document for the editor: each takes a document and returns a new one,
 * never mutating its input, so undo is a list of earlier documents and every edit is testable
 * without React.
 */
import { METRES_PER_FOOT, type UnitSystem } from '@/lib/domain/units';
import type { LinkKind, NodeKind, PlanDocument, PlanLink, PlanNode } from '@/lib/schemas/plan';

export interface Point { x: number; y: number }
export interface Clipboard { nodes: PlanNode[]; links: PlanLink[] }

const NODE_PREFIX: Record<NodeKind, string> = {
  phase: 'PH', neutral: 'N', 'shield-wire': 'SW', structure: 'S', crossarm: 'X', hardware: 'H', 'cluster-bar': 'CB',
  'ground-rod': 'R', earth: 'E', bucket: 'BK', truck: 'T', mat: 'M', 'pole-ground': 'PG', worker: 'W',
  'supply-end': 'SE',
};
const LINK_PREFIX: Record<LinkKind, string> = { jumper: 'j', bond: 'b', reach: 'r' };

export const KIND_LABELS: Record<NodeKind, string> = {
  phase: 'Phase', neutral: 'Neutral', 'shield-wire': 'Shield wire', structure: 'Structure', crossarm: 'Crossarm',
  hardware: 'Hardware', 'cluster-bar': 'Cluster bar', 'ground-rod': 'Ground rod', earth: 'Earth', bucket: 'Bucket',
  truck: 'Truck', mat: 'Mat', 'pole-ground': 'Pole ground', worker: 'Worker', 'supply-end': 'Supply end',
};
export const LINK_LABELS: Record<LinkKind, string> = { jumper: 'Jumper', bond: 'Bond', reach: 'Reach' };

export function allIds(doc: PlanDocument): Set<string> {
  return new Set([...doc.nodes.map((n) => n.id), ...doc.links.map((l) => l.id)]);
}

/** The first free id with this prefix: "CB", "CB2", "CB3" … (or "j1", "j2" for links). */
export function nextId(taken: Set<string>, prefix: string): string {
  const numbered = prefix.length <= 1 || /[a-z]$/.test(prefix);
  if (!numbered && !taken.has(prefix)) return prefix;
  for (let i = numbered ? 1 : 2; ; i++) if (!taken.has(`${prefix}${i}`)) return `${prefix}${i}`;
}

export const snapPoint = (p: Point, grid: number): Point => ({ x: Math.round(p.x / grid) * grid, y: Math.round(p.y / grid) * grid });

/** A new node of `kind` with the defaults a crew would start from (edit them in the inspector). */
/**
 * Defaults a crew would start from, round in the units they work in: an 8 ft rod of 5/8 in and
 * 10 ft leads, or a 2.4 m rod of 16 mm and 3 m leads (common sizes; edit them to the job).
 */
const DEFAULTS: Record<UnitSystem, { rodM: number; rodMm: number; leadM: number }> = {
  imperial: { rodM: 8 * METRES_PER_FOOT, rodMm: (5 / 8) * 25.4, leadM: 10 * METRES_PER_FOOT },
  metric: { rodM: 2.4, rodMm: 16, leadM: 3 },
};

export function createNode(doc: PlanDocument, kind: NodeKind, position: Point, standsOn?: string, units: UnitSystem = 'metric'): PlanNode {
  const taken = allIds(doc);
  const id = nextId(taken, NODE_PREFIX[kind]);
  const base = { id, label: KIND_LABELS[kind], position };
  switch (kind) {
    case 'phase': {
      const used = new Set(doc.nodes.filter((n) => n.kind === 'phase').map((n) => (n as { phase?: string }).phase));
      const letter = ['A', 'B', 'C'].find((l) => !used.has(l)) ?? 'A';
      const pid = taken.has(letter) ? id : letter;
      return { ...base, id: pid, kind, phase: letter, label: `Phase ${letter}` } as PlanNode;
    }
    case 'structure':
    case 'crossarm':
      return { ...base, kind, material: 'wood' } as PlanNode;
    case 'ground-rod':
      return { ...base, kind, lengthM: DEFAULTS[units].rodM, diameterMm: DEFAULTS[units].rodMm, soilOhmM: 100 } as PlanNode;
    case 'bucket':
      return { ...base, kind, insulatedBoom: true } as PlanNode;
    case 'supply-end':
      // Feeds every phase of the plan until the crew lead narrows it down.
      return { ...base, kind, phases: doc.nodes.filter((n) => n.kind === 'phase').map((n) => n.id) } as PlanNode;
    case 'worker':
      // Stands nowhere until the user chooses: a guessed footing could make a plan look safe.
      return { ...base, kind, ...(standsOn ? { standsOn } : {}) } as PlanNode;
    default:
      return { ...base, kind } as PlanNode;
  }
}

/** Adds a node (a worker stands on `standsOn` if given, else on nothing yet). */
export function addNode(doc: PlanDocument, kind: NodeKind, position: Point, standsOn?: string, units: UnitSystem = 'metric'): { doc: PlanDocument; id: string } {
  const node = createNode(doc, kind, position, standsOn, units);
  return { doc: { ...doc, nodes: [...doc.nodes, node] }, id: node.id };
}

export function moveNodes(doc: PlanDocument, moves: ReadonlyMap<string, Point>): PlanDocument {
  if (moves.size === 0) return doc;
  return { ...doc, nodes: doc.nodes.map((n) => (moves.has(n.id) ? ({ ...n, position: moves.get(n.id)! } as PlanNode) : n)) };
}

/**
 * Removes nodes and links by id, with every link touching a removed node. A worker who stood on a
 * removed node stays and stands on nothing until the user chooses again (the check says so).
 */
export function removeElements(doc: PlanDocument, ids: Iterable<string>): PlanDocument {
  const gone = new Set(ids);
  const nodes = doc.nodes
    .filter((n) => !gone.has(n.id))
    .map((n) => {
      if (n.kind !== 'worker' || n.standsOn === undefined || !gone.has(n.standsOn)) return n;
      const rest = { ...n };
      delete rest.standsOn;
      return rest;
    });
  const links = doc.links.filter((l) => !gone.has(l.id) && !gone.has(l.from) && !gone.has(l.to));
  return nodes.length === doc.nodes.length && links.length === doc.links.length ? doc : { ...doc, nodes, links };
}

/** Why a link of this kind cannot join these two nodes, or null when it can. */
export function linkProblem(doc: PlanDocument, kind: LinkKind, from: string, to: string): string | null {
  if (from === to) return 'A link needs two different elements.';
  const a = doc.nodes.find((n) => n.id === from);
  const b = doc.nodes.find((n) => n.id === to);
  if (!a || !b) return 'Both ends must be elements on the plan.';
  if (kind === 'reach' && a.kind !== 'worker') return 'A reach starts at a worker: pick the worker first.';
  if (kind === 'reach' && b.kind === 'worker') return 'A worker reaches a surface, not another worker.';
  if (kind !== 'reach' && (a.kind === 'worker' || b.kind === 'worker')) return 'A worker is never a bonding path; join a worker with a reach.';
  return null;
}

const GROUND_KINDS = new Set<NodeKind>(['ground-rod', 'earth', 'pole-ground', 'neutral', 'shield-wire']);

/**
 * Why a bond between these two nodes is probably a mistake, or null. A bond is an existing
 * permanent connection and is checked for no rating; a phase, or the leads from the cluster bar
 * to the neutral or to ground, carry the fault current and need a rated jumper.
 */
export function bondCaution(doc: PlanDocument, from: string, to: string): string | null {
  const a = doc.nodes.find((n) => n.id === from);
  const b = doc.nodes.find((n) => n.id === to);
  if (!a || !b) return null;
  const kinds = [a.kind, b.kind];
  const why = kinds.includes('phase')
    ? 'joins a phase'
    : kinds.includes('cluster-bar') && kinds.some((k) => GROUND_KINDS.has(k))
      ? 'joins the cluster bar to the neutral or to ground'
      : null;
  if (!why) return null;
  return `A bond is an existing permanent connection, and the check rates no cable or clamp on it. This one ${why}, where the fault current flows: draw a jumper there unless a permanent connection really is in place.`;
}

/** The link of this kind already joining these two nodes (either way round), if any. */
export function sameLink(doc: PlanDocument, kind: LinkKind, from: string, to: string): PlanLink | undefined {
  return doc.links.find((l) => l.kind === kind && ((l.from === from && l.to === to) || (l.from === to && l.to === from)));
}

/**
 * Adds a link. A second link of the same kind between the same two nodes is refused unless
 * `parallel` says the user asked for a parallel lead: an accidental copy would halve the computed
 * touch voltage and make a plan look safer than it is.
 */
export function addLink(doc: PlanDocument, kind: LinkKind, from: string, to: string, parallel = false, units: UnitSystem = 'metric'): { doc: PlanDocument; id: string } | { error: string } {
  const problem = linkProblem(doc, kind, from, to);
  if (problem) return { error: problem };
  const twin = sameLink(doc, kind, from, to);
  if (twin && !parallel) {
    return { error: `${from} and ${to} are already joined by ${LINK_LABELS[kind].toLowerCase()} ${twin.id}. To add a second lead beside it, choose "Add a parallel lead" on ${twin.id}.` };
  }
  const id = nextId(allIds(doc), LINK_PREFIX[kind]);
  const link: PlanLink =
    kind === 'jumper' ? { id, kind, from, to, cable: '2/0', lengthM: DEFAULTS[units].leadM } : kind === 'bond' ? { id, kind, from, to } : { id, kind, from, to };
  return { doc: { ...doc, links: [...doc.links, link] }, id };
}

/** Replaces one node or link (same id) with a new version. */
export function replaceElement(doc: PlanDocument, element: PlanNode | PlanLink): PlanDocument {
  if (doc.nodes.some((n) => n.id === element.id)) {
    return { ...doc, nodes: doc.nodes.map((n) => (n.id === element.id ? (element as PlanNode) : n)) };
  }
  return { ...doc, links: doc.links.map((l) => (l.id === element.id ? (element as PlanLink) : l)) };
}

/** The selected nodes and the links among them (plus selected links whose both ends are copied too). */
export function copyElements(doc: PlanDocument, ids: Iterable<string>): Clipboard {
  const set = new Set(ids);
  const nodes = doc.nodes.filter((n) => set.has(n.id));
  const nodeIds = new Set(nodes.map((n) => n.id));
  const links = doc.links.filter((l) => nodeIds.has(l.from) && nodeIds.has(l.to));
  return structuredClone({ nodes, links });
}

/**
 * Pastes a clipboard with fresh ids, shifted by `offset`. A worker whose standing node was not
 * copied keeps standing on the original if it still exists, else on the first copied node it can.
 */
export function pasteClipboard(doc: PlanDocument, clip: Clipboard, offset: Point = { x: 40, y: 40 }): { doc: PlanDocument; ids: string[] } {
  const taken = allIds(doc);
  const map = new Map<string, string>();
  for (const n of clip.nodes) {
    const prefix = NODE_PREFIX[n.kind];
    const id = nextId(taken, prefix);
    taken.add(id);
    map.set(n.id, id);
  }
  const existing = new Set(doc.nodes.map((n) => n.id));
  const nodes = clip.nodes.map((n) => {
    const p = n.position ?? { x: 0, y: 0 };
    const copy = { ...n, id: map.get(n.id)!, position: { x: p.x + offset.x, y: p.y + offset.y } } as PlanNode;
    if (copy.kind === 'worker') {
      const was = copy.standsOn;
      const stand = was === undefined ? undefined : (map.get(was) ?? (existing.has(was) ? was : undefined));
      const rest = { ...copy };
      delete rest.standsOn;
      return stand ? { ...rest, standsOn: stand } : rest;
    }
    return copy;
  });
  const links = clip.links.map((l) => {
    const id = nextId(taken, LINK_PREFIX[l.kind]);
    taken.add(id);
    return { ...l, id, from: map.get(l.from)!, to: map.get(l.to)! } as PlanLink;
  });
  const ids = [...nodes.map((n) => n.id), ...links.map((l) => l.id)];
  return { doc: { ...doc, nodes: [...doc.nodes, ...nodes], links: [...doc.links, ...links] }, ids };
}

/** Gives every node without a position a place on a grid below the placed ones. */
export function placeUnpositioned(doc: PlanDocument, columns = 8, gap = 160): PlanDocument {
  if (doc.nodes.every((n) => n.position)) return doc;
  const maxY = doc.nodes.reduce((m, n) => (n.position ? Math.max(m, n.position.y) : m), -gap);
  let i = 0;
  const nodes = doc.nodes.map((n) => {
    if (n.position) return n;
    const position = { x: (i % columns) * gap, y: maxY + gap + Math.floor(i / columns) * gap * 0.75 };
    i++;
    return { ...n, position } as PlanNode;
  });
  return { ...doc, nodes };
}

/** Tab order for keyboard navigation: nodes by row, then column. */
export function readingOrder(doc: PlanDocument): string[] {
  return [...doc.nodes]
    .sort((a, b) => (a.position?.y ?? 0) - (b.position?.y ?? 0) || (a.position?.x ?? 0) - (b.position?.x ?? 0))
    .map((n) => n.id);
}

/** The nearest node from `fromId` in a direction (for arrow-key navigation), or null. */
export function nearestInDirection(doc: PlanDocument, fromId: string, dir: 'left' | 'right' | 'up' | 'down'): string | null {
  const from = doc.nodes.find((n) => n.id === fromId)?.position;
  if (!from) return null;
  let best: string | null = null;
  let bestScore = Infinity;
  for (const n of doc.nodes) {
    if (n.id === fromId || !n.position) continue;
    const dx = n.position.x - from.x;
    const dy = n.position.y - from.y;
    const along = dir === 'left' ? -dx : dir === 'right' ? dx : dir === 'up' ? -dy : dy;
    const across = dir === 'left' || dir === 'right' ? Math.abs(dy) : Math.abs(dx);
    if (along <= 0) continue;
    const score = along + 2 * across;
    if (score < bestScore) {
      bestScore = score;
      best = n.id;
    }
  }
  return best;
}

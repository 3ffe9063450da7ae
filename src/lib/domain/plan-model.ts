/**
 * Read-only helpers over a parsed plan document (docs/plan-format.md): lookups and the
 * electrical character of each node kind, so that zones, the network and rules agree on what
 * conducts.
 */
import type { LinkOf, NodeOf, PlanDocument, PlanLink, PlanNode } from '@/lib/schemas/plan';
import { rodInRange } from './calc/rods';

/** Kinds that carry current but are never trusted as the way to ground (docs/plan-format.md). */
const NEVER_RELIED_ON = new Set<PlanNode['kind']>(['pole-ground']);

/**
 * Kinds that are a connection to remote earth by themselves. A truck is deliberately absent: its
 * tyres and outriggers are no dependable path to earth, so a truck counts as ground only when it
 * is bonded to one of these (common practice: bond the truck to the work-zone ground).
 */
const GROUND_SOURCE_KINDS = new Set<PlanNode['kind']>(['neutral', 'shield-wire', 'earth']);

/**
 * Materials a clamp makes no connection to (docs/plan-format.md): wood and fiberglass insulate,
 * and a clamp on concrete touches only the concrete; a concrete structure's ground is its
 * brought-out ground wire, drawn as a `hardware` node with `groundOhms`.
 */
const NON_BONDING_MATERIALS = new Set(['wood', 'fiberglass', 'concrete']);

/** True for wood, fiberglass and concrete poles and crossarms, which are never a bonding path. */
export function isNonBonding(node: PlanNode): boolean {
  return (node.kind === 'structure' || node.kind === 'crossarm') && NON_BONDING_MATERIALS.has(node.material);
}

/**
 * True when a node can be part of a bonded zone and of the network: everything except
 * non-bonding material, people and supply-end markers. The one definition zones and the network
 * solve share.
 */
export function isConductive(node: PlanNode): boolean {
  return node.kind !== 'worker' && node.kind !== 'supply-end' && !isNonBonding(node);
}

/** True for a pole's existing ground wire: conducts, but a zone may not depend on it (docs/plan-format.md). */
export function isPoleGround(node: PlanNode): boolean {
  return NEVER_RELIED_ON.has(node.kind);
}

/**
 * True when the node is itself a connection to ground: neutral, shield wire, remote earth, a driven
 * rod inside the range of Dwight's formula, a steel structure on its own footing, or hardware
 * with a given `groundOhms` (a concrete structure's brought-out ground wire).
 */
export function isGroundSource(node: PlanNode): boolean {
  if (GROUND_SOURCE_KINDS.has(node.kind)) return true;
  if (node.kind === 'ground-rod') return rodInRange(node.lengthM, node.diameterMm);
  if (node.kind === 'hardware') return node.groundOhms !== undefined;
  return node.kind === 'structure' && node.material === 'steel';
}

/** True for the two link kinds that join conductors: temporary jumpers and permanent bonds. */
export function isBondingLink(link: PlanLink): link is LinkOf<'jumper'> | LinkOf<'bond'> {
  return link.kind === 'jumper' || link.kind === 'bond';
}

const LINE_CONDUCTORS = new Set<PlanNode['kind']>(['phase', 'neutral', 'shield-wire']);

/**
 * True for a bond that stands for a span of line, neutral or shield conductor between two
 * structures: marked `span: true`, or (the version-1 drawing convention) a bond between two nodes
 * of the same conductor kind. A span is rated by the line itself, not as a grounding jumper.
 */
export function isSpan(link: PlanLink, from: PlanNode | undefined, to: PlanNode | undefined): boolean {
  if (link.kind !== 'bond') return false;
  return link.span === true || (from !== undefined && to !== undefined && from.kind === to.kind && LINE_CONDUCTORS.has(from.kind));
}

/** A bucket whose boom is not insulated, and the truck it stands on. */
export interface BoomPath {
  bucket: string;
  truck: string;
}

/**
 * Buckets on a boom that is not insulated (`insulatedBoom: false`) and their truck (`onTruck`,
 * or the plan's only truck): the boom is a metallic path that puts the truck at the bucket's
 * potential. A bucket whose truck cannot be told gives no path (the rule says so).
 */
export function boomPaths(plan: PlanDocument): BoomPath[] {
  const trucks = plan.nodes.filter((n) => n.kind === 'truck');
  return plan.nodes.flatMap((node) => {
    if (node.kind !== 'bucket' || node.insulatedBoom !== false) return [];
    const truck = node.onTruck ?? (trucks.length === 1 ? trucks[0].id : undefined);
    return truck === undefined ? [] : [{ bucket: node.id, truck }];
  });
}

/** Lookups over one plan, built once per check. */
export interface PlanModel {
  plan: PlanDocument;
  /** Position of each node in `plan.nodes`, used for stable ordering. */
  nodeIndex: ReadonlyMap<string, number>;
  node(id: string | undefined): PlanNode | undefined;
  link(id: string): PlanLink | undefined;
  /** Human name for messages: `label (id)` when labelled, else the kind and id (`cluster bar CB`). */
  nameOf(id: string): string;
  nodesOf<K extends PlanNode['kind']>(kind: K): NodeOf<K>[];
  linksOf<K extends PlanLink['kind']>(kind: K): LinkOf<K>[];
  /** Reach links leaving one worker, in document order. */
  reachesOf(workerId: string): LinkOf<'reach'>[];
  /**
   * The node whose potential a reach touches: the surface, or for a reach to another worker
   * that worker's standing node (passing a tool or touching a person is a contact too).
   */
  reachTarget(reach: LinkOf<'reach'>): string | undefined;
  /** True for a jumper or bond with an end on an `earth` node: refused, it joins nothing. */
  isEarthLink(link: PlanLink): boolean;
}

/** Builds the lookups for a parsed (already valid) plan; ids are unique by then. */
export function buildPlanModel(plan: PlanDocument): PlanModel {
  const nodeById = new Map(plan.nodes.map((n) => [n.id, n] as const));
  const linkById = new Map(plan.links.map((l) => [l.id, l] as const));
  const nodeIndex = new Map(plan.nodes.map((n, i) => [n.id, i] as const));
  const reaches = new Map<string, LinkOf<'reach'>[]>();
  for (const link of plan.links) {
    if (link.kind !== 'reach') continue;
    const list = reaches.get(link.from) ?? [];
    list.push(link);
    reaches.set(link.from, list);
  }
  return {
    plan,
    nodeIndex,
    node: (id) => (id === undefined ? undefined : nodeById.get(id)),
    link: (id) => linkById.get(id),
    nameOf(id) {
      const element = nodeById.get(id) ?? linkById.get(id);
      const label = element?.label?.trim();
      if (label && label !== id) return `${label} (${id})`;
      return element ? `${element.kind.replace('-', ' ')} ${id}` : id;
    },
    nodesOf: <K extends PlanNode['kind']>(kind: K) => plan.nodes.filter((n): n is NodeOf<K> => n.kind === kind),
    linksOf: <K extends PlanLink['kind']>(kind: K) => plan.links.filter((l): l is LinkOf<K> => l.kind === kind),
    reachesOf: (workerId) => reaches.get(workerId) ?? [],
    reachTarget(reach) {
      const target = nodeById.get(reach.to);
      return target?.kind === 'worker' ? target.standsOn : reach.to;
    },
    isEarthLink: (link) => isBondingLink(link) && (nodeById.get(link.from)?.kind === 'earth' || nodeById.get(link.to)?.kind === 'earth'),
  };
}

/** First letter upper-cased, for a name that opens a sentence. */
export function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** Plain code-unit comparison, so ordering never depends on the machine's locale. */
export function compareIds(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

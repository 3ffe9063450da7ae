/**
 * Read-only helpers over a parsed plan document (shared/design/plan-format.md): lookups and the
 * electrical character of each node kind, so that zones and rules agree on what conducts.
 */
import type { LinkOf, NodeOf, PlanDocument, PlanLink, PlanNode } from '../schemas/plan';

/** Kinds that carry current but are never trusted as the way to ground (plan-format.md). */
const NEVER_RELIED_ON = new Set<PlanNode['kind']>(['pole-ground']);

/**
 * Kinds that are a connection to remote earth by themselves. A truck is deliberately absent: its
 * tyres and outriggers are no dependable path to earth, so a truck counts as ground only when it
 * is bonded to one of these (common practice: bond the truck to the work-zone ground).
 */
const GROUND_SOURCE_KINDS = new Set<PlanNode['kind']>(['neutral', 'shield-wire', 'earth', 'ground-rod']);

/** True for wood and fiberglass poles and crossarms, which are never a bonding path (plan-format.md). */
export function isInsulating(node: PlanNode): boolean {
  return (node.kind === 'structure' || node.kind === 'crossarm') && (node.material === 'wood' || node.material === 'fiberglass');
}

/** True when a node can be part of a bonded zone: everything except insulating material and people. */
export function isConductive(node: PlanNode): boolean {
  return node.kind !== 'worker' && !isInsulating(node);
}

/** True for a pole's existing ground wire: conducts, but a zone may not depend on it (plan-format.md). */
export function isPoleGround(node: PlanNode): boolean {
  return NEVER_RELIED_ON.has(node.kind);
}

/**
 * True when the node is itself a connection to ground: neutral, shield wire, remote earth, a driven
 * rod, or a steel or concrete structure standing on its own footing.
 */
export function isGroundSource(node: PlanNode): boolean {
  if (GROUND_SOURCE_KINDS.has(node.kind)) return true;
  return node.kind === 'structure' && (node.material === 'steel' || node.material === 'concrete');
}

/** True for the two link kinds that join conductors: temporary jumpers and permanent bonds. */
export function isBondingLink(link: PlanLink): link is LinkOf<'jumper'> | LinkOf<'bond'> {
  return link.kind === 'jumper' || link.kind === 'bond';
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

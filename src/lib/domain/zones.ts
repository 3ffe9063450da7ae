/**
 * Bonded zones: the sets of conductors that jumpers and bonds hold at one potential, the
 * equipotential work zone of OSHA 29 CFR 1910.269(n)(3).
 *
 * Decisions (see the rules for how each is reported):
 * - A zone is a connected component over `jumper` and `bond` links among conductive nodes. A link
 *   with a wood, fiberglass or concrete end joins nothing: a clamp there makes no electrical
 *   connection. Workers are never part of a zone; they stand on one.
 * - Every `earth` node is the same remote earth, so all earth nodes share one zone. Nothing can
 *   be clamped to remote earth: a link to an `earth` node joins nothing (earth-link reports it).
 * - A bucket on a boom that is not insulated is joined to its truck (plan-model boomPaths).
 * - A pole ground conducts, so it joins a zone, but it is never relied on: a node is solidly
 *   grounded only when it reaches a ground source without passing through a pole ground.
 * - Only the nodes that matter for the crew are held to that: phases, the nodes workers stand on
 *   and the surfaces they reach. A bonded guy that reaches ground only through the pole ground
 *   does not make the zone ungrounded unless someone can touch it.
 */
import type { PlanDocument } from '@/lib/schemas/plan';
import { boomPaths, buildPlanModel, compareIds, isBondingLink, isConductive, isGroundSource, isPoleGround, type PlanModel } from './plan-model';

export interface Zone {
  /** Node ids, sorted by code unit. */
  nodes: string[];
  /** Holds a ground source, and every phase, standing node and reached surface in it reaches that source without a pole ground. */
  grounded: boolean;
  /** Not grounded, and a pole ground is what stands in for the missing connection. */
  groundedOnlyViaPoleGround: boolean;
  /** Phases, standing nodes and reached surfaces of this zone that reach ground only through a pole ground. */
  poleGroundDependent: string[];
  /** Pole-ground nodes in this zone, sorted. */
  poleGrounds: string[];
}

/** Zones plus the per-node lookups the rules need. */
export interface ZoneMap {
  zones: Zone[];
  /** Index into `zones` for every conductive node; undefined for wood, fiberglass and workers. */
  zoneIndexOf(nodeId: string): number | undefined;
  /** True when the node reaches a ground source without passing through a pole ground. */
  isSolidlyGrounded(nodeId: string): boolean;
  /** True when both nodes are conductive and in one zone. */
  sameZone(a: string, b: string): boolean;
}

class DisjointSets {
  private parent: number[];
  constructor(size: number) {
    this.parent = Array.from({ length: size }, (_, i) => i);
  }
  find(i: number): number {
    let root = i;
    while (this.parent[root] !== root) root = this.parent[root];
    while (this.parent[i] !== root) [i, this.parent[i]] = [this.parent[i], root];
    return root;
  }
  union(a: number, b: number): void {
    const ra = this.find(a);
    const rb = this.find(b);
    if (ra !== rb) this.parent[Math.max(ra, rb)] = Math.min(ra, rb);
  }
}

/** Nodes that a crew's safety depends on being solidly grounded: phases, standing nodes, reached surfaces. */
function crewRelevantNodes(model: PlanModel): Set<string> {
  const relevant = new Set<string>(model.nodesOf('phase').map((n) => n.id));
  for (const worker of model.nodesOf('worker')) if (worker.standsOn !== undefined) relevant.add(worker.standsOn);
  for (const reach of model.linksOf('reach')) {
    const target = model.reachTarget(reach);
    if (target !== undefined) relevant.add(target);
  }
  return relevant;
}

/** Groups a plan's conductive nodes into bonded zones and decides which parts are solidly grounded. */
export function mapZones(model: PlanModel): ZoneMap {
  const nodes = model.plan.nodes;
  const index = model.nodeIndex;
  const conductive = nodes.map(isConductive);
  const all = new DisjointSets(nodes.length);
  // The same partition without pole grounds: which parts hold together without one.
  const core = new DisjointSets(nodes.length);
  const earthIndexes = nodes.flatMap((n, i) => (n.kind === 'earth' ? [i] : []));
  for (const i of earthIndexes.slice(1)) {
    all.union(earthIndexes[0], i);
    core.union(earthIndexes[0], i);
  }
  const join = (from: string, to: string) => {
    const a = index.get(from);
    const b = index.get(to);
    if (a === undefined || b === undefined || !conductive[a] || !conductive[b]) return;
    all.union(a, b);
    if (!isPoleGround(nodes[a]) && !isPoleGround(nodes[b])) core.union(a, b);
  };
  for (const link of model.plan.links) if (isBondingLink(link) && !model.isEarthLink(link)) join(link.from, link.to);
  for (const boom of boomPaths(model.plan)) join(boom.bucket, boom.truck);

  const coreSourced = new Set<number>();
  nodes.forEach((node, i) => {
    if (conductive[i] && !isPoleGround(node) && isGroundSource(node)) coreSourced.add(core.find(i));
  });
  const solid = (i: number) => conductive[i] && !isPoleGround(nodes[i]) && coreSourced.has(core.find(i));

  const relevant = crewRelevantNodes(model);
  const byRoot = new Map<number, number[]>();
  nodes.forEach((_, i) => {
    if (!conductive[i]) return;
    const root = all.find(i);
    const members = byRoot.get(root) ?? [];
    members.push(i);
    byRoot.set(root, members);
  });

  const zones: Zone[] = [];
  const zoneOfIndex = new Map<number, number>();
  const groups = [...byRoot.values()]
    .map((members) => members.map((i) => nodes[i].id).sort(compareIds))
    .sort((a, b) => compareIds(a[0], b[0]));
  for (const ids of groups) {
    const members = ids.map((id) => index.get(id) as number);
    const hasSource = members.some((i) => !isPoleGround(nodes[i]) && isGroundSource(nodes[i]));
    const poleGrounds = ids.filter((id) => isPoleGround(nodes[index.get(id) as number]));
    const dependent =
      poleGrounds.length === 0
        ? []
        : members.filter((i) => relevant.has(nodes[i].id) && !isPoleGround(nodes[i]) && !solid(i)).map((i) => nodes[i].id);
    const grounded = hasSource && dependent.length === 0;
    zones.push({
      nodes: ids,
      grounded,
      groundedOnlyViaPoleGround: !grounded && poleGrounds.length > 0,
      poleGroundDependent: dependent,
      poleGrounds,
    });
    for (const i of members) zoneOfIndex.set(i, zones.length - 1);
  }

  const zoneIndexOf = (id: string) => {
    const i = index.get(id);
    return i === undefined ? undefined : zoneOfIndex.get(i);
  };
  return {
    zones,
    zoneIndexOf,
    isSolidlyGrounded: (id) => {
      const i = index.get(id);
      return i !== undefined && solid(i);
    },
    sameZone: (a, b) => {
      const za = zoneIndexOf(a);
      return za !== undefined && za === zoneIndexOf(b);
    },
  };
}

/** Bonded zones of a plan (OSHA 29 CFR 1910.269(n)(3) equipotential zones), sorted by first node id. */
export function findZones(plan: PlanDocument): Zone[] {
  return mapZones(buildPlanModel(plan)).zones;
}

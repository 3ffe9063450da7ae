/**
 * The electrical network of a plan at the system frequency: which plan nodes are unknowns, which
 * branches join them, and the admittance matrix to factorise. Remote earth is the reference.
 */
import type { PlanDocument, PlanLink, PlanNode } from '@/lib/schemas/plan';
import { boomPaths, isConductive } from '@/lib/domain/plan-model';
import { BARE_STRANDS_OHMS, jumperImpedance } from './cable';
import type { Assumption } from './contract';
import { rodGroupOhms, rodInRange, type RodResistance } from './rods';
import type { SymmetricEntries } from './sparse';
import { radiusFromDiameterMm } from './units';

/** Index standing for remote earth in branch ends: the reference, not an unknown. */
export const REFERENCE = -1;

export { isConductive };

/** Resistance of a `bond` without `ohms`, Ω (docs/plan-format.md); also a boom that is not insulated. */
export const BOND_DEFAULT_OHMS = 1e-4;
/**
 * Floor for a link given as 0 Ω, Ω. A 1 µΩ branch keeps the matrix finite and the current through
 * the link computable; it is a hundred times below a default bond, so it changes no figure we report.
 */
export const ZERO_OHMS_FLOOR = 1e-6;

/** Resistances to remote earth assumed when the plan leaves them out, Ω, each reported as an Assumption. */
export const DEFAULT_GROUND_OHMS = {
  neutral: { value: 5, basis: 'assumed for a multigrounded neutral at the work location (common practice, no source)' },
  'shield-wire': { value: 10, basis: 'assumed for a shield wire grounded at adjacent structures (common practice, no source)' },
  steel: { value: 25, basis: 'assumed for a steel structure footing (common practice, no source)' },
} as const;

export type BranchKind = 'jumper' | 'bond' | 'ground' | 'boom';

export interface Network {
  /** Number of unknown node voltages. */
  size: number;
  /** Plan node id → unknown index, or REFERENCE; absent when the node is not part of the solve. */
  indexOf: Map<string, number>;
  /** Conductive plan nodes that have no path to remote earth; their potential is undefined. */
  floating: Set<string>;
  /** Branches, each an impedance (re + j·im, Ω) between two ends (unknown index or REFERENCE). */
  branchFrom: Int32Array;
  branchTo: Int32Array;
  branchRe: Float64Array;
  branchIm: Float64Array;
  /** The plan element each branch comes from: a link id, or the node id of a ground resistance. */
  branchElement: string[];
  branchKind: BranchKind[];
  /** Rod and rod-group resistances by node id. */
  rods: Map<string, RodResistance & { branch: number }>;
  assumptions: Assumption[];
}

interface RawBranch {
  from: string;
  to: string | null;
  re: number;
  im: number;
  element: string;
  kind: BranchKind;
}

/**
 * Resistance of a node to remote earth, Ω, or null when it has none we count on:
 * - a truck only when the plan gives `groundOhms` — its tyres insulate it otherwise;
 * - a pole ground never: the trade's rule is never to rely on it (it may be cut or corroded), so
 *   its earth connection is left open; it still conducts as a node, and bonds to it still count.
 */
function groundResistance(node: PlanNode, assumptions: Assumption[]): { ohms: number; rod?: RodResistance } | null {
  const assume = (value: number, basis: string) => {
    assumptions.push({ element: node.id, field: 'groundOhms', value, unit: 'ohm', basis });
    return { ohms: value };
  };
  switch (node.kind) {
    case 'neutral':
    case 'shield-wire':
      return node.groundOhms !== undefined ? { ohms: node.groundOhms } : assume(DEFAULT_GROUND_OHMS[node.kind].value, DEFAULT_GROUND_OHMS[node.kind].basis);
    case 'structure':
      // Concrete is no bonding path (isConductive): its footing is a `hardware` node with groundOhms.
      if (node.material !== 'steel') return null;
      return node.groundOhms !== undefined ? { ohms: node.groundOhms } : assume(DEFAULT_GROUND_OHMS.steel.value, DEFAULT_GROUND_OHMS.steel.basis);
    case 'truck':
    case 'hardware':
      return node.groundOhms !== undefined ? { ohms: node.groundOhms } : null;
    case 'ground-rod': {
      // Outside the range of Dwight's formula the rod is refused (rod-out-of-range): no ground.
      if (!rodInRange(node.lengthM, node.diameterMm)) return null;
      const rod = rodGroupOhms({
        soilOhmM: node.soilOhmM,
        lengthM: node.lengthM,
        radius: radiusFromDiameterMm(node.diameterMm),
        count: node.count ?? 1,
        spacingM: node.spacingM,
        arrangement: node.arrangement,
      });
      return { ohms: rod.ohms, rod };
    }
    default:
      return null;
  }
}

/**
 * Series impedance of a jumper or bond, Ω; a given `ohms` is exactly that pure resistance. A
 * jumper with bare strands under its clamps carries BARE_STRANDS_OHMS more (docs/engineering.md §4).
 */
export function linkImpedance(link: PlanLink, frequencyHz: number): { re: number; im: number } | null {
  if (link.kind === 'reach') return null;
  if (link.ohms !== undefined) return { re: Math.max(link.ohms, ZERO_OHMS_FLOOR), im: 0 };
  if (link.kind === 'bond') return { re: BOND_DEFAULT_OHMS, im: 0 };
  const z = jumperImpedance(link.cable, link.lengthM, frequencyHz);
  return { re: z.resistanceOhms + (link.connection === 'bare-strands' ? BARE_STRANDS_OHMS : 0), im: z.reactanceOhms };
}

/**
 * Builds the network of a plan: conductive nodes with a path to remote earth become unknowns
 * (`earth` nodes are the reference); jumpers, bonds, booms that are not insulated and ground
 * resistances become branches. A link to an `earth` node is refused (nothing can be clamped to
 * remote earth) and left out.
 */
export function buildNetwork(plan: PlanDocument): Network {
  const nodeById = new Map<string, PlanNode>(plan.nodes.map((node) => [node.id, node]));
  const assumptions: Assumption[] = [];
  const raw: RawBranch[] = [];
  const rodInfo = new Map<string, RodResistance>();
  for (const node of plan.nodes) {
    if (!isConductive(node) || node.kind === 'earth') continue;
    const ground = groundResistance(node, assumptions);
    if (!ground) continue;
    if (ground.rod) rodInfo.set(node.id, ground.rod);
    raw.push({ from: node.id, to: null, re: ground.ohms, im: 0, element: node.id, kind: 'ground' });
  }
  for (const link of plan.links) {
    const z = linkImpedance(link, plan.system.frequencyHz);
    const a = nodeById.get(link.from);
    const b = nodeById.get(link.to);
    if (!z || !a || !b || !isConductive(a) || !isConductive(b) || a.kind === 'earth' || b.kind === 'earth') continue;
    raw.push({ from: link.from, to: link.to, re: z.re, im: z.im, element: link.id, kind: link.kind as BranchKind });
  }
  for (const boom of boomPaths(plan)) {
    raw.push({ from: boom.bucket, to: boom.truck, re: BOND_DEFAULT_OHMS, im: 0, element: boom.bucket, kind: 'boom' });
  }
  const grounded = findGrounded(raw, nodeById);

  const indexOf = new Map<string, number>();
  const floating = new Set<string>();
  let size = 0;
  for (const node of plan.nodes) {
    if (!isConductive(node)) continue;
    if (node.kind === 'earth') indexOf.set(node.id, REFERENCE);
    else if (grounded.has(node.id)) indexOf.set(node.id, size++);
    else floating.add(node.id);
  }

  const kept = raw.filter((branch) => branch.to === null ? grounded.has(branch.from) : grounded.has(branch.from) && grounded.has(branch.to));
  const rods = new Map<string, RodResistance & { branch: number }>();
  kept.forEach((branch, i) => {
    const rod = branch.kind === 'ground' ? rodInfo.get(branch.element) : undefined;
    if (rod) rods.set(branch.element, { ...rod, branch: i });
  });
  const endIndex = (id: string | null) => (id === null ? REFERENCE : (indexOf.get(id) as number));
  return {
    size,
    indexOf,
    floating,
    branchFrom: Int32Array.from(kept, (b) => endIndex(b.from)),
    branchTo: Int32Array.from(kept, (b) => endIndex(b.to)),
    branchRe: Float64Array.from(kept, (b) => b.re),
    branchIm: Float64Array.from(kept, (b) => b.im),
    branchElement: kept.map((b) => b.element),
    branchKind: kept.map((b) => b.kind),
    rods,
    assumptions,
  };
}

/** Plan node ids joined to remote earth through branches (breadth-first from the reference). */
function findGrounded(raw: RawBranch[], nodeById: Map<string, PlanNode>): Set<string> {
  const neighbours = new Map<string, string[]>();
  const queue: string[] = [];
  const grounded = new Set<string>();
  const visit = (id: string) => {
    if (grounded.has(id) || nodeById.get(id)?.kind === 'earth') return;
    grounded.add(id);
    queue.push(id);
  };
  for (const branch of raw) {
    if (branch.to === null) continue;
    for (const [x, y] of [[branch.from, branch.to], [branch.to, branch.from]] as const) {
      const list = neighbours.get(x);
      if (list) list.push(y);
      else neighbours.set(x, [y]);
    }
  }
  for (const branch of raw) if (branch.to === null) visit(branch.from);
  for (let head = 0; head < queue.length; head++) for (const next of neighbours.get(queue[head]) ?? []) visit(next);
  return grounded;
}

/** Nodal admittance matrix of the network, S: Y_ii = Σ y, Y_ij = −Σ y over branches i–j. */
export function assembleAdmittance(network: Network): SymmetricEntries {
  const n = network.size;
  const diagRe = new Float64Array(n);
  const diagIm = new Float64Array(n);
  const pairIndex = new Map<number, number>();
  const rows: number[] = [];
  const cols: number[] = [];
  const offRe: number[] = [];
  const offIm: number[] = [];
  for (let b = 0; b < network.branchRe.length; b++) {
    const zr = network.branchRe[b];
    const zi = network.branchIm[b];
    const mag2 = zr * zr + zi * zi;
    const yr = zr / mag2;
    const yi = -zi / mag2;
    const i = network.branchFrom[b];
    const j = network.branchTo[b];
    if (i === j) continue; // both ends the same unknown or both the reference: carries nothing
    if (i !== REFERENCE) {
      diagRe[i] += yr;
      diagIm[i] += yi;
    }
    if (j !== REFERENCE) {
      diagRe[j] += yr;
      diagIm[j] += yi;
    }
    if (i === REFERENCE || j === REFERENCE) continue;
    const key = Math.min(i, j) * n + Math.max(i, j);
    let slot = pairIndex.get(key);
    if (slot === undefined) {
      slot = rows.length;
      pairIndex.set(key, slot);
      rows.push(i);
      cols.push(j);
      offRe.push(0);
      offIm.push(0);
    }
    offRe[slot] -= yr;
    offIm[slot] -= yi;
  }
  return { size: n, diagRe, diagIm, offRow: Int32Array.from(rows), offCol: Int32Array.from(cols), offRe: Float64Array.from(offRe), offIm: Float64Array.from(offIm) };
}

/**
 * Many current injections solved against one factor, in blocks: each right-hand side injects
 * `amps` at one end and draws it out at another (either may be remote earth). The network is
 * factored once; every right-hand side of a check (each phase's fault, each contact) goes through
 * the same factor.
 */
import { REFERENCE } from './network';
import { solveBlockInPlace, type LdlFactor } from './sparse';

/** Right-hand sides per block: enough to amortise walking L, small enough to stay in cache. */
export const BLOCK_SIZE = 16;

export interface Injection {
  /** Unknown index the current enters at, or REFERENCE. */
  into: number;
  /** Unknown index the current leaves by, or REFERENCE. */
  outOf: number;
}

/** Reads solution voltages of one right-hand side of a solved block, by unknown index. */
export interface SolvedColumn {
  /** Complex voltage difference |V_a − V_b|, V, between two unknown indices (REFERENCE = 0 V). */
  magnitudeBetween(a: number, b: number): number;
  /** Real and imaginary parts of V_a − V_b, V. */
  between(a: number, b: number): [number, number];
}

/**
 * One solved block: right-hand side `first + r` (r < count) has at elimination position `pos` the
 * voltage `values[pos·stride + 2r]` (real part) and `values[pos·stride + 2r + 1]` (imaginary part).
 * Position = factor.perm[unknown index]; remote earth is 0 V at position `factor.size` (a row of
 * zeros after the last unknown, so readers need no test for it — see `positionOf`).
 */
export interface SolvedBlock {
  first: number;
  count: number;
  stride: number;
  values: Float64Array;
}

/** Elimination position of an unknown index in a solved block; REFERENCE reads the row of zeros. */
export function positionOf(factor: LdlFactor, index: number): number {
  return index === REFERENCE ? factor.size : factor.perm[index];
}

/**
 * Ascending elimination positions a forward solve from `starts` (positions, −1 ignored) can reach:
 * each start and its ancestors in the elimination tree. `stamp` is scratch of the factor's size,
 * `tag` a value not yet written in it (so the scratch never needs clearing).
 */
export function forwardReach(factor: LdlFactor, starts: readonly number[], stamp: Int32Array, tag: number): Int32Array {
  const parent = factor.parent;
  const reached: number[] = [];
  for (const start of starts) {
    for (let j = start; j >= 0 && stamp[j] !== tag; j = parent[j]) {
      stamp[j] = tag;
      reached.push(j);
    }
  }
  return Int32Array.from(reached).sort();
}

/**
 * Solves every injection (each carrying `amps`, A) against the factor, a block at a time, and hands
 * each solved block to `visit`. The solutions are not kept: memory stays at one block. The forward
 * solve of a block walks only the elimination-tree paths of its injections.
 */
export function solveInjectionBlocks(factor: LdlFactor, injections: readonly Injection[], amps: number, visit: (block: SolvedBlock) => void): void {
  const n = factor.size;
  const perm = factor.perm;
  const values = new Float64Array((n + 1) * BLOCK_SIZE * 2); // the last row stays 0: remote earth
  const stamp = new Int32Array(n);
  for (let first = 0; first < injections.length; first += BLOCK_SIZE) {
    const count = Math.min(BLOCK_SIZE, injections.length - first);
    const stride = 2 * count;
    values.fill(0, 0, (n + 1) * stride);
    const starts: number[] = [];
    for (let r = 0; r < count; r++) {
      const { into, outOf } = injections[first + r];
      if (into !== REFERENCE) {
        values[perm[into] * stride + 2 * r] += amps;
        starts.push(perm[into]);
      }
      if (outOf !== REFERENCE) {
        values[perm[outOf] * stride + 2 * r] -= amps;
        starts.push(perm[outOf]);
      }
    }
    solveBlockInPlace(factor, values, count, forwardReach(factor, starts, stamp, first + 1));
    visit({ first, count, stride, values });
  }
}

/** The same solves as solveInjectionBlocks, handed over one right-hand side at a time with its position in the list. */
export function solveInjections(factor: LdlFactor, injections: readonly Injection[], amps: number, visit: (k: number, column: SolvedColumn) => void): void {
  solveInjectionBlocks(factor, injections, amps, ({ first, count, stride, values }) => {
    for (let r = 0; r < count; r++) {
      const between = (a: number, b: number): [number, number] => {
        const ia = positionOf(factor, a) * stride + 2 * r;
        const ib = positionOf(factor, b) * stride + 2 * r;
        return [values[ia] - values[ib], values[ia + 1] - values[ib + 1]];
      };
      visit(first + r, {
        between,
        magnitudeBetween(a, b) {
          const [vr, vi] = between(a, b);
          return Math.sqrt(vr * vr + vi * vi);
        },
      });
    }
  });
}

/**
 * The impedance seen between each pair of unknowns (either may be REFERENCE), Ω when the factor is
 * of an admittance matrix in S: z = (e_a − e_b)ᵀ·A⁻¹·(e_a − e_b) = wᵀ·D⁻¹·w with w = L⁻¹·(e_a − e_b)
 * (A = L·D·Lᵀ, complex symmetric, so no conjugate). Only the forward solve is needed, and it walks
 * the two ends' elimination-tree paths, not the whole network. Equal ends give 0.
 */
export function drivingPointImpedances(factor: LdlFactor, pairs: readonly Injection[]): { re: Float64Array; im: Float64Array } {
  const { size: n, perm, colPtr, rowPos, lRe, lIm, dRe, dIm } = factor;
  const re = new Float64Array(pairs.length);
  const im = new Float64Array(pairs.length);
  const wRe = new Float64Array(n);
  const wIm = new Float64Array(n);
  const stamp = new Int32Array(n);
  pairs.forEach(({ into, outOf }, k) => {
    if (into === outOf) return;
    const starts: number[] = [];
    if (into !== REFERENCE) {
      wRe[perm[into]] += 1;
      starts.push(perm[into]);
    }
    if (outOf !== REFERENCE) {
      wRe[perm[outOf]] -= 1;
      starts.push(perm[outOf]);
    }
    let zr = 0;
    let zi = 0;
    for (const j of forwardReach(factor, starts, stamp, k + 1)) {
      const vr = wRe[j];
      const vi = wIm[j];
      wRe[j] = 0;
      wIm[j] = 0;
      if (vr === 0 && vi === 0) continue;
      for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
        const i = rowPos[p];
        wRe[i] -= lRe[p] * vr - lIm[p] * vi;
        wIm[i] -= lRe[p] * vi + lIm[p] * vr;
      }
      // z += w_j² / d_j
      const sr = vr * vr - vi * vi;
      const si = 2 * vr * vi;
      const mag2 = dRe[j] * dRe[j] + dIm[j] * dIm[j];
      zr += (sr * dRe[j] + si * dIm[j]) / mag2;
      zi += (si * dRe[j] - sr * dIm[j]) / mag2;
    }
    re[k] = zr;
    im[k] = zi;
  });
  return { re, im };
}

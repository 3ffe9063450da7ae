/**
 * Many current injections solved against one factor, in blocks: each right-hand side injects
 * `amps` at one end and draws it out at another (either may be remote earth).
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
 * Solves every injection (each carrying `amps`, A) against the factor and hands each solution to
 * `visit` with its position in the list. The solutions are not kept: memory stays at one block.
 */
export function solveInjections(factor: LdlFactor, injections: readonly Injection[], amps: number, visit: (k: number, column: SolvedColumn) => void): void {
  const n = factor.size;
  const perm = factor.perm;
  const block = new Float64Array(n * BLOCK_SIZE * 2);
  for (let start = 0; start < injections.length; start += BLOCK_SIZE) {
    const count = Math.min(BLOCK_SIZE, injections.length - start);
    const stride = 2 * count;
    block.fill(0, 0, n * stride);
    for (let r = 0; r < count; r++) {
      const { into, outOf } = injections[start + r];
      if (into !== REFERENCE) block[perm[into] * stride + 2 * r] += amps;
      if (outOf !== REFERENCE) block[perm[outOf] * stride + 2 * r] -= amps;
    }
    solveBlockInPlace(factor, block, count);
    for (let r = 0; r < count; r++) {
      const offset = 2 * r;
      const column: SolvedColumn = {
        magnitudeBetween(a, b) {
          const ia = a === REFERENCE ? -1 : perm[a] * stride + offset;
          const ib = b === REFERENCE ? -1 : perm[b] * stride + offset;
          const vr = (ia < 0 ? 0 : block[ia]) - (ib < 0 ? 0 : block[ib]);
          const vi = (ia < 0 ? 0 : block[ia + 1]) - (ib < 0 ? 0 : block[ib + 1]);
          return Math.sqrt(vr * vr + vi * vi);
        },
        between(a, b) {
          const ia = a === REFERENCE ? -1 : perm[a] * stride + offset;
          const ib = b === REFERENCE ? -1 : perm[b] * stride + offset;
          return [(ia < 0 ? 0 : block[ia]) - (ib < 0 ? 0 : block[ib]), (ia < 0 ? 0 : block[ia + 1]) - (ib < 0 ? 0 : block[ib + 1])];
        },
      };
      visit(start + r, column);
    }
  }
}

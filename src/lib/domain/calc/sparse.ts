/**
 * Sparse LDLᵀ factorisation of a complex symmetric matrix (a nodal admittance matrix: symmetric,
 * not Hermitian), with a minimum-degree ordering. Grounding networks are mostly trees with a few
 * loops, so the factor has almost no fill and one factorisation serves every right-hand side.
 *
 * No pivoting: every branch of a grounding network has a positive resistance, so the real part of
 * the admittance matrix of its earthed part is positive definite and every leading minor is
 * non-zero. Parts with no path to earth must be left out before factorising (see network.ts).
 */

import { minimumDegreeOrder } from './ordering';

/** A symmetric complex matrix: its diagonal and its strictly-off-diagonal entries, each pair once. */
export interface SymmetricEntries {
  size: number;
  diagRe: Float64Array;
  diagIm: Float64Array;
  /** Off-diagonal entries (row, col), in either order, each unordered pair at most once. */
  offRow: Int32Array;
  offCol: Int32Array;
  offRe: Float64Array;
  offIm: Float64Array;
}

export interface LdlFactor {
  size: number;
  /** perm[original index] = position in the elimination order. */
  perm: Int32Array;
  /** Column pointers and row positions of L (strictly lower, in elimination positions). */
  colPtr: Int32Array;
  rowPos: Int32Array;
  /**
   * Elimination-tree parent of each position (the first row of its column of L), −1 for a root.
   * A forward solve from a right-hand side that is non-zero at a few positions only touches those
   * positions and their ancestors (the structure of L⁻¹·b is the closure of b's under this tree).
   */
  parent: Int32Array;
  lRe: Float64Array;
  lIm: Float64Array;
  dRe: Float64Array;
  dIm: Float64Array;
}

/** Factorises A = L·D·Lᵀ (complex symmetric, no conjugation) after a minimum-degree ordering. */
export function factorSymmetric(matrix: SymmetricEntries): LdlFactor {
  const n = matrix.size;
  const { order, pattern } = minimumDegreeOrder(n, matrix.offRow, matrix.offCol);
  const perm = new Int32Array(n);
  for (let k = 0; k < n; k++) perm[order[k]] = k;

  // Column structure of L in elimination positions, rows sorted ascending.
  const colPtr = new Int32Array(n + 1);
  for (let k = 0; k < n; k++) colPtr[k + 1] = colPtr[k] + pattern[order[k]].length;
  const rowPos = new Int32Array(colPtr[n]);
  for (let k = 0; k < n; k++) {
    const rows = pattern[order[k]].map((v) => perm[v]).sort((a, b) => a - b);
    rowPos.set(rows, colPtr[k]);
  }
  // Row structure: for each row j, the columns k < j holding an entry, with the entry's index.
  const rowCount = new Int32Array(n + 1);
  for (let p = 0; p < rowPos.length; p++) rowCount[rowPos[p] + 1]++;
  for (let j = 0; j < n; j++) rowCount[j + 1] += rowCount[j];
  const rowFill = rowCount.slice(0, n);
  const rowEntry = new Int32Array(rowPos.length);
  const rowCol = new Int32Array(rowPos.length);
  for (let k = 0; k < n; k++) {
    for (let p = colPtr[k]; p < colPtr[k + 1]; p++) {
      const slot = rowFill[rowPos[p]]++;
      rowEntry[slot] = p;
      rowCol[slot] = k;
    }
  }
  // Entries of A below the diagonal, grouped by column in elimination positions.
  const aPtr = new Int32Array(n + 1);
  const m = matrix.offRow.length;
  for (let e = 0; e < m; e++) aPtr[Math.min(perm[matrix.offRow[e]], perm[matrix.offCol[e]]) + 1]++;
  for (let j = 0; j < n; j++) aPtr[j + 1] += aPtr[j];
  const aFill = aPtr.slice(0, n);
  const aRow = new Int32Array(m);
  const aRe = new Float64Array(m);
  const aIm = new Float64Array(m);
  for (let e = 0; e < m; e++) {
    const i = perm[matrix.offRow[e]];
    const j = perm[matrix.offCol[e]];
    const slot = aFill[Math.min(i, j)]++;
    aRow[slot] = Math.max(i, j);
    aRe[slot] = matrix.offRe[e];
    aIm[slot] = matrix.offIm[e];
  }

  const lRe = new Float64Array(rowPos.length);
  const lIm = new Float64Array(rowPos.length);
  const dRe = new Float64Array(n);
  const dIm = new Float64Array(n);
  const wRe = new Float64Array(n);
  const wIm = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    wRe[j] = matrix.diagRe[order[j]];
    wIm[j] = matrix.diagIm[order[j]];
    for (let p = aPtr[j]; p < aPtr[j + 1]; p++) {
      wRe[aRow[p]] += aRe[p];
      wIm[aRow[p]] += aIm[p];
    }
    // Left-looking update from every earlier column k with L[j,k] ≠ 0.
    for (let s = rowCount[j]; s < rowCount[j + 1]; s++) {
      const k = rowCol[s];
      const q = rowEntry[s];
      const lr = lRe[q];
      const li = lIm[q];
      const tr = lr * dRe[k] - li * dIm[k];
      const ti = lr * dIm[k] + li * dRe[k];
      wRe[j] -= lr * tr - li * ti;
      wIm[j] -= lr * ti + li * tr;
      for (let p = q + 1; p < colPtr[k + 1]; p++) {
        const i = rowPos[p];
        wRe[i] -= lRe[p] * tr - lIm[p] * ti;
        wIm[i] -= lRe[p] * ti + lIm[p] * tr;
      }
    }
    const pr = wRe[j];
    const pi = wIm[j];
    const mag2 = pr * pr + pi * pi;
    if (!(mag2 > 0) || !Number.isFinite(mag2)) {
      throw new Error(`singular admittance matrix at unknown ${order[j]}: a part of the network has no path to earth`);
    }
    dRe[j] = pr;
    dIm[j] = pi;
    const invRe = pr / mag2;
    const invIm = -pi / mag2;
    for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
      const i = rowPos[p];
      lRe[p] = wRe[i] * invRe - wIm[i] * invIm;
      lIm[p] = wRe[i] * invIm + wIm[i] * invRe;
      wRe[i] = 0;
      wIm[i] = 0;
    }
    wRe[j] = 0;
    wIm[j] = 0;
  }
  const parent = new Int32Array(n).fill(-1);
  for (let k = 0; k < n; k++) if (colPtr[k + 1] > colPtr[k]) parent[k] = rowPos[colPtr[k]];
  return { size: n, perm, colPtr, rowPos, parent, lRe, lIm, dRe, dIm };
}

/**
 * Solves A·X = B for `count` right-hand sides at once, in place, in elimination positions:
 * `block[(position·count + r)·2]` holds the real part of right-hand side r at that position, the
 * next slot its imaginary part (position = factor.perm[original index]). Walking L once for many
 * right-hand sides is several times faster than one solve after another.
 *
 * `forwardColumns`, when given, lists in ascending order every position at which the forward
 * solve can meet a non-zero (the elimination-tree ancestors of the block's non-zeros, see
 * `forwardReach` in batch.ts); the forward solve then skips the columns that are zero in every
 * right-hand side. The diagonal and backward steps always run over the whole factor.
 */
export function solveBlockInPlace(factor: LdlFactor, block: Float64Array, count: number, forwardColumns?: Int32Array): void {
  const { size: n, colPtr, rowPos, lRe, lIm, dRe, dIm } = factor;
  const stride = 2 * count;
  const forwardCount = forwardColumns ? forwardColumns.length : n;
  for (let c = 0; c < forwardCount; c++) {
    const j = forwardColumns ? forwardColumns[c] : c;
    const bj = j * stride;
    for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
      const lr = lRe[p];
      const li = lIm[p];
      const bi = rowPos[p] * stride;
      for (let r = 0; r < stride; r += 2) {
        const vr = block[bj + r];
        const vi = block[bj + r + 1];
        block[bi + r] -= lr * vr - li * vi;
        block[bi + r + 1] -= lr * vi + li * vr;
      }
    }
  }
  for (let j = 0; j < n; j++) {
    const mag2 = dRe[j] * dRe[j] + dIm[j] * dIm[j];
    const ir = dRe[j] / mag2;
    const ii = -dIm[j] / mag2;
    const bj = j * stride;
    for (let r = 0; r < stride; r += 2) {
      const vr = block[bj + r];
      const vi = block[bj + r + 1];
      block[bj + r] = vr * ir - vi * ii;
      block[bj + r + 1] = vr * ii + vi * ir;
    }
  }
  for (let j = n - 1; j >= 0; j--) {
    const bj = j * stride;
    for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
      const lr = lRe[p];
      const li = lIm[p];
      const bi = rowPos[p] * stride;
      for (let r = 0; r < stride; r += 2) {
        const xr = block[bi + r];
        const xi = block[bi + r + 1];
        block[bj + r] -= lr * xr - li * xi;
        block[bj + r + 1] -= lr * xi + li * xr;
      }
    }
  }
}

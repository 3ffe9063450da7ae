/**
 * Plain dense complex Gaussian elimination with partial pivoting: the yardstick the sparse
 * solver is benchmarked and tested against. O(n³) time, O(n²) memory; not for production use.
 */
import type { SymmetricEntries } from '@/lib/domain/calc';

export interface DenseLu {
  size: number;
  re: Float64Array;
  im: Float64Array;
  pivot: Int32Array;
}

/** Expands the symmetric entries into a full row-major complex matrix. */
export function toDense(matrix: SymmetricEntries): { re: Float64Array; im: Float64Array } {
  const n = matrix.size;
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    re[i * n + i] = matrix.diagRe[i];
    im[i * n + i] = matrix.diagIm[i];
  }
  for (let e = 0; e < matrix.offRow.length; e++) {
    const i = matrix.offRow[e];
    const j = matrix.offCol[e];
    re[i * n + j] += matrix.offRe[e];
    im[i * n + j] += matrix.offIm[e];
    re[j * n + i] += matrix.offRe[e];
    im[j * n + i] += matrix.offIm[e];
  }
  return { re, im };
}

/** LU factorisation in place with row pivoting on the largest magnitude. */
export function factorDense(matrix: SymmetricEntries): DenseLu {
  const n = matrix.size;
  const { re, im } = toDense(matrix);
  const pivot = new Int32Array(n);
  for (let k = 0; k < n; k++) {
    let best = k;
    let bestMag = -1;
    for (let i = k; i < n; i++) {
      const mag = re[i * n + k] ** 2 + im[i * n + k] ** 2;
      if (mag > bestMag) {
        bestMag = mag;
        best = i;
      }
    }
    pivot[k] = best;
    if (best !== k) {
      for (let j = 0; j < n; j++) {
        const a = k * n + j;
        const b = best * n + j;
        [re[a], re[b]] = [re[b], re[a]];
        [im[a], im[b]] = [im[b], im[a]];
      }
    }
    const pr = re[k * n + k];
    const pi = im[k * n + k];
    const mag2 = pr * pr + pi * pi;
    if (!(mag2 > 0)) throw new Error('singular matrix');
    for (let i = k + 1; i < n; i++) {
      const ar = re[i * n + k];
      const ai = im[i * n + k];
      if (ar === 0 && ai === 0) continue;
      const fr = (ar * pr + ai * pi) / mag2;
      const fi = (ai * pr - ar * pi) / mag2;
      re[i * n + k] = fr;
      im[i * n + k] = fi;
      for (let j = k + 1; j < n; j++) {
        const br = re[k * n + j];
        const bi = im[k * n + j];
        re[i * n + j] -= fr * br - fi * bi;
        im[i * n + j] -= fr * bi + fi * br;
      }
    }
  }
  return { size: n, re, im, pivot };
}

/** Solves with a dense LU factor; b is not modified. */
export function solveDense(lu: DenseLu, bRe: Float64Array, bIm: Float64Array): { re: Float64Array; im: Float64Array } {
  const { size: n, re, im, pivot } = lu;
  const xr = Float64Array.from(bRe);
  const xi = Float64Array.from(bIm);
  for (let k = 0; k < n; k++) {
    const p = pivot[k];
    if (p !== k) {
      [xr[k], xr[p]] = [xr[p], xr[k]];
      [xi[k], xi[p]] = [xi[p], xi[k]];
    }
  }
  for (let i = 0; i < n; i++) {
    let sr = xr[i];
    let si = xi[i];
    for (let j = 0; j < i; j++) {
      sr -= re[i * n + j] * xr[j] - im[i * n + j] * xi[j];
      si -= re[i * n + j] * xi[j] + im[i * n + j] * xr[j];
    }
    xr[i] = sr;
    xi[i] = si;
  }
  for (let i = n - 1; i >= 0; i--) {
    let sr = xr[i];
    let si = xi[i];
    for (let j = i + 1; j < n; j++) {
      sr -= re[i * n + j] * xr[j] - im[i * n + j] * xi[j];
      si -= re[i * n + j] * xi[j] + im[i * n + j] * xr[j];
    }
    const dr = re[i * n + i];
    const di = im[i * n + i];
    const mag2 = dr * dr + di * di;
    xr[i] = (sr * dr + si * di) / mag2;
    xi[i] = (si * dr - sr * di) / mag2;
  }
  return { re: xr, im: xi };
}

/**
 * One right-hand side solved through the checker's own block solve (`solveBlockInPlace`, a block
 * of one), indexed by original unknown: what the tests compare against dense elimination and ngspice.
 */
import { solveBlockInPlace, type LdlFactor } from '@/lib/domain/calc/sparse';

export function solveOne(factor: LdlFactor, bRe: Float64Array, bIm: Float64Array): { re: Float64Array; im: Float64Array } {
  const n = factor.size;
  const block = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) {
    block[factor.perm[i] * 2] = bRe[i];
    block[factor.perm[i] * 2 + 1] = bIm[i];
  }
  solveBlockInPlace(factor, block, 1);
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    re[i] = block[factor.perm[i] * 2];
    im[i] = block[factor.perm[i] * 2 + 1];
  }
  return { re, im };
}

import { REFERENCE, type SymmetricEntries } from '@/lib/domain/calc';
import { seededRandom } from '../../../bench/generate-plan';

/** A random admittance matrix: branches with R > 0, X ≥ 0 on a random graph, some to the reference. */
export function randomAdmittance(size: number, extraEdges: number, seed: number): SymmetricEntries {
  const rand = seededRandom(seed);
  const branches: [number, number][] = [];
  for (let v = 1; v < size; v++) branches.push([Math.floor(rand() * v), v]); // a spanning tree
  for (let e = 0; e < extraEdges; e++) branches.push([Math.floor(rand() * size), Math.floor(rand() * size)]);
  branches.push([Math.floor(rand() * size), REFERENCE]);
  const diagRe = new Float64Array(size);
  const diagIm = new Float64Array(size);
  const off = new Map<string, [number, number, number, number]>();
  for (const [a, b] of branches) {
    if (a === b) continue;
    const r = 10 ** (-4 + 5 * rand());
    const x = rand() < 0.3 ? 0 : r * 3 * rand();
    const m = r * r + x * x;
    const [yr, yi] = [r / m, -x / m];
    for (const end of [a, b]) {
      if (end === REFERENCE) continue;
      diagRe[end] += yr;
      diagIm[end] += yi;
    }
    if (a === REFERENCE || b === REFERENCE) continue;
    const key = `${Math.min(a, b)},${Math.max(a, b)}`;
    const entry = off.get(key) ?? [Math.min(a, b), Math.max(a, b), 0, 0];
    entry[2] -= yr;
    entry[3] -= yi;
    off.set(key, entry);
  }
  const list = [...off.values()];
  return {
    size,
    diagRe,
    diagIm,
    offRow: Int32Array.from(list, (e) => e[0]),
    offCol: Int32Array.from(list, (e) => e[1]),
    offRe: Float64Array.from(list, (e) => e[2]),
    offIm: Float64Array.from(list, (e) => e[3]),
  };
}

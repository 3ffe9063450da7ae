import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  analyseNetwork,
  assembleAdmittance,
  buildNetwork,
  computeFault,
  factorSymmetric,
  REFERENCE,
  type SymmetricEntries,
} from '@/lib/domain/calc';
import { minimumDegreeOrder, solveBlockInPlace } from '@/lib/domain/calc';
import { factorDense, solveDense } from '../../../bench/dense-solver';
import { generatePlan, seededRandom } from '../../../bench/generate-plan';
import { randomAdmittance } from './random-network';
import { solveOne } from '../../helpers/solve';

/** ‖A·x − b‖∞ / ‖b‖∞ for the symmetric entries. */
function residual(a: SymmetricEntries, x: { re: Float64Array; im: Float64Array }, bRe: Float64Array, bIm: Float64Array): number {
  const rr = Float64Array.from(bRe, (v) => -v);
  const ri = Float64Array.from(bIm, (v) => -v);
  const add = (i: number, j: number, ar: number, ai: number) => {
    rr[i] += ar * x.re[j] - ai * x.im[j];
    ri[i] += ar * x.im[j] + ai * x.re[j];
  };
  for (let i = 0; i < a.size; i++) add(i, i, a.diagRe[i], a.diagIm[i]);
  for (let e = 0; e < a.offRow.length; e++) {
    add(a.offRow[e], a.offCol[e], a.offRe[e], a.offIm[e]);
    add(a.offCol[e], a.offRow[e], a.offRe[e], a.offIm[e]);
  }
  let worst = 0;
  let scale = 0;
  for (let i = 0; i < a.size; i++) {
    worst = Math.max(worst, Math.hypot(rr[i], ri[i]));
    scale = Math.max(scale, Math.hypot(bRe[i], bIm[i]));
  }
  return worst / scale;
}

describe('sparse LDLᵀ against dense Gaussian elimination', () => {
  it('agrees on random grounding-like matrices (trees with loops, wide impedance range)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 60 }), fc.integer({ min: 0, max: 40 }), fc.integer(), (size, extra, seed) => {
        const a = randomAdmittance(size, extra, seed);
        const rand = seededRandom(seed ^ 0x5bd1e995);
        const bRe = Float64Array.from({ length: size }, () => rand() - 0.5);
        const bIm = Float64Array.from({ length: size }, () => rand() - 0.5);
        const sparse = solveOne(factorSymmetric(a), bRe, bIm);
        const dense = solveDense(factorDense(a), bRe, bIm);
        let scale = 0;
        let diff = 0;
        for (let i = 0; i < size; i++) {
          scale = Math.max(scale, Math.hypot(dense.re[i], dense.im[i]));
          diff = Math.max(diff, Math.hypot(sparse.re[i] - dense.re[i], sparse.im[i] - dense.im[i]));
        }
        return diff <= 1e-9 * scale && residual(a, sparse, bRe, bIm) < 1e-9;
      }),
      { numRuns: 200 },
    );
  });

  it('gives the same answers in a block of one and in a block of five', () => {
    const a = randomAdmittance(40, 25, 11);
    const factor = factorSymmetric(a);
    const count = 5;
    const block = new Float64Array(a.size * count * 2);
    const singles = Array.from({ length: count }, (_, r) => {
      const bRe = new Float64Array(a.size);
      const bIm = new Float64Array(a.size);
      bRe[(r * 7) % a.size] = 1;
      bIm[(r * 3) % a.size] = -2;
      for (let i = 0; i < a.size; i++) {
        block[(factor.perm[i] * count + r) * 2] = bRe[i];
        block[(factor.perm[i] * count + r) * 2 + 1] = bIm[i];
      }
      return solveOne(factor, bRe, bIm);
    });
    solveBlockInPlace(factor, block, count);
    singles.forEach((x, r) => {
      for (let i = 0; i < a.size; i++) {
        expect(block[(factor.perm[i] * count + r) * 2]).toBeCloseTo(x.re[i], 12);
        expect(block[(factor.perm[i] * count + r) * 2 + 1]).toBeCloseTo(x.im[i], 12);
      }
    });
  });

  it('refuses a matrix with a part that has no path to earth instead of returning NaN', () => {
    const a: SymmetricEntries = {
      size: 2,
      diagRe: Float64Array.of(1, 1),
      diagIm: Float64Array.of(0, 0),
      offRow: Int32Array.of(0),
      offCol: Int32Array.of(1),
      offRe: Float64Array.of(-1),
      offIm: Float64Array.of(0),
    };
    expect(() => factorSymmetric(a)).toThrow(/no path to earth/);
  });
});

describe('Thevenin contacts against a direct solve with the body in the network', () => {
  // I = V_open/(Z_th + R_body) must equal the body current found by putting the body resistor
  // into the network and solving it whole (dense), phase by phase.
  it.each([1, 2, 3, 4, 5, 6])('generated plan, seed %i', (seed) => {
    const plan = generatePlan({ elements: 120, seed });
    const bodyOhms = plan.criteria?.bodyOhms ?? 1000;
    const network = buildNetwork(plan);
    const figures = analyseNetwork(plan);
    const nodeById = new Map(plan.nodes.map((n) => [n.id, n]));
    const phases = plan.nodes.filter((n) => n.kind === 'phase' && network.indexOf.has(n.id));
    const solvedContacts = figures.contacts.filter((c) => c.status === 'solved');
    expect(solvedContacts.length).toBeGreaterThan(0);
    for (const contact of solvedContacts) {
      const worker = nodeById.get(contact.worker);
      const p = network.indexOf.get(worker?.kind === 'worker' ? (worker.standsOn ?? '') : '') as number;
      const s = network.indexOf.get(contact.surface) as number;
      const a = assembleAdmittance(network);
      const g = 1 / bodyOhms;
      const extraRow: number[] = [];
      if (p !== REFERENCE) a.diagRe[p] += g;
      if (s !== REFERENCE) a.diagRe[s] += g;
      if (p !== REFERENCE && s !== REFERENCE && p !== s) extraRow.push(p, s);
      const withBody: SymmetricEntries = {
        ...a,
        offRow: Int32Array.from([...a.offRow, ...extraRow.slice(0, 1)]),
        offCol: Int32Array.from([...a.offCol, ...extraRow.slice(1)]),
        offRe: Float64Array.from([...a.offRe, ...(extraRow.length ? [-g] : [])]),
        offIm: Float64Array.from([...a.offIm, ...(extraRow.length ? [0] : [])]),
      };
      const lu = factorDense(withBody);
      let worstA = 0;
      for (const phase of phases) {
        const bRe = new Float64Array(network.size);
        bRe[network.indexOf.get(phase.id) as number] = computeFault(plan.system).injectedKa * 1000; // Df × If, IEEE Std 80
        const x = solveDense(lu, bRe, new Float64Array(network.size));
        const v = (i: number) => (i === REFERENCE ? [0, 0] : [x.re[i], x.im[i]]);
        const [pr, pi] = v(p);
        const [sr, si] = v(s);
        worstA = Math.max(worstA, Math.hypot(pr - sr, pi - si) / bodyOhms);
      }
      expect(contact.bodyAmps).toBeCloseTo(worstA, 9);
      expect(Math.abs(contact.bodyAmps - worstA)).toBeLessThanOrEqual(1e-9 * Math.max(1, worstA));
    }
  });
});

describe('minimum-degree ordering', () => {
  it('creates no fill on a tree (random trees, leaves eliminated first)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 300 }), fc.integer(), (size, seed) => {
        const a = randomAdmittance(size, 0, seed);
        return factorSymmetric(a).rowPos.length === a.offRow.length;
      }),
      { numRuns: 50 },
    );
  });

  it('creates no fill on a star with a thousand leads', () => {
    const size = 1001;
    const rows = Int32Array.from({ length: size - 1 }, () => 0);
    const cols = Int32Array.from({ length: size - 1 }, (_, k) => k + 1);
    const { order, pattern } = minimumDegreeOrder(size, rows, cols);
    expect(order[size - 1]).toBe(0); // the hub goes last
    expect(pattern.reduce((sum, p) => sum + p.length, 0)).toBe(size - 1);
  });
});

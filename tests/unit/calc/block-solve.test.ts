import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { factorSymmetric, REFERENCE, type Injection, type LdlFactor } from '@/lib/domain/calc';
import { drivingPointImpedances, forwardReach, solveInjectionBlocks, solveInjections } from '@/lib/domain/calc/batch';
import { seededRandom } from '../../../bench/generate-plan';
import { randomAdmittance } from './random-network';
import { solveOne as solveAll } from '../../helpers/solve';

/**
 * One right-hand side solved on its own over the whole factor (no reach limit), the way every
 * injection was solved before blocks: V = A⁻¹·b.
 */
function solveOne(factor: LdlFactor, { into, outOf }: Injection, amps: number) {
  const bRe = new Float64Array(factor.size);
  const bIm = new Float64Array(factor.size);
  if (into !== REFERENCE) bRe[into] += amps;
  if (outOf !== REFERENCE) bRe[outOf] -= amps;
  return solveAll(factor, bRe, bIm);
}

/** Random injections between unknowns or remote earth, some with both ends equal. */
function randomInjections(size: number, count: number, seed: number): Injection[] {
  const rand = seededRandom(seed);
  const end = () => (rand() < 0.2 ? REFERENCE : Math.floor(rand() * size));
  return Array.from({ length: count }, () => {
    const into = end();
    return { into, outOf: rand() < 0.1 ? into : end() };
  });
}

const network = fc.record({ size: fc.integer({ min: 1, max: 80 }), extra: fc.integer({ min: 0, max: 60 }), rhs: fc.integer({ min: 1, max: 40 }), seed: fc.integer() });

describe('block solve against one solve per right-hand side', () => {
  it('gives every voltage of every right-hand side within 1e-9 of the single solve (random networks)', () => {
    fc.assert(
      fc.property(network, ({ size, extra, rhs, seed }) => {
        const factor = factorSymmetric(randomAdmittance(size, extra, seed));
        const injections = randomInjections(size, rhs, seed ^ 0x2545f491);
        const amps = 1 + (Math.abs(seed) % 5000);
        const seen = new Set<number>();
        let ok = true;
        solveInjections(factor, injections, amps, (k, column) => {
          seen.add(k);
          const single = solveOne(factor, injections[k], amps);
          let scale = 0;
          for (let i = 0; i < size; i++) scale = Math.max(scale, Math.hypot(single.re[i], single.im[i]));
          for (let i = 0; i < size; i++) {
            const [vr, vi] = column.between(i, REFERENCE);
            if (Math.hypot(vr - single.re[i], vi - single.im[i]) > 1e-9 * scale) ok = false;
          }
        });
        return ok && seen.size === injections.length;
      }),
      { numRuns: 300 },
    );
  });

  it('gives the impedance between two points within 1e-9 of V_a − V_b from a unit current solved whole', () => {
    fc.assert(
      fc.property(network, ({ size, extra, rhs, seed }) => {
        const factor = factorSymmetric(randomAdmittance(size, extra, seed));
        const pairs = randomInjections(size, rhs, seed ^ 0x68e31da4);
        const z = drivingPointImpedances(factor, pairs);
        return pairs.every((pair, k) => {
          const x = solveOne(factor, pair, 1);
          const v = (i: number) => (i === REFERENCE ? [0, 0] : [x.re[i], x.im[i]]);
          const [ar, ai] = v(pair.into);
          const [br, bi] = v(pair.outOf);
          const [er, ei] = [ar - br, ai - bi];
          return Math.hypot(z.re[k] - er, z.im[k] - ei) <= 1e-9 * Math.max(Math.hypot(er, ei), Number.MIN_VALUE);
        });
      }),
      { numRuns: 300 },
    );
  });

  it('reads remote earth as 0 V in every right-hand side of a block', () => {
    const factor = factorSymmetric(randomAdmittance(30, 10, 7));
    const injections = randomInjections(30, 20, 8);
    let blocks = 0;
    solveInjectionBlocks(factor, injections, 100, ({ count, stride, values }) => {
      blocks++;
      for (let r = 0; r < 2 * count; r++) expect(values[factor.size * stride + r]).toBe(0);
    });
    expect(blocks).toBe(2);
  });

  it('reaches exactly the start positions and their elimination-tree ancestors, ascending', () => {
    const factor = factorSymmetric(randomAdmittance(50, 20, 3));
    const stamp = new Int32Array(factor.size);
    const reach = [...forwardReach(factor, [factor.perm[4], factor.perm[17]], stamp, 1)];
    const expected = new Set<number>();
    for (const start of [factor.perm[4], factor.perm[17]]) for (let j = start; j >= 0; j = factor.parent[j]) expected.add(j);
    expect(reach).toEqual([...expected].sort((a, b) => a - b));
    // Every column of L below a reached position stays inside the reach (rows of L are ancestors).
    for (const j of reach) for (let p = factor.colPtr[j]; p < factor.colPtr[j + 1]; p++) expect(expected.has(factor.rowPos[p])).toBe(true);
  });
});

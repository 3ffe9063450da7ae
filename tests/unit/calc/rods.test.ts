import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  barricadeRadius,
  hemisphereVolts,
  rodGroupOhms,
  rodSurfaceVolts,
  singleRodOhms,
  twoRodsWideOhms,
  IEEE142_MULTIPLIERS,
  matrixGroupOhms,
  mutualRodOhms,
  rodInRange,
  rodPositions,
  type RodArrangement,
} from '@/lib/domain/calc/rods';
import { stepTouchCriteria } from '@/lib/domain/calc';
import { radiusFromDiameterMm } from '@/lib/domain/calc/units';
import { checkEntries, loadReference } from './reference';

const num = (v: number | string) => Number(v);

describe('rods against fixtures/reference/rods.json', () => {
  // Dwight [calc] and MIL-HDBK-419A ≈ 32 Ω [pub]; two rods, Dwight / IEEE Std 142 [from memory];
  // array factors of the geometry method against MIL-HDBK-419A's 5 × 5 [pub] and the IEEE Std 142
  // multipliers [from memory], both kept only as cross-checks; first-step fractions MIL-HDBK-419A Table 2-7 as read [pub].
  checkEntries(loadReference('rods.json'), {
    singleRodOhms: (i) => singleRodOhms(num(i.soilOhmM), num(i.lengthM), radiusFromDiameterMm(num(i.diameterMm))),
    twoRodsOhms: (i) =>
      rodGroupOhms({ soilOhmM: num(i.soilOhmM), lengthM: num(i.lengthM), radius: radiusFromDiameterMm(num(i.diameterMm)), count: 2, spacingM: num(i.spacingM) }).ohms,
    arrayFactor: (i) => {
      const rod = { soilOhmM: 100, lengthM: 3, radius: radiusFromDiameterMm(16) };
      const group = rodGroupOhms({ ...rod, count: num(i.count), spacingM: rod.lengthM, arrangement: i.arrangement as RodArrangement });
      return (group.ohms * num(i.count)) / singleRodOhms(rod.soilOhmM, rod.lengthM, rod.radius);
    },
    firstStepFraction: (i) => {
      const lengthM = num(i.lengthM);
      const radius = radiusFromDiameterMm(num(i.diameterMm));
      const riseV = singleRodOhms(100, lengthM, radius); // 1 A into 100 Ω·m
      return (riseV - rodSurfaceVolts(100, 1, lengthM, radius + num(i.stepM))) / riseV;
    },
  });
});

describe('rod groups err high (adding rods at equal potential can only lower resistance)', () => {
  const rod = { soilOhmM: 100, lengthM: 2.4, radius: radiusFromDiameterMm(16) };
  const single = singleRodOhms(rod.soilOhmM, rod.lengthM, rod.radius);

  it('never credits a group below what fewer rods would give, nor above one rod', () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 60 }), fc.double({ min: 0.3, max: 20, noNaN: true }), (count, spacingM) => {
        const group = rodGroupOhms({ ...rod, count, spacingM }).ohms;
        const fewer = rodGroupOhms({ ...rod, count: count - 1, spacingM }).ohms;
        return group <= single + 1e-12 && group <= fewer + 1e-12 && group > 0;
      }),
    );
  });

  it('uses Dwight’s close-spacing formula below one rod length, never below the value at s = L', () => {
    const atL = twoRodsWideOhms(rod.soilOhmM, rod.lengthM, rod.radius, rod.lengthM);
    const close = rodGroupOhms({ ...rod, count: 2, spacingM: 1.2 }).ohms;
    expect(close).toBeGreaterThanOrEqual(atL);
    expect(close).toBeLessThan(single);
  });

  it('names the method it used', () => {
    expect(rodGroupOhms({ ...rod, count: 1 }).method).toMatch(/Dwight/);
    expect(rodGroupOhms({ ...rod, count: 6, spacingM: 3, arrangement: 'line' }).method).toMatch(/6 rods in a line, mutual resistance of each pair/);
    expect(rodGroupOhms({ ...rod, count: 9, spacingM: 3 }).method).toMatch(/arrangement not given: the most compact layout \(grid\) taken/);
  });

  it('equals Dwight’s two-rod formula for two rods at or beyond one rod length (the matrix of two rods)', () => {
    for (const spacingM of [2.4, 5, 12]) {
      expect(rodGroupOhms({ ...rod, count: 2, spacingM }).ohms).toBeCloseTo(twoRodsWideOhms(rod.soilOhmM, rod.lengthM, rod.radius, spacingM), 10);
    }
  });

  it('errs high against the remembered IEEE Std 142 multipliers for compact layouts (triangle, square)', () => {
    // The finding: the table gives 4–7 % low for compact layouts; here the square is 5.9 % higher [calc].
    const factor = (count: number, arrangement: RodArrangement) => (rodGroupOhms({ ...rod, count, spacingM: rod.lengthM, arrangement }).ohms * count) / single;
    const table = new Map(IEEE142_MULTIPLIERS);
    expect(factor(3, 'ring')).toBeGreaterThan(table.get(3) as number);
    expect(factor(4, 'ring') / (table.get(4) as number)).toBeGreaterThan(1.04);
  });

  it('takes the highest of line, ring and grid when the arrangement is not given', () => {
    const of = (arrangement?: RodArrangement) => rodGroupOhms({ ...rod, count: 6, spacingM: 3, arrangement }).ohms;
    expect(of()).toBe(Math.max(of('line'), of('ring'), of('grid')));
  });

  it('solves the resistance matrix: two equal rods far apart halve the resistance', () => {
    expect(matrixGroupOhms(40, [[0, 0], [1e9, 0]], () => 0)).toBeCloseTo(20, 12);
    expect(rodPositions(4, 2, 'ring').map(([x, y]) => Math.hypot(x - rodPositions(4, 2, 'ring')[0][0], y - rodPositions(4, 2, 'ring')[0][1]))).toEqual([0, expect.closeTo(2, 12), expect.closeTo(2 * Math.SQRT2, 12), expect.closeTo(2, 12)]);
    expect(mutualRodOhms(100, 3, 3 * 0.999)).toBeGreaterThanOrEqual(mutualRodOhms(100, 3, 3));
  });
});

describe('rodInRange (Dwight needs L ≫ a; Bondmap refuses L < 20·a)', () => {
  it('refuses the issue’s 0.02 m × 100 mm rod and accepts an 8 ft × 5/8 in rod', () => {
    expect(singleRodOhms(100, 0.02, radiusFromDiameterMm(100))).toBeLessThan(0); // the −421.8 Ω the issue reports
    expect(singleRodOhms(100, 0.02, radiusFromDiameterMm(100))).toBeCloseTo(-421.8, 1);
    expect(rodInRange(0.02, 100)).toBe(false);
    expect(rodInRange(2.4384, 15.875)).toBe(true);
    expect(rodInRange(0.2, 20)).toBe(true); // exactly 20 radii
    expect(rodInRange(0.199, 20)).toBe(false);
  });
});

describe('barricadeRadius', () => {
  const input = { soilOhmM: 100, currentA: 2000, durationS: 0.25, bodyKg: 50 as const, lengthM: 2.4 };

  it('puts the 1 m step at the radius exactly at the IEEE Std 80 bare-soil step voltage', () => {
    const { radiusM, tolerableStepVolts } = barricadeRadius(input);
    expect(tolerableStepVolts).toBeCloseTo(stepTouchCriteria({ surfaceOhmM: 100, cs: 1, durationS: 0.25, bodyKg: 50 }).stepVolts, 9);
    const step = hemisphereVolts(100, 2000, radiusM) - hemisphereVolts(100, 2000, radiusM + 1);
    expect(step).toBeCloseTo(tolerableStepVolts, 6);
    expect(hemisphereVolts(100, 2000, radiusM * 0.99) - hemisphereVolts(100, 2000, radiusM * 0.99 + 1)).toBeGreaterThan(tolerableStepVolts);
  });

  it('is at least one rod length (common practice)', () => {
    expect(barricadeRadius({ ...input, currentA: 1 }).radiusM).toBe(2.4);
    expect(barricadeRadius({ ...input, currentA: 0 }).radiusM).toBe(2.4);
  });

  it('is conservative against the rod as a line source: the hemisphere step is never smaller', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 50, noNaN: true }), fc.double({ min: 0.05, max: 100, noNaN: true }), (lengthM, r) => {
        const line = rodSurfaceVolts(100, 1, lengthM, r) - rodSurfaceVolts(100, 1, lengthM, r + 1);
        const hemi = hemisphereVolts(100, 1, r) - hemisphereVolts(100, 1, r + 1);
        return hemi >= line * (1 - 1e-12);
      }),
    );
  });

  it('grows with current and soil resistivity', () => {
    const base = barricadeRadius({ ...input, currentA: 10_000 }).radiusM;
    expect(barricadeRadius({ ...input, currentA: 20_000 }).radiusM).toBeGreaterThan(base);
    expect(barricadeRadius({ ...input, currentA: 10_000, soilOhmM: 1000 }).radiusM).toBeGreaterThan(base);
  });
});

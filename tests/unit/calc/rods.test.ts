import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  barricadeRadius,
  hemisphereVolts,
  rodGroupOhms,
  rodSurfaceVolts,
  singleRodOhms,
  twoRodsWideOhms,
} from '../../../src/lib/domain/calc/rods';
import { stepTouchCriteria } from '../../../src/lib/domain/calc';
import { radiusFromDiameterMm } from '../../../src/lib/domain/calc/units';
import { checkEntries, loadReference } from './reference';

const num = (v: number | string) => Number(v);

describe('rods against fixtures/reference/rods.json', () => {
  // Dwight [calc] and MIL-HDBK-419A ≈ 32 Ω [pub]; two rods, Dwight / IEEE Std 142 [from memory];
  // 5 × 5 array factor MIL-HDBK-419A [pub]; first-step fractions MIL-HDBK-419A Table 2-7 as read [pub].
  checkEntries(loadReference('rods.json'), {
    singleRodOhms: (i) => singleRodOhms(num(i.soilOhmM), num(i.lengthM), radiusFromDiameterMm(num(i.diameterMm))),
    twoRodsOhms: (i) =>
      rodGroupOhms({ soilOhmM: num(i.soilOhmM), lengthM: num(i.lengthM), radius: radiusFromDiameterMm(num(i.diameterMm)), count: 2, spacingM: num(i.spacingM) }).ohms,
    arrayFactor: (i) => {
      const rod = { soilOhmM: 100, lengthM: 3, radius: radiusFromDiameterMm(16) };
      const group = rodGroupOhms({ ...rod, count: num(i.count), spacingM: rod.lengthM });
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
    expect(rodGroupOhms({ ...rod, count: 6, spacingM: 3 }).method).toMatch(/IEEE Std 142 multiplier F = 1.36 for 4 rods/);
    expect(rodGroupOhms({ ...rod, count: 30, spacingM: 3 }).method).toMatch(/MIL-HDBK-419A/);
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

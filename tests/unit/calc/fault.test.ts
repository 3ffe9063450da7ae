import { describe, expect, it } from 'vitest';
import { computeFault, decrementFactor, faultDurationS, parallelForceNPerM, peakFactor } from '@/lib/domain/calc';
import { checkEntries, loadReference } from './reference';

const system = { frequencyHz: 60 as const, faultKa: 10, clearingCycles: 15, xOverR: 10 };

describe('fault shape against fixtures/reference/fault-shape.json', () => {
  // Decrement factor: formula from memory, values computed, matching IEEE Std 80's table as remembered.
  // Peak factor: IEC 60909-0 via the pandapower documentation. Forces: SI definition of the ampere.
  checkEntries(loadReference('fault-shape.json'), {
    decrementFactor: (i) => decrementFactor(Number(i.xOverR), Number(i.durationS), Number(i.frequencyHz)),
    peakFactor: (i) => peakFactor(Number(i.xOverR)),
    peakForceNPerM: (i) =>
      computeFault({ ...system, faultKa: Number(i.faultKa), xOverR: Number(i.xOverR), phaseSpacingM: Number(i.phaseSpacingM) }).peakForceNPerM as number,
    symmetricalPeakForceNPerM: (i) => parallelForceNPerM(Math.SQRT2 * Number(i.faultKa) * 1000, Number(i.phaseSpacingM)),
    // mem-grade first-peak multiplier 2.69 at X/R 30: IEC 60909 κ·√2 lands within 0.01.
    firstPeakPerRated: (i) => peakFactor(Number(i.xOverR)) * Math.SQRT2,
  });
});

describe('computeFault', () => {
  it('reproduces the report example of docs/plan-format.md (10 kA, 15 cycles at 60 Hz, X/R 10, 0.9 m)', () => {
    // docs/plan-format.md: durationS 0.25, Df 1.052, 10.52 kA, κ 1.746, 24.69 kA, 135.5 N/m (computed from its formulas).
    const fault = computeFault({ ...system, phaseSpacingM: 0.9 });
    expect(fault.durationS).toBe(0.25);
    expect(fault.decrementFactor).toBeCloseTo(1.052, 3);
    expect(fault.asymmetricalKa).toBeCloseTo(10.52, 2);
    expect(fault.peakFactor).toBeCloseTo(1.746, 3);
    expect(fault.peakKa).toBeCloseTo(24.69, 2);
    expect(fault.peakForceNPerM).toBeCloseTo(135.5, 1);
  });

  it('gives no force without a phase spacing', () => {
    expect(computeFault(system).peakForceNPerM).toBeNull();
  });

  it('treats X/R 0 as a purely resistive source: Df 1, κ 1.02 (IEC 60909-0 floor)', () => {
    const fault = computeFault({ ...system, xOverR: 0 });
    expect(fault.decrementFactor).toBe(1);
    expect(fault.peakFactor).toBe(1.02);
    expect(fault.asymmetricalKa).toBe(10);
  });

  it('takes duration from cycles of the system frequency', () => {
    expect(faultDurationS(15, 50)).toBeCloseTo(0.3, 12);
    expect(computeFault({ ...system, frequencyHz: 50 }).durationS).toBeCloseTo(0.3, 12);
  });

  it('Df falls towards 1 with duration and rises with X/R (IEEE Std 80 table trend)', () => {
    expect(decrementFactor(20, 0.05, 60)).toBeGreaterThan(decrementFactor(20, 0.5, 60));
    expect(decrementFactor(40, 0.1, 60)).toBeGreaterThan(decrementFactor(10, 0.1, 60));
    expect(decrementFactor(20, 30, 60)).toBeLessThan(1.001);
  });
});

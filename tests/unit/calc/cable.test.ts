import { describe, expect, it } from 'vitest';
import { CABLE_SIZES, type CableSize } from '@/lib/schemas/plan';
import { CABLES, CLAMP_CONTACT_OHMS, conductorRadiusM, jumperImpedance, r20OhmPerM, straightWireInductanceH } from '@/lib/domain/calc';
import { checkEntries, loadReference } from './reference';

const FOOT_M = 0.3048;
const CMIL_TO_MM2 = Math.PI * (0.0254 / 2) ** 2; // one circular mil: a circle 0.001 in across, in mm²
const cable = (i: Record<string, number | string>) => i.cable as CableSize;

describe('cable data against fixtures/reference/cable.json', () => {
  // NEC Chapter 9 Table 8 [pub]; R20 by × 0.82235 [calc]; lead examples [calc, formula from memory].
  checkEntries(loadReference('cable.json'), {
    areaCmil: (i) => CABLES[cable(i)].areaCmil,
    areaMm2: (i) => CABLES[cable(i)].areaCmil * CMIL_TO_MM2,
    r75OhmPerKft: (i) => CABLES[cable(i)].r75OhmPerKft,
    r20OhmPerKft: (i) => r20OhmPerM(cable(i)) * 1000 * FOOT_M,
    r20OhmPerKm: (i) => r20OhmPerM(cable(i)) * 1000,
    conductorRadiusMm: (i) => conductorRadiusM(cable(i)) * 1000,
    leadInductanceUh: (i) => straightWireInductanceH(Number(i.lengthFt) * FOOT_M, conductorRadiusM(cable(i))) * 1e6,
    // The examples exclude clamps: clamp contact resistance 0 here.
    leadReactanceMohm: (i) => jumperImpedance(cable(i), Number(i.lengthFt) * FOOT_M, Number(i.frequencyHz), 0).reactanceOhms * 1000,
    leadImpedanceMohm: (i) => {
      const z = jumperImpedance(cable(i), Number(i.lengthFt) * FOOT_M, Number(i.frequencyHz), 0);
      return Math.hypot(z.resistanceOhms, z.reactanceOhms) * 1000;
    },
  });
});

describe('jumperImpedance', () => {
  it('adds two clamp contacts to the cable resistance by default (assumption, common practice)', () => {
    const bare = jumperImpedance('4/0', 3, 60, 0);
    const clamped = jumperImpedance('4/0', 3, 60);
    expect(clamped.resistanceOhms - bare.resistanceOhms).toBeCloseTo(2 * CLAMP_CONTACT_OHMS, 15);
    expect(clamped.reactanceOhms).toBe(bare.reactanceOhms);
  });

  it('has reactance above resistance for a 10 ft 4/0 lead at 60 Hz (engineering reference §2)', () => {
    const z = jumperImpedance('4/0', 10 * FOOT_M, 60, 0);
    expect(z.reactanceOhms).toBeGreaterThan(z.resistanceOhms);
  });

  it('scales reactance with frequency (50 Hz is 5/6 of 60 Hz)', () => {
    expect(jumperImpedance('2', 5, 50).reactanceOhms / jumperImpedance('2', 5, 60).reactanceOhms).toBeCloseTo(5 / 6, 12);
  });

  it('orders sizes: larger cable, lower resistance per metre (NEC Table 8)', () => {
    const r = CABLE_SIZES.map((size) => r20OhmPerM(size));
    for (let k = 1; k < r.length; k++) expect(r[k]).toBeLessThan(r[k - 1]);
  });

  it('uses the stranded diameter, not the solid-equivalent radius from the area', () => {
    // From the area, 4/0 would be 5.84 mm; the reference lead example needs 6.71 mm.
    const solidEquivalentM = Math.sqrt((CABLES['4/0'].areaCmil * Math.PI * (0.0254e-3 / 2) ** 2) / Math.PI);
    expect(solidEquivalentM * 1000).toBeCloseTo(5.84, 2);
    expect(conductorRadiusM('4/0')).toBeGreaterThan(solidEquivalentM);
  });
});

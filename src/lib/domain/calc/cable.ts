/**
 * Copper grounding cable: conductor data and the series impedance of a jumper at the system
 * frequency. Resistance per NEC Chapter 9 Table 8; inductance of a straight round wire.
 */
import type { CableSize } from '@/lib/schemas/plan';
import { METRES_PER_FOOT } from '@/lib/domain/units';
import { MU0_H_PER_M, omega, radiusFromDiameterIn, type RadiusM } from './units';

export interface CableData {
  /** Conductor area, circular mils. */
  areaCmil: number;
  /** DC resistance at 75 °C, Ω per 1000 ft — NEC Chapter 9 Table 8, uncoated stranded copper. */
  r75OhmPerKft: number;
  /** Overall diameter of the stranded conductor, inches — NEC Chapter 9 Table 8 [from memory]. */
  strandedDiameterIn: number;
}

/**
 * NEC Chapter 9 Table 8 rows for the sizes a plan may name. Areas and R75 as published; the
 * stranded diameters and the whole row for No. 4 are from memory (No. 4 is only here so the
 * minimum-size rule can report figures for it).
 */
export const CABLES: Record<CableSize, CableData> = {
  '4': { areaCmil: 41_740, r75OhmPerKft: 0.308, strandedDiameterIn: 0.232 },
  '2': { areaCmil: 66_360, r75OhmPerKft: 0.194, strandedDiameterIn: 0.292 },
  '1/0': { areaCmil: 105_600, r75OhmPerKft: 0.122, strandedDiameterIn: 0.372 },
  '2/0': { areaCmil: 133_100, r75OhmPerKft: 0.0967, strandedDiameterIn: 0.418 },
  '3/0': { areaCmil: 167_800, r75OhmPerKft: 0.0766, strandedDiameterIn: 0.47 },
  '4/0': { areaCmil: 211_600, r75OhmPerKft: 0.0608, strandedDiameterIn: 0.528 },
  '250': { areaCmil: 250_000, r75OhmPerKft: 0.0515, strandedDiameterIn: 0.575 },
  '350': { areaCmil: 350_000, r75OhmPerKft: 0.0367, strandedDiameterIn: 0.681 },
};

/** Copper's resistance ratio 20 °C / 75 °C, (234.5 + 20)/(234.5 + 75), as NEC Table 8's note uses it. */
export const R20_PER_R75 = 0.82235;

/** DC resistance at 20 °C, Ω/m — NEC Chapter 9 Table 8 scaled by R20_PER_R75. */
export function r20OhmPerM(cable: CableSize): number {
  return (CABLES[cable].r75OhmPerKft * R20_PER_R75) / (1000 * METRES_PER_FOOT);
}

/**
 * Radius to use in the inductance formula: half the stranded conductor's overall diameter
 * (NEC Table 8). This is what reproduces docs/engineering.md §2 (r 6.71 mm for 4/0, 3.71 mm for #2);
 * the radius of a solid rod of the same area (5.84 mm for 4/0) would give about 2 % more L.
 */
export function conductorRadiusM(cable: CableSize): RadiusM {
  return radiusFromDiameterIn(CABLES[cable].strandedDiameterIn);
}

/**
 * Self-inductance, H, of a straight round wire of lengthM and radius — L = (μ0·l/2π)(ln(2l/r) − 0.75),
 * the low-frequency straight-wire formula [from memory]. Short leads (l < r) are clamped to zero.
 */
export function straightWireInductanceH(lengthM: number, radius: RadiusM): number {
  const perLog = (MU0_H_PER_M * lengthM) / (2 * Math.PI);
  return Math.max(0, perLog * (Math.log((2 * lengthM) / radius) - 0.75));
}

/**
 * Contact resistance taken for each clamp of a jumper, Ω: 50 µΩ, an assumption (common
 * practice, no source) for a clean, tight clamp. Adding it raises the jumper's impedance and with
 * it the voltage across a worker in parallel, the conservative direction.
 */
export const CLAMP_CONTACT_OHMS = 50e-6;

/**
 * Resistance added to a jumper whose cable is stripped and put under an eye bolt or clamp without
 * a compression ferrule (`connection: "bare-strands"`), Ω: 1 mΩ, twenty clamp contacts. Our own
 * assumption (common practice holds that bare strands corrode, break and add resistance; no
 * figure is published that we know of); erring high raises the voltage across a worker in parallel.
 */
export const BARE_STRANDS_OHMS = 1e-3;

export interface SeriesImpedance {
  resistanceOhms: number;
  reactanceOhms: number;
}

/**
 * Series impedance of a jumper, Ω at frequencyHz: R20 × length + two clamp contacts, and the
 * reactance ωL of its length as a straight wire (mutual coupling with other leads is ignored).
 */
export function jumperImpedance(
  cable: CableSize,
  lengthM: number,
  frequencyHz: number,
  clampOhmsEach: number = CLAMP_CONTACT_OHMS,
): SeriesImpedance {
  return {
    resistanceOhms: r20OhmPerM(cable) * lengthM + 2 * clampOhmsEach,
    reactanceOhms: omega(frequencyHz) * straightWireInductanceH(lengthM, conductorRadiusM(cable)),
  };
}

/**
 * Driven ground rods: resistance to remote earth of one rod or a group, and how far out the
 * step voltage around a rod stays dangerous during a fault.
 */
import { stepTouchCriteria } from './body';
import type { RadiusM } from './units';

/** Single rod, Ω — Dwight's formula (IEEE Std 142, IEEE Std 80): R = ρ/(2πL)(ln(4L/a) − 1), a = radius. */
export function singleRodOhms(soilOhmM: number, lengthM: number, radius: RadiusM): number {
  return (soilOhmM / (2 * Math.PI * lengthM)) * (Math.log((4 * lengthM) / radius) - 1);
}

/**
 * Two rods spaced s ≥ L, Ω — Dwight's formula as tabulated in IEEE Std 142 [from memory]:
 * R = ρ/(4πL)(ln(4L/a) − 1) + ρ/(4πs)(1 − L²/(3s²) + 2L⁴/(5s⁴)).
 */
export function twoRodsWideOhms(soilOhmM: number, lengthM: number, radius: RadiusM, spacingM: number): number {
  const q = (lengthM / spacingM) ** 2;
  return (
    (soilOhmM / (4 * Math.PI * lengthM)) * (Math.log((4 * lengthM) / radius) - 1) +
    (soilOhmM / (4 * Math.PI * spacingM)) * (1 - q / 3 + (2 * q * q) / 5)
  );
}

/**
 * Two rods spaced s < L, Ω — Dwight's close-spacing formula, IEEE Std 142 [from memory]:
 * R = ρ/(4πL)(ln(4L/a) + ln(4L/s) − 2 + s/(2L) − s²/(16L²) + s⁴/(512L⁴)).
 */
export function twoRodsCloseOhms(soilOhmM: number, lengthM: number, radius: RadiusM, spacingM: number): number {
  const u = spacingM / lengthM;
  return (
    (soilOhmM / (4 * Math.PI * lengthM)) *
    (Math.log((4 * lengthM) / radius) + Math.log((4 * lengthM) / spacingM) - 2 + u / 2 - (u * u) / 16 + u ** 4 / 512)
  );
}

/**
 * Multiplying factor F for N rods at one rod length apart, in a line or hollow square:
 * R_N = F·R1/N — IEEE Std 142 table [from memory].
 */
export const IEEE142_MULTIPLIERS: ReadonlyArray<readonly [count: number, factor: number]> = [
  [2, 1.16], [3, 1.29], [4, 1.36], [8, 1.68], [12, 1.8], [16, 1.92], [20, 2.0], [24, 2.16],
];
/** 5 × 5 square array at one rod length apart: R = 2.8·R1/N — MIL-HDBK-419A. */
export const MIL419A_SQUARE_25_FACTOR = 2.8;

export interface RodGroup {
  soilOhmM: number;
  lengthM: number;
  radius: RadiusM;
  count: number;
  /** Centre-to-centre spacing, m; needed when count > 1. */
  spacingM?: number;
}

export interface RodResistance {
  ohms: number;
  method: string;
}

/**
 * Resistance of a rod or group of rods to remote earth, Ω, with the method named. Every fallback
 * errs high, because adding a rod at equal potential can only lower the group's resistance:
 * - two rods: Dwight's formulas; below s = L, never below the wide formula's value at s = L;
 * - three or more at s ≥ L: IEEE Std 142 multiplier of the largest tabulated count not above N,
 *   spacing taken as L (wider spacing only helps), never below MIL-HDBK-419A's 5 × 5 square
 *   (2.8·R1/25), which also serves for 25 rods and more;
 * - three or more at s < L: no better than two rods at that spacing.
 */
export function rodGroupOhms(group: RodGroup): RodResistance {
  const single = singleRodOhms(group.soilOhmM, group.lengthM, group.radius);
  if (group.count <= 1 || group.spacingM === undefined) {
    return { ohms: single, method: 'single rod, Dwight (IEEE Std 142)' };
  }
  const { soilOhmM, lengthM, radius, spacingM } = group;
  const twoRods = (): number =>
    spacingM >= lengthM
      ? twoRodsWideOhms(soilOhmM, lengthM, radius, spacingM)
      : Math.min(single, Math.max(twoRodsCloseOhms(soilOhmM, lengthM, radius, spacingM), twoRodsWideOhms(soilOhmM, lengthM, radius, lengthM)));
  if (group.count === 2) {
    return { ohms: twoRods(), method: `two rods, Dwight (IEEE Std 142), spacing ${spacingM >= lengthM ? '≥' : '<'} rod length` };
  }
  if (spacingM < lengthM) {
    return { ohms: twoRods(), method: `${group.count} rods closer than one rod length: credited as two rods, Dwight (IEEE Std 142)` };
  }
  // The multiplier table is for lines and hollow squares; a filled square is worse. The layout is
  // not in the plan, so the credit never goes below MIL-HDBK-419A's 5 × 5 filled square.
  const filledSquare = (MIL419A_SQUARE_25_FACTOR * single) / 25;
  const [count, factor] = [...IEEE142_MULTIPLIERS].reverse().find(([n]) => n <= group.count) as readonly [number, number];
  const tabulated = (factor * single) / count;
  if (group.count >= 25 || filledSquare >= tabulated) {
    return {
      ohms: filledSquare,
      method: `${group.count} rods: credited no better than a 5 × 5 square at one rod length, MIL-HDBK-419A (2.8·R1/25)`,
    };
  }
  return {
    ohms: tabulated,
    method: `${group.count} rods: IEEE Std 142 multiplier F = ${factor} for ${count} rods at one rod length (R = F·R1/N)`,
  };
}

/**
 * Surface potential, V, at distanceM from a rod of lengthM carrying currentA into soil of
 * soilOhmM, the rod taken as a uniform line source [from memory; it reproduces MIL-HDBK-419A
 * Vol. I Table 2-7 with the rod's own potential from Dwight]: V = ρI/(2πL)·ln((L + √(L² + x²))/x).
 */
export function rodSurfaceVolts(soilOhmM: number, currentA: number, lengthM: number, distanceM: number): number {
  return ((soilOhmM * currentA) / (2 * Math.PI * lengthM)) * Math.log((lengthM + Math.hypot(lengthM, distanceM)) / distanceM);
}

/** Hemispherical-source surface potential, V, at distanceM: V = ρI/(2πr); its gradient is never below the line source's. */
export function hemisphereVolts(soilOhmM: number, currentA: number, distanceM: number): number {
  return (soilOhmM * currentA) / (2 * Math.PI * distanceM);
}

export const BARRICADE_METHOD =
  'rod as a hemispherical source, V(r) = ρI/(2πr); radius where V(r) − V(r + 1 m) falls to the IEEE Std 80 ' +
  'bare-soil step voltage (1000 + 6ρ)·k/√t; never less than one rod length (common practice)';

export interface BarricadeInput {
  soilOhmM: number;
  /** Current from the rod into the soil, A rms. */
  currentA: number;
  durationS: number;
  bodyKg: 50 | 70;
  lengthM: number;
}

/**
 * Barricade radius around a rod, m, and the tolerable step voltage, V: the smallest r with
 * ρI/(2π)·(1/r − 1/(r+1)) ≤ E_step, i.e. r(r+1) ≥ ρI/(2π·E_step), solved in closed form;
 * floored at one rod length (common practice). Step criterion from IEEE Std 80, Cs = 1, ρs = ρ.
 */
export function barricadeRadius(input: BarricadeInput): { radiusM: number; tolerableStepVolts: number } {
  const { stepVolts } = stepTouchCriteria({ surfaceOhmM: input.soilOhmM, cs: 1, durationS: input.durationS, bodyKg: input.bodyKg });
  const k = (input.soilOhmM * Math.abs(input.currentA)) / (2 * Math.PI * stepVolts);
  const radiusM = (-1 + Math.sqrt(1 + 4 * k)) / 2;
  return { radiusM: Math.max(radiusM, input.lengthM), tolerableStepVolts: stepVolts };
}

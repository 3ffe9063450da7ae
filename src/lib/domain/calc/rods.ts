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
 * R_N = F·R1/N — IEEE Std 142 table [from memory]. Kept only as a cross-check in tests: groups
 * are computed from their geometry (rodGroupOhms).
 */
export const IEEE142_MULTIPLIERS: ReadonlyArray<readonly [count: number, factor: number]> = [
  [2, 1.16], [3, 1.29], [4, 1.36], [8, 1.68], [12, 1.8], [16, 1.92], [20, 2.0], [24, 2.16],
];
/** 5 × 5 square array at one rod length apart: R = 2.8·R1/N — MIL-HDBK-419A; a cross-check in tests. */
export const MIL419A_SQUARE_25_FACTOR = 2.8;

/**
 * Smallest ratio of driven length to radius for which Dwight's formula is used: L ≥ 20·a (ten
 * diameters). Dwight's formula is derived for a long thin rod (L ≫ a); at L/a = 20 the log term
 * ln(4L/a) = 4.4 still outweighs the constant 1 four to one. Our own limit, chosen to stay well
 * inside the formula's assumption (docs/engineering.md §5); no published bound is known to us.
 */
export const ROD_MIN_LENGTH_TO_RADIUS = 20;

/** True when Dwight's formula may be used for a rod of lengthM and diameterMm (L ≥ 20·a). */
export function rodInRange(lengthM: number, diameterMm: number): boolean {
  return lengthM / (diameterMm / 2000) >= ROD_MIN_LENGTH_TO_RADIUS;
}

export type RodArrangement = 'line' | 'ring' | 'grid';

export interface RodGroup {
  soilOhmM: number;
  lengthM: number;
  radius: RadiusM;
  count: number;
  /** Centre-to-centre spacing, m; needed when count > 1. */
  spacingM?: number;
  /** How the rods stand; absent: the most compact (highest-resistance) of the three. */
  arrangement?: RodArrangement;
}

export interface RodResistance {
  ohms: number;
  method: string;
}

/**
 * Mutual resistance of two rods of lengthM at distanceM, Ω — the mutual term of Dwight's two-rod
 * formulas (IEEE Std 142 [from memory]): a two-rod group is (R1 + Rm)/2, so
 * - d ≥ L: Rm = ρ/(2πd)(1 − L²/(3d²) + 2L⁴/(5d⁴));
 * - d < L: Rm = ρ/(2πL)(ln(4L/d) − 1 + d/(2L) − d²/(16L²) + d⁴/(512L⁴)), never below the wide
 *   formula's value at d = L (the two forms disagree near d = L; the higher mutual errs high).
 * The distance is taken as at least minimumM (two rods cannot stand closer than touching).
 */
export function mutualRodOhms(soilOhmM: number, lengthM: number, distanceM: number, minimumM = 0): number {
  const d = Math.max(distanceM, minimumM);
  const wide = (x: number) => {
    const q = (lengthM / x) ** 2;
    return (soilOhmM / (2 * Math.PI * x)) * (1 - q / 3 + (2 * q * q) / 5);
  };
  if (d >= lengthM) return wide(d);
  const u = d / lengthM;
  return Math.max(wide(lengthM), (soilOhmM / (2 * Math.PI * lengthM)) * (Math.log(4 / u) - 1 + u / 2 - (u * u) / 16 + u ** 4 / 512));
}

/** Rod positions, m, for count rods spacingM apart: in a line, on a ring (regular polygon of side s) or a filled square grid. */
export function rodPositions(count: number, spacingM: number, arrangement: RodArrangement): [number, number][] {
  if (arrangement === 'line' || count <= 2) return Array.from({ length: count }, (_, i) => [i * spacingM, 0]);
  if (arrangement === 'ring') {
    const r = spacingM / (2 * Math.sin(Math.PI / count));
    return Array.from({ length: count }, (_, i) => [r * Math.cos((2 * Math.PI * i) / count), r * Math.sin((2 * Math.PI * i) / count)]);
  }
  const side = Math.ceil(Math.sqrt(count));
  return Array.from({ length: count }, (_, i) => [(i % side) * spacingM, Math.floor(i / side) * spacingM]);
}

/**
 * Resistance of rods at equal potential, Ω, from the resistance matrix R (R_ii = R1 by Dwight,
 * R_ij the mutual resistance at their distance): with V = R·I and one potential on all rods, the
 * group's resistance is 1/(1ᵀR⁻¹1). Solved by Gaussian elimination (the matrix is small and
 * symmetric positive definite for physical layouts).
 */
export function matrixGroupOhms(single: number, positions: [number, number][], mutual: (d: number) => number): number {
  const n = positions.length;
  const a = positions.map(([xi, yi], i) => positions.map(([xj, yj], j) => (i === j ? single : mutual(Math.hypot(xi - xj, yi - yj)))));
  const b = new Array<number>(n).fill(1);
  for (let k = 0; k < n; k++) {
    for (let i = k + 1; i < n; i++) {
      const f = a[i][k] / a[k][k];
      for (let j = k; j < n; j++) a[i][j] -= f * a[k][j];
      b[i] -= f * b[k];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let i = n - 1; i >= 0; i--) {
    let sum = b[i];
    for (let j = i + 1; j < n; j++) sum -= a[i][j] * x[j];
    x[i] = sum / a[i][i];
  }
  return 1 / x.reduce((total, current) => total + current, 0);
}

export const GROUP_METHOD = 'mutual resistance of each pair at its distance (Dwight, IEEE Std 142), solved as a resistance matrix';

/**
 * Resistance of a rod or group of rods to remote earth, Ω, with the method named: one rod by
 * Dwight; a group from its geometry (matrixGroupOhms). Without an arrangement the line, ring and
 * grid are all computed and the highest taken, the layout being unknown.
 */
export function rodGroupOhms(group: RodGroup): RodResistance {
  const single = singleRodOhms(group.soilOhmM, group.lengthM, group.radius);
  if (group.count <= 1 || group.spacingM === undefined) {
    return { ohms: single, method: 'single rod, Dwight (IEEE Std 142)' };
  }
  const { soilOhmM, lengthM, spacingM, count } = group;
  const mutual = (d: number) => mutualRodOhms(soilOhmM, lengthM, d, 2 * group.radius);
  const of = (arrangement: RodArrangement) => matrixGroupOhms(single, rodPositions(count, spacingM, arrangement), mutual);
  if (group.arrangement) {
    return { ohms: of(group.arrangement), method: `${count} rods in a ${group.arrangement}, ${GROUP_METHOD}` };
  }
  const [worst, ohms] = (['line', 'ring', 'grid'] as const).map((a) => [a, of(a)] as const).reduce((x, y) => (y[1] > x[1] ? y : x));
  return { ohms, method: `${count} rods, arrangement not given: the most compact layout (${worst}) taken, ${GROUP_METHOD}` };
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

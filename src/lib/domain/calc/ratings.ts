/**
 * Short-time current ratings of grounding cable and clamps for the plan's clearing time:
 * the ASTM F855 grade table, Onderdonk's fusing current, and I²t conversion between durations.
 */
import type { CableSize } from '@/lib/schemas/plan';
import { CABLES } from './cable';

/** Onderdonk's constants for copper: melting point and ambient, °C. */
export const COPPER_MELT_C = 1083;
export const AMBIENT_C = 40;
/**
 * Fraction of nominal area taken for fusing: 98 %, which reproduces the grade table's ultimate
 * column (20 of 21 cells) and docs/engineering.md's worked example (#2, 0.25 s → 18,696 A).
 */
export const FUSING_AREA_FRACTION = 0.98;

/**
 * Onderdonk's fusing current, A, for areaCmil of copper carrying it for durationS seconds:
 * I = A·√(log10((Tm − Ta)/(234 + Ta) + 1)/(33·t)), Tm 1083 °C, Ta 40 °C.
 */
export function onderdonkAmps(areaCmil: number, durationS: number): number {
  const rise = Math.log10((COPPER_MELT_C - AMBIENT_C) / (234 + AMBIENT_C) + 1);
  return areaCmil * Math.sqrt(rise / (33 * durationS));
}

/** Fusing current of a cable size, kA: Onderdonk on 98 % of the nominal area. */
export function fusingKa(cable: CableSize, durationS: number): number {
  return onderdonkAmps(CABLES[cable].areaCmil * FUSING_AREA_FRACTION, durationS) / 1000;
}

export interface GradeRow {
  grade: number;
  withstand15Ka: number;
  withstand30Ka: number;
  ultimate15Ka: number;
  ultimate30Ka: number;
  ultimate60Ka: number;
}

/**
 * Temporary protective ground grades, symmetrical kA rms at 60 Hz.
 * mem-grade: secondhand copy, verify before relying on it (ASTM F855 Table 1 as reproduced
 * secondhand). Durations: 15, 30, 60 cycles of 60 Hz = 0.25, 0.5, 1 s.
 */
export const GRADES: Partial<Record<CableSize, GradeRow>> = {
  '2': { grade: 1, withstand15Ka: 14, withstand30Ka: 10, ultimate15Ka: 18, ultimate30Ka: 13, ultimate60Ka: 9 },
  '1/0': { grade: 2, withstand15Ka: 21, withstand30Ka: 15, ultimate15Ka: 29, ultimate30Ka: 21, ultimate60Ka: 14 },
  '2/0': { grade: 3, withstand15Ka: 27, withstand30Ka: 20, ultimate15Ka: 37, ultimate30Ka: 26, ultimate60Ka: 18 },
  '3/0': { grade: 4, withstand15Ka: 34, withstand30Ka: 25, ultimate15Ka: 47, ultimate30Ka: 33, ultimate60Ka: 23 },
  '4/0': { grade: 5, withstand15Ka: 43, withstand30Ka: 30, ultimate15Ka: 59, ultimate30Ka: 42, ultimate60Ka: 29 },
  '250': { grade: 6, withstand15Ka: 54, withstand30Ka: 39, ultimate15Ka: 70, ultimate30Ka: 49, ultimate60Ka: 35 },
  '350': { grade: 7, withstand15Ka: 74, withstand30Ka: 54, ultimate15Ka: 98, ultimate30Ka: 69, ultimate60Ka: 48 },
};

/**
 * The frequency whose cycles the grade table and clamp ratings count, Hz: ratings are stated in
 * 60 Hz cycles (15 cycles = 0.25 s), so a duration is converted by time, never by cycle count.
 */
export const RATING_TABLE_HZ = 60;

/** The grade table's withstand durations, s (15 and 30 cycles at 60 Hz). */
export const TABLE_SHORT_S = 0.25;
export const TABLE_LONG_S = 0.5;

/**
 * Withstand rating, kA, of a grade row at durationS:
 * - between 0.25 s and 0.5 s, I²t interpolated linearly in t between the two tabulated points;
 * - above 0.5 s, constant I²t from the 0.5 s point (ignores cooling, so it errs low);
 * - below 0.25 s, held at the 0.25 s value: the first-peak force does not shrink with duration,
 *   so a faster clearing earns no credit beyond the shortest tabulated rating.
 */
export function gradeWithstandKa(row: GradeRow, durationS: number): number {
  const i2tShort = row.withstand15Ka ** 2 * TABLE_SHORT_S;
  const i2tLong = row.withstand30Ka ** 2 * TABLE_LONG_S;
  if (durationS <= TABLE_SHORT_S) return row.withstand15Ka;
  if (durationS >= TABLE_LONG_S) return Math.sqrt(i2tLong / durationS);
  const share = (durationS - TABLE_SHORT_S) / (TABLE_LONG_S - TABLE_SHORT_S);
  return Math.sqrt((i2tShort + share * (i2tLong - i2tShort)) / durationS);
}

/**
 * Rating of a grounding cable, kA symmetrical rms, for a fault of durationS: the grade table's
 * withstand figure for its size converted as gradeWithstandKa says, never above the Onderdonk
 * fusing current. No. 4 has no grade: its rating is grade 1's scaled by area (Onderdonk's current
 * is proportional to area), so the minimum-size rule can still report figures.
 */
export function cableRating(
  cable: CableSize,
  durationS: number,
  frequencyHz: 50 | 60,
): { ratingKa: number; fusingKa: number; basis: string } {
  const fuseKa = fusingKa(cable, durationS);
  const cycles = Math.round(durationS * RATING_TABLE_HZ * 10) / 10;
  void frequencyHz; // the table counts 60 Hz cycles: converted by time, never by cycle count
  const row = GRADES[cable];
  if (row) {
    return {
      ratingKa: Math.min(gradeWithstandKa(row, durationS), fuseKa),
      fusingKa: fuseKa,
      basis: `ASTM F855 grade ${row.grade} withstand, converted by I²t to ${cycles} cycles of 60 Hz, capped at Onderdonk fusing`,
    };
  }
  const grade1 = GRADES['2'] as GradeRow;
  const areaRatio = CABLES[cable].areaCmil / CABLES['2'].areaCmil;
  return {
    ratingKa: Math.min(gradeWithstandKa(grade1, durationS) * areaRatio, fuseKa),
    fusingKa: fuseKa,
    basis: `no ASTM F855 grade for this size: grade 1 withstand scaled by area, ${cycles} cycles of 60 Hz, capped at Onderdonk fusing`,
  };
}

/**
 * Clamp rating, kA, at durationS from its rating clampKa for clampCycles, by constant I²t:
 * I_t = clampKa·√(t_clamp/t). clampCycles are cycles of 60 Hz (RATING_TABLE_HZ), the basis the
 * ratings are published on, at either system frequency: the system's frequency only sets how
 * long its own clearing cycles last (durationS). A clearing faster than both the clamp's own
 * rating time and 15 cycles (0.25 s) earns no further credit, for the first-peak reason above.
 */
export function clampRatingAt(clampKa: number, clampCycles: number, durationS: number, frequencyHz: 50 | 60): number {
  void frequencyHz; // kept in the signature (calc/contract.ts): durations arrive in seconds already
  const clampS = clampCycles / RATING_TABLE_HZ;
  const effectiveS = Math.max(durationS, Math.min(clampS, TABLE_SHORT_S));
  return clampKa * Math.sqrt(clampS / effectiveS);
}

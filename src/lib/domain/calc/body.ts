/**
 * What a person can tolerate: Dalziel's body-current limit and the step and touch voltage
 * criteria built on it, both as IEEE Std 80 states them.
 */

/** Dalziel's constant k, A·√s, for the body weight — IEEE Std 80: 0.116 (50 kg), 0.157 (70 kg). */
export const dalzielK = (bodyKg: 50 | 70): number => (bodyKg === 70 ? 0.157 : 0.116);

/** Shortest duration for which IEEE Std 80 states Dalziel's formula valid, s. */
export const DALZIEL_MIN_S = 0.03;
/** Longest duration for which IEEE Std 80 states Dalziel's formula valid, s. */
export const DALZIEL_MAX_S = 3;

/**
 * The duration to put into Dalziel's formula. IEEE Std 80 states it for 0.03 s to 3 s. Below
 * 0.03 s we hold 0.03 s: k/√t would keep rising and credit a tolerance nobody measured. Above
 * 3 s we keep the formula: it keeps falling, which is the conservative direction.
 */
export const dalzielDurationS = (durationS: number): number => Math.max(durationS, DALZIEL_MIN_S);

/** Tolerable body current, A rms, for a shock of durationS seconds — IEEE Std 80 (Dalziel): k/√t. */
export function tolerableBodyAmps(durationS: number, bodyKg: 50 | 70): number {
  return dalzielK(bodyKg) / Math.sqrt(dalzielDurationS(durationS));
}

/**
 * Surface-layer derating factor Cs, dimensionless — IEEE Std 80:
 * Cs = 1 − 0.09(1 − ρ/ρs)/(2hs + 0.09); no surface layer (hs = 0 or ρs = ρ) gives 1.
 */
export function surfaceLayerFactor(soilOhmM: number, surfaceOhmM: number, surfaceDepthM: number): number {
  if (surfaceDepthM <= 0) return 1;
  return 1 - (0.09 * (1 - soilOhmM / surfaceOhmM)) / (2 * surfaceDepthM + 0.09);
}

export interface StepTouchInput {
  /** Resistivity of the surface the person stands on, Ω·m (the soil itself when bare). */
  surfaceOhmM: number;
  /** Surface-layer derating factor; 1 on bare soil. */
  cs: number;
  durationS: number;
  bodyKg: 50 | 70;
}

/**
 * Tolerable touch and step voltages, V — IEEE Std 80:
 * E_touch = (1000 + 1.5·Cs·ρs)·k/√t, E_step = (1000 + 6·Cs·ρs)·k/√t, with the 1000 Ω body.
 */
export function stepTouchCriteria(input: StepTouchInput): { touchVolts: number; stepVolts: number } {
  const limitA = tolerableBodyAmps(input.durationS, input.bodyKg);
  const footOhms = input.cs * input.surfaceOhmM;
  return { touchVolts: (1000 + 1.5 * footOhms) * limitA, stepVolts: (1000 + 6 * footOhms) * limitA };
}

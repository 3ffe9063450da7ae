/**
 * Shape of the fault current at the work location: duration, DC-offset decrement factor,
 * first peak and the force it puts on parallel phase leads.
 */
import type { PlanDocument } from '@/lib/schemas/plan';
import type { FaultFigures } from './contract';
import { toAmps, kiloamps } from './units';

/** Fault duration in seconds from the clearing time in cycles of the system frequency. */
export function faultDurationS(clearingCycles: number, frequencyHz: number): number {
  return clearingCycles / frequencyHz;
}

/**
 * Decrement factor Df (dimensionless) for a fault of durationS seconds — IEEE Std 80:
 * Df = √(1 + (Ta/t)(1 − e^(−2t/Ta))), Ta = (X/R)/(2πf). X/R = 0 means no DC offset, Df = 1.
 */
export function decrementFactor(xOverR: number, durationS: number, frequencyHz: number): number {
  if (xOverR <= 0) return 1;
  const taS = xOverR / (2 * Math.PI * frequencyHz);
  return Math.sqrt(1 + (taS / durationS) * (1 - Math.exp((-2 * durationS) / taS)));
}

/**
 * Peak factor κ (dimensionless) — IEC 60909-0: κ = 1.02 + 0.98·e^(−3R/X).
 * X/R = 0 (purely resistive) gives e^(−∞) = 0, so κ = 1.02, the formula's own floor.
 */
export function peakFactor(xOverR: number): number {
  if (xOverR <= 0) return 1.02;
  return 1.02 + 0.98 * Math.exp(-3 / xOverR);
}

/**
 * Force per metre, N/m, between two long parallel conductors carrying peakA each, spacingM
 * apart — F/l = 2×10⁻⁷·I₁I₂/d (the SI definition of the ampere before 2019).
 */
export function parallelForceNPerM(currentA: number, spacingM: number): number {
  return (2e-7 * currentA * currentA) / spacingM;
}

/**
 * Line-to-neutral voltage, V, of a system of nominalKv (phase-to-phase, as the trade states a
 * system's nominal voltage): V = 1000·kV/√3.
 */
export function lineToNeutralVolts(nominalKv: number): number {
  return (nominalKv * 1000) / Math.sqrt(3);
}

/**
 * Fault figures for the report (docs/plan-format.md): symmetrical rms kA, duration s, Df (IEEE Std 80),
 * asymmetrical rms kA, κ (IEC 60909-0), first peak kA, the first-peak force N/m on phase leads, the
 * current injected for contacts and rods (Df·If, IEEE Std 80) and the line-to-neutral voltage.
 */
export function computeFault(system: PlanDocument['system']): FaultFigures {
  // Missing system data (a new plan) gives NaN figures; the checker blocks on it by name.
  const faultKa = system.faultKa ?? NaN;
  const xOverR = system.xOverR ?? NaN;
  const durationS = faultDurationS(system.clearingCycles ?? NaN, system.frequencyHz);
  const df = decrementFactor(xOverR, durationS, system.frequencyHz);
  const kappa = peakFactor(xOverR);
  const peakKa = kiloamps(kappa * Math.SQRT2 * faultKa);
  return {
    symmetricalKa: faultKa,
    durationS,
    decrementFactor: df,
    asymmetricalKa: df * faultKa,
    peakFactor: kappa,
    peakKa,
    peakForceNPerM: system.phaseSpacingM === undefined ? null : parallelForceNPerM(toAmps(peakKa), system.phaseSpacingM),
    injectedKa: df * faultKa,
    lineToNeutralVolts: system.nominalKv === undefined ? null : lineToNeutralVolts(system.nominalKv),
  };
}

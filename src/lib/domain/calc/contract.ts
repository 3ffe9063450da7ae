/**
 * The seam between the checker's rules (src/lib/domain/rules, zones, report) and the
 * calculations (src/lib/domain/calc). Both sides code against these types; calc/index.ts
 * implements the functions named in the comments below.
 */
import type { CableSize, PlanDocument } from '@/lib/schemas/plan';

/** Fault-current shape at the work location (report field `fault`). */
export interface FaultFigures {
  symmetricalKa: number;
  durationS: number;
  decrementFactor: number;
  asymmetricalKa: number;
  peakFactor: number;
  peakKa: number;
  /** Force between adjacent phase leads at the first peak; null when the plan gives no phase spacing. */
  peakForceNPerM: number | null;
  /**
   * Current injected for contacts and rods, kA: Df × If, the effective asymmetrical rms over the
   * shock duration that IEEE Std 80 compares with Dalziel's limit.
   */
  injectedKa: number;
  /** Line-to-neutral voltage nominalKv/√3, V, that caps every contact's open-circuit voltage; null without nominalKv. */
  lineToNeutralVolts: number | null;
}

/** One reach contact of one worker, worst case over the phase injections (report field `contacts`). */
export interface ContactFigures {
  worker: string;
  surface: string;
  touchVolts: number;
  bodyAmps: number;
  limitAmps: number;
  /** Id of the phase whose fault gave the worst case; null when no phase could be solved. */
  worstPhase: string | null;
  /**
   * 'solved': figures are from the network solve. 'floating': the standing node or the surface
   * has no path to remote earth, so no figure can be trusted (rules turn this into a blocker).
   */
  status: 'solved' | 'floating';
  /** True when the open-circuit voltage was capped at the line-to-neutral voltage (fault.lineToNeutralVolts). */
  systemVoltageLimited: boolean;
}

/** A bond (not a span) the solve puts current through (report field `bonds`). */
export interface BondFigures {
  link: string;
  /** Largest current the solve put through the bond, kA, worst phase. */
  currentKa: number;
  /** True when the plan gives the bond's resistance; otherwise BOND_DEFAULT_OHMS was used. */
  ohmsGiven: boolean;
}

export interface JumperFigures {
  link: string;
  ohms: number;
  /** Resistance and reactance parts, ohms, at the system frequency. */
  resistanceOhms: number;
  reactanceOhms: number;
  dutyKa: number;
  cableRatingKa: number;
  /** Onderdonk fusing current of the cable for the clearing time, kA. */
  fusingKa: number;
  /** Clamp rating converted to the clearing time by I²t; null when the plan gives none. */
  clampRatingKa: number | null;
  /** Largest current the solve put through this jumper, kA, worst phase. */
  currentKa: number | null;
}

export interface RodFigures {
  node: string;
  ohms: number;
  method: string;
  /** Current the worst solved fault sends through the rod to earth, kA (null when not solved). */
  currentKa: number | null;
  /** Rod potential rise, volts, for that current. */
  potentialRiseVolts: number | null;
  /** Distance from the rod beyond which the step voltage is below the tolerable step voltage, m. */
  barricadeRadiusM: number;
  tolerableStepVolts: number;
  barricadeMethod: string;
}

/** A value the calculation had to assume because the plan left it out (reported as a note). */
export interface Assumption {
  element: string;
  field: string;
  value: number;
  unit: string;
  basis: string;
}

export interface NetworkFigures {
  contacts: ContactFigures[];
  jumpers: JumperFigures[];
  rods: RodFigures[];
  /** Bonds (not spans: those are line conductor) the solve put more than 1 A through, in plan order. */
  bonds: BondFigures[];
  assumptions: Assumption[];
  /** Phase ids whose injection could not be solved because the phase has no path to earth. */
  unsolvedPhases: string[];
}

/*
 * calc/index.ts exports:
 *   computeFault(system: PlanDocument['system']): FaultFigures
 *   tolerableBodyAmps(durationS: number, bodyKg: 50 | 70): number
 *   cableRating(cable: CableSize, durationS: number, frequencyHz: 50 | 60): { ratingKa: number; fusingKa: number; basis: string }
 *   clampRatingAt(clampKa: number, clampCycles: number, durationS: number, frequencyHz: 50 | 60): number
 *   analyseNetwork(plan: PlanDocument): NetworkFigures
 */
export type CalcEntryPoints = {
  computeFault(system: PlanDocument['system']): FaultFigures;
  tolerableBodyAmps(durationS: number, bodyKg: 50 | 70): number;
  cableRating(cable: CableSize, durationS: number, frequencyHz: 50 | 60): { ratingKa: number; fusingKa: number; basis: string };
  clampRatingAt(clampKa: number, clampCycles: number, durationS: number, frequencyHz: 50 | 60): number;
  analyseNetwork(plan: PlanDocument): NetworkFigures;
};

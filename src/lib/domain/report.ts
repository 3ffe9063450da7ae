/**
 * The check report, version 1 (docs/plan-format.md, "Check report"): what
 * `POST /api/check` returns and `npm run check` prints. Fields beyond the contract are optional
 * additions; a figure that could not be computed is null and a `figure-invalid` blocker names it,
 * so the JSON never carries NaN or Infinity.
 */
import type { ReportSet } from './sets-in-plan';

export const REPORT_FORMAT = 'bondmap-check' as const;
export const REPORT_VERSION = 1 as const;

/** Carried by every report, print and PDF (product.md, "Safety wording"); our own words. */
export const CAUTION =
  'Bondmap is a planning aid. It does not replace your employer\'s procedures, local codes or the judgement of a qualified person. ' +
  'Before any ground goes on, test for absence of voltage with an approved detector, and treat every conductor as energized until it is grounded.';

export const SEVERITIES = ['blocker', 'warning', 'note'] as const;
export type Severity = (typeof SEVERITIES)[number];

export interface Finding {
  /** Permanent rule id, e.g. `surface-outside-zone`. */
  rule: string;
  severity: Severity;
  /** Ids of the nodes and links the finding is about, in the order the rule documents. */
  elements: string[];
  /** One sentence for the crew lead, with the numbers and, for a blocker, what to do instead. */
  message: string;
  /** The standard, regulation or practice the rule rests on. */
  basis: string;
}

/** A computed number, or null when it could not be computed (never NaN or Infinity). */
export type Figure = number | null;

export interface ReportFault {
  symmetricalKa: Figure;
  durationS: Figure;
  decrementFactor: Figure;
  asymmetricalKa: Figure;
  peakFactor: Figure;
  peakKa: Figure;
  /** Null also when the plan gives no phase spacing. */
  peakForceNPerM: Figure;
  /** Extra: current injected for contacts and rods, Df × symmetricalKa (IEEE Std 80). */
  injectedKa?: Figure;
  /** Extra: line-to-neutral voltage that caps contact voltages; null without nominalKv. */
  lineToNeutralVolts?: Figure;
}

export interface ReportZone {
  nodes: string[];
  grounded: boolean;
  /** Extra: the zone is not grounded and a pole ground is what stands in for the connection. */
  groundedOnlyViaPoleGround?: boolean;
  /** Extra: phases, standing nodes and reached surfaces that reach ground only through a pole ground. */
  poleGroundDependent?: string[];
}

export interface ReportContact {
  worker: string;
  surface: string;
  /** Null when the contact could not be solved (a side floats); a finding says so. */
  touchVolts: Figure;
  bodyAmps: Figure;
  limitAmps: Figure;
  /** Extra: the phase whose fault gave the worst case. */
  worstPhase?: string | null;
  /** Extra: 'solved' or 'floating' (calc/contract.ts). */
  status?: 'solved' | 'floating';
  /** Extra: present (true) when the open-circuit voltage was capped at the line-to-neutral voltage. */
  systemVoltageLimited?: boolean;
}

/** Extra: a bond (not a span) the solve put more than 1 A through. */
export interface ReportBond {
  link: string;
  currentKa: Figure;
  ohmsGiven: boolean;
}

export interface ReportJumper {
  link: string;
  ohms: Figure;
  dutyKa: Figure;
  cableRatingKa: Figure;
  /** Null when the plan gives no clamp rating. */
  clampRatingKa: Figure;
  resistanceOhms?: Figure;
  reactanceOhms?: Figure;
  fusingKa?: Figure;
  currentKa?: Figure;
}

export interface ReportRod {
  node: string;
  ohms: Figure;
  method?: string;
  barricadeRadiusM?: Figure;
  tolerableStepVolts?: Figure;
  barricadeMethod?: string;
  currentKa?: Figure;
  potentialRiseVolts?: Figure;
}

export interface ReportAssumption {
  element: string;
  field: string;
  value: Figure;
  unit: string;
  basis: string;
}

/** A type alias, not an interface, so it is assignable to `Record<string, unknown>` for storage. */
export type CheckReport = {
  format: typeof REPORT_FORMAT;
  version: typeof REPORT_VERSION;
  /** True when there is no blocker. */
  ok: boolean;
  summary: { blockers: number; warnings: number; notes: number };
  /** Sorted: severity (blocker, warning, note), then rule id, then elements. */
  findings: Finding[];
  fault: ReportFault;
  tolerableBodyAmps: Figure;
  zones: ReportZone[];
  contacts: ReportContact[];
  jumpers: ReportJumper[];
  rods: ReportRod[];
  /** Extra: bonds (not spans) that carry fault current in the solve. */
  bonds?: ReportBond[];
  /** Extra: values the calculation assumed because the plan left them out. */
  assumptions?: ReportAssumption[];
  /** Extra: the grounding sets the plan names, with status and due date (only when checked against an inventory). */
  sets?: ReportSet[];
  /** Extra: the safety caution, on every report. */
  caution: string;
};

/**
 * The checker: zones, calculations and rules composed into one check report
 * (docs/plan-format.md, "Check report"). Pure: same plan, same report.
 */
import type { PlanDocument } from '@/lib/schemas/plan';
import { calc as defaultCalc } from './calc/index';
import type { CalcEntryPoints, FaultFigures, NetworkFigures } from './calc/contract';
import { buildPlanModel } from './plan-model';
import {
  CAUTION,
  REPORT_FORMAT,
  REPORT_VERSION,
  type CheckReport,
  type Figure,
  type Finding,
  type ReportContact,
  type ReportJumper,
  type ReportRod,
} from './report';
import { compareFindings, runRules } from './rules/index';
import { applyInventory, reportSets, type CheckOptions } from './sets-in-plan';
import { missingSystemData } from './rules/system-data-missing';
import { mapZones } from './zones';

export const CALC_FAILED = 'calc-failed';


/** A figure as the report carries it: null instead of NaN or an infinity. */
const figure = (value: number | null | undefined): Figure => (typeof value === 'number' && Number.isFinite(value) ? value : null);

const EMPTY_NETWORK: NetworkFigures = { contacts: [], jumpers: [], rods: [], bonds: [], assumptions: [], unsolvedPhases: [] };

/** The fault figures the schema's bounds guarantee even when the calculation fails. */
function fallbackFault(plan: PlanDocument): FaultFigures {
  const durationS = (plan.system.clearingCycles ?? NaN) / plan.system.frequencyHz;
  return { symmetricalKa: plan.system.faultKa ?? NaN, durationS, decrementFactor: NaN, asymmetricalKa: NaN, peakFactor: NaN, peakKa: NaN, peakForceNPerM: null, injectedKa: NaN, lineToNeutralVolts: null };
}

function calcFailed(error: unknown): Finding {
  const detail = error instanceof Error ? error.message : String(error);
  return {
    rule: CALC_FAILED,
    severity: 'blocker',
    elements: [],
    message: `The fault and network figures could not be computed (${detail}); the plan cannot be shown safe until this is fixed.`,
    basis: 'Bondmap checker: a figure that cannot be computed cannot show the plan safe',
  };
}

/** Runs the calculations, turning a thrown error into a blocker rather than a failed request. */
function runCalc(plan: PlanDocument, calc: CalcEntryPoints) {
  const extra: Finding[] = [];
  let fault: FaultFigures | undefined;
  let tolerableBodyAmps = NaN;
  let network = EMPTY_NETWORK;
  // Without the fault data no figure means anything: system-data-missing blocks instead.
  if (missingSystemData(plan.system).length > 0) return { fault: fallbackFault(plan), tolerableBodyAmps, network, extra };
  try {
    fault = calc.computeFault(plan.system);
    tolerableBodyAmps = calc.tolerableBodyAmps(fault.durationS, plan.criteria?.bodyKg ?? 50);
    network = calc.analyseNetwork(plan);
  } catch (error) {
    extra.push(calcFailed(error));
  }
  return { fault: fault ?? fallbackFault(plan), tolerableBodyAmps, network, extra };
}

function toReportContact(contact: NetworkFigures['contacts'][number]): ReportContact {
  const solved = contact.status === 'solved';
  return {
    worker: contact.worker,
    surface: contact.surface,
    touchVolts: solved ? figure(contact.touchVolts) : null,
    bodyAmps: solved ? figure(contact.bodyAmps) : null,
    limitAmps: figure(contact.limitAmps),
    worstPhase: contact.worstPhase,
    status: contact.status,
    ...(contact.systemVoltageLimited ? { systemVoltageLimited: true } : {}),
  };
}

function toReportJumper(jumper: NetworkFigures['jumpers'][number]): ReportJumper {
  return {
    link: jumper.link,
    ohms: figure(jumper.ohms),
    dutyKa: figure(jumper.dutyKa),
    cableRatingKa: figure(jumper.cableRatingKa),
    clampRatingKa: figure(jumper.clampRatingKa),
    resistanceOhms: figure(jumper.resistanceOhms),
    reactanceOhms: figure(jumper.reactanceOhms),
    fusingKa: figure(jumper.fusingKa),
    currentKa: figure(jumper.currentKa),
  };
}

function toReportRod(rod: NetworkFigures['rods'][number]): ReportRod {
  return {
    node: rod.node,
    ohms: figure(rod.ohms),
    method: rod.method,
    barricadeRadiusM: figure(rod.barricadeRadiusM),
    tolerableStepVolts: figure(rod.tolerableStepVolts),
    barricadeMethod: rod.barricadeMethod,
    currentKa: figure(rod.currentKa),
    potentialRiseVolts: figure(rod.potentialRiseVolts),
  };
}

/**
 * Checks a parsed plan: bonded zones (OSHA 29 CFR 1910.269(n)(3)), fault figures and body-current
 * limits (IEEE Std 80, IEC 60909-0), cable and clamp ratings (ASTM F855, secondhand) and every rule
 * of rules/, returned as the version-1 check report. `calc` is replaceable for tests.
 */
export function checkPlan(drawn: PlanDocument, calc: CalcEntryPoints = defaultCalc, options: CheckOptions = {}): CheckReport {
  // With an inventory, jumpers that name a known set carry that set's figures from here on.
  const { plan, sets } = applyInventory(drawn, options);
  const model = buildPlanModel(plan);
  const zones = mapZones(model);
  const { fault, tolerableBodyAmps, network, extra } = runCalc(plan, calc);
  const durationS = fault.durationS;
  const frequencyHz = plan.system.frequencyHz;
  const ruleFindings = runRules({
    plan,
    model,
    zones,
    fault,
    tolerableBodyAmps,
    network,
    sets,
    units: options.units ?? 'metric',
    cableRatingKa(cable) {
      try {
        return calc.cableRating(cable, durationS, frequencyHz).ratingKa;
      } catch {
        return NaN;
      }
    },
  });
  // The fault figures of a plan without fault data are unknown, not wrong: one blocker says so.
  const incomplete = missingSystemData(plan.system).length > 0;
  const findings = [...ruleFindings.filter((f) => !(incomplete && f.rule === 'figure-invalid' && f.elements.length === 0)), ...extra].sort(compareFindings);
  const count = (severity: Finding['severity']) => findings.filter((f) => f.severity === severity).length;
  const blockers = count('blocker');
  return {
    format: REPORT_FORMAT,
    version: REPORT_VERSION,
    ok: blockers === 0,
    summary: { blockers, warnings: count('warning'), notes: count('note') },
    findings,
    fault: {
      symmetricalKa: figure(fault.symmetricalKa),
      durationS: figure(fault.durationS),
      decrementFactor: figure(fault.decrementFactor),
      asymmetricalKa: figure(fault.asymmetricalKa),
      peakFactor: figure(fault.peakFactor),
      peakKa: figure(fault.peakKa),
      peakForceNPerM: figure(fault.peakForceNPerM),
      injectedKa: figure(fault.injectedKa),
      lineToNeutralVolts: figure(fault.lineToNeutralVolts),
    },
    tolerableBodyAmps: figure(tolerableBodyAmps),
    zones: zones.zones.map((zone) => ({
      nodes: zone.nodes,
      grounded: zone.grounded,
      ...(zone.groundedOnlyViaPoleGround ? { groundedOnlyViaPoleGround: true } : {}),
      ...(zone.poleGroundDependent.length > 0 ? { poleGroundDependent: zone.poleGroundDependent } : {}),
    })),
    contacts: network.contacts.map(toReportContact),
    jumpers: network.jumpers.map(toReportJumper),
    rods: network.rods.map(toReportRod),
    bonds: network.bonds.map((bond) => ({ link: bond.link, currentKa: figure(bond.currentKa), ohmsGiven: bond.ohmsGiven })),
    assumptions: network.assumptions.map((a) => ({ ...a, value: figure(a.value) })),
    ...(sets ? { sets: reportSets(sets) } : {}),
    caution: CAUTION,
  };
}

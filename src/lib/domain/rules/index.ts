/**
 * Every checker rule, one per file, and the stable order findings are reported in: severity
 * (blocker, warning, note), then rule id, then elements.
 */
import { compareIds } from '@/lib/domain/plan-model';
import { SEVERITIES } from '@/lib/domain/report';
import { checkBodyCurrentExceeds } from './body-current-exceeds';
import { checkBondFaultCurrent } from './bond-fault-current';
import { checkBondNotRated } from './bond-not-rated';
import { checkBoomUninsulated } from './boom-uninsulated';
import { checkClampLiveLine } from './clamp-live-line';
import { checkConcreteGroundIgnored } from './concrete-ground-ignored';
import { checkEarthLink } from './earth-link';
import { checkLeadBareStrands } from './lead-bare-strands';
import { checkLeadWhip } from './lead-whip';
import { checkPlanIncomplete } from './plan-incomplete';
import { checkRodOutOfRange } from './rod-out-of-range';
import { checkSupplySideSinglePoint, checkSupplySideUngrounded } from './supply-side';
import { checkWorkerNoReach } from './worker-no-reach';
import { checkCableBelowMinimum } from './cable-below-minimum';
import { checkCableUnderrated } from './cable-underrated';
import { checkClampUnderrated } from './clamp-underrated';
import { checkClearingOutsideRange } from './clearing-outside-range';
import { checkContactUnsolved } from './contact-unsolved';
import { checkDefaultAssumed } from './default-assumed';
import { checkFigureInvalid } from './figure-invalid';
import { checkLeadSlack } from './lead-slack';
import { checkLinkOnInsulator } from './link-on-insulator';
import { checkPhaseUngrounded } from './phase-ungrounded';
import { checkPoleGroundRelied } from './pole-ground-relied';
import { checkReachInsulating } from './reach-insulating';
import { checkRodBarricade } from './rod-barricade';
import { checkSetDiffers } from './set-differs';
import { checkSetNotInService } from './set-not-in-service';
import { checkSetTestOverdue } from './set-test-overdue';
import { checkSetUnknown } from './set-unknown';
import { checkSetUsedTwice } from './set-used-twice';
import { checkStandNotConductive } from './stand-not-conductive';
import { checkSurfaceOutsideZone } from './surface-outside-zone';
import { checkSystemDataMissing } from './system-data-missing';
import type { Finding, Rule, RuleContext } from './types';
import { checkWorkerStandsNowhere } from './worker-stands-nowhere';
import { checkZoneUngrounded } from './zone-ungrounded';

export type { Finding, Rule, RuleContext } from './types';

/** Rule id → rule. The ids are permanent: stored reviews and comments refer to them. */
export const RULES: Readonly<Record<string, Rule>> = {
  'stand-not-conductive': checkStandNotConductive,
  'surface-outside-zone': checkSurfaceOutsideZone,
  'phase-ungrounded': checkPhaseUngrounded,
  'zone-ungrounded': checkZoneUngrounded,
  'pole-ground-relied': checkPoleGroundRelied,
  'cable-below-minimum': checkCableBelowMinimum,
  'cable-underrated': checkCableUnderrated,
  'clamp-underrated': checkClampUnderrated,
  'body-current-exceeds': checkBodyCurrentExceeds,
  'lead-slack': checkLeadSlack,
  'rod-barricade': checkRodBarricade,
  'default-assumed': checkDefaultAssumed,
  'contact-unsolved': checkContactUnsolved,
  'link-on-insulator': checkLinkOnInsulator,
  'reach-insulating': checkReachInsulating,
  'clearing-outside-range': checkClearingOutsideRange,
  'figure-invalid': checkFigureInvalid,
  'set-unknown': checkSetUnknown,
  'set-not-in-service': checkSetNotInService,
  'set-test-overdue': checkSetTestOverdue,
  'set-differs': checkSetDiffers,
  'set-used-twice': checkSetUsedTwice,
  'earth-link': checkEarthLink,
  'bond-not-rated': checkBondNotRated,
  'bond-fault-current': checkBondFaultCurrent,
  'plan-incomplete': checkPlanIncomplete,
  'worker-no-reach': checkWorkerNoReach,
  'boom-uninsulated': checkBoomUninsulated,
  'concrete-ground-ignored': checkConcreteGroundIgnored,
  'rod-out-of-range': checkRodOutOfRange,
  'lead-whip': checkLeadWhip,
  'clamp-live-line': checkClampLiveLine,
  'lead-bare-strands': checkLeadBareStrands,
  'supply-side-ungrounded': checkSupplySideUngrounded,
  'supply-side-single-point': checkSupplySideSinglePoint,
  'system-data-missing': checkSystemDataMissing,
  'worker-stands-nowhere': checkWorkerStandsNowhere,
};

/**
 * Every rule id a finding can carry: the registered rules and the checker's own `calc-failed`;
 * docs/rules.md lists exactly these (tests/unit/domain/rules-doc.test.ts).
 */
export const RULE_IDS: readonly string[] = [...Object.keys(RULES), 'calc-failed'];
/** Ids that earlier reports carried and the checker no longer emits; kept so stored reports still read. */
export const RETIRED_RULE_IDS: readonly string[] = ['no-worker'];

function compareElements(a: string[], b: string[]): number {
  for (let i = 0; i < Math.min(a.length, b.length); i += 1) {
    const order = compareIds(a[i], b[i]);
    if (order !== 0) return order;
  }
  return a.length - b.length;
}

/** Orders findings by severity (blocker, warning, note), then rule id, then elements. */
export function compareFindings(a: Finding, b: Finding): number {
  return (
    SEVERITIES.indexOf(a.severity) - SEVERITIES.indexOf(b.severity) ||
    compareIds(a.rule, b.rule) ||
    compareElements(a.elements, b.elements)
  );
}

/** Runs every rule and returns their findings sorted, dropping exact repeats (a reach drawn twice). */
export function runRules(ctx: RuleContext, rules: Readonly<Record<string, Rule>> = RULES): Finding[] {
  const seen = new Set<string>();
  const findings: Finding[] = [];
  for (const rule of Object.values(rules)) {
    for (const finding of rule(ctx)) {
      const key = JSON.stringify([finding.rule, finding.elements, finding.message]);
      if (seen.has(key)) continue;
      seen.add(key);
      findings.push(finding);
    }
  }
  return findings.sort(compareFindings);
}

/**
 * Every checker rule, one per file, and the stable order findings are reported in: severity
 * (blocker, warning, note), then rule id, then elements.
 */
import { compareIds } from '../plan-model';
import { SEVERITIES } from '../report';
import { checkBodyCurrentExceeds } from './body-current-exceeds';
import { checkCableBelowMinimum } from './cable-below-minimum';
import { checkCableUnderrated } from './cable-underrated';
import { checkClampUnderrated } from './clamp-underrated';
import { checkClearingOutsideRange } from './clearing-outside-range';
import { checkContactUnsolved } from './contact-unsolved';
import { checkDefaultAssumed } from './default-assumed';
import { checkFigureInvalid } from './figure-invalid';
import { checkLeadSlack } from './lead-slack';
import { checkLinkOnInsulator } from './link-on-insulator';
import { checkNoWorker } from './no-worker';
import { checkPhaseUngrounded } from './phase-ungrounded';
import { checkPoleGroundRelied } from './pole-ground-relied';
import { checkReachInsulating } from './reach-insulating';
import { checkRodBarricade } from './rod-barricade';
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
  'no-worker': checkNoWorker,
  'link-on-insulator': checkLinkOnInsulator,
  'reach-insulating': checkReachInsulating,
  'clearing-outside-range': checkClearingOutsideRange,
  'figure-invalid': checkFigureInvalid,
  'system-data-missing': checkSystemDataMissing,
  'worker-stands-nowhere': checkWorkerStandsNowhere,
};

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

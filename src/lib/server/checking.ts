/** Runs the pure checker for the server: every saved revision carries the report of its document. */
import { checkPlan } from '../domain/checker';
import type { CheckReport } from '../domain/report';
import type { UnitSystem } from '../domain/units';
import type { PlanDocument } from '../schemas/plan';

export function checkDocument(document: PlanDocument, units: UnitSystem = 'metric'): CheckReport {
  return checkPlan(document, undefined, { units });
}

/** Runs the pure checker for the server: every saved revision carries the report of its document. */
import { checkPlan } from '../domain/checker';
import type { CheckReport } from '../domain/report';
import type { PlanDocument } from '../schemas/plan';

export function checkDocument(document: PlanDocument): CheckReport {
  return checkPlan(document);
}

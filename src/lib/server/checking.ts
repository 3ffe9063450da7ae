/** Runs the pure checker for the server: every saved revision carries the report of its document. */
import type { Db } from '../../../db/connection';
import { inventoryFor } from '../../../db/repositories/equipment';
import { checkPlan } from '../domain/checker';
import type { CheckReport } from '../domain/report';
import { setTagsOf, type CheckOptions, type CheckStage } from '../domain/sets-in-plan';
import type { PlanDocument } from '../schemas/plan';
import { today } from './equipment-http';

export function checkDocument(document: PlanDocument, options: CheckOptions = {}): CheckReport {
  return checkPlan(document, undefined, options);
}

/**
 * Checks a document against the organisation's grounding sets (only those it names; a plan that
 * names none is checked as before) on today's date, at the given stage.
 */
export async function checkForOrganization(db: Db, organizationId: number, document: PlanDocument, stage: CheckStage = 'draft'): Promise<CheckReport> {
  const tags = setTagsOf(document);
  if (tags.length === 0) return checkDocument(document);
  return checkDocument(document, { inventory: await inventoryFor(db, organizationId, tags), today: today(), stage });
}

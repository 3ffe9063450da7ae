/**
 * A stored check report as the organisation reads it. Reports are stored with their sentences in
 * metres; for a crew in feet the findings are re-worded through `findingsInUnits` (the one
 * formatter: a re-run of the check in feet lends its message only to the same finding at the same
 * place), so every page and the read-only drawing say the same thing in the same units.
 */
import type { Db } from '@db/connection';
import type { CheckReport } from '@/lib/domain/report';
import { findingsInUnits } from '@/lib/domain/findings-in-units';
import type { PlanStatus } from '@/lib/domain/plan-status';
import type { UnitSystem } from '@/lib/domain/units';
import type { PlanDocument } from '@/lib/schemas/plan';
import { checkForOrganization } from './checking';
import { AppError } from './errors';

export async function reportInUnits(db: Db, organizationId: number, plan: { document: PlanDocument; report: CheckReport | null; status: PlanStatus }, units: UnitSystem): Promise<CheckReport | null> {
  const { report } = plan;
  if (!report || units === 'metric' || report.findings.length === 0) return report;
  const stage = plan.status === 'submitted' || plan.status === 'approved' ? 'submit' : 'draft';
  try {
    const reworded = await checkForOrganization(db, organizationId, plan.document, stage, units);
    return { ...report, findings: findingsInUnits(report.findings, reworded.findings) };
  } catch (error) {
    // A busy or slow checker leaves the stored wording: the page still shows every finding.
    if (error instanceof AppError) return report;
    throw error;
  }
}

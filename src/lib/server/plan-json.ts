/** How plans look on the wire: dates as ISO strings, nothing internal. */
import type { PlanDetail, PlanSummary } from '@db/repositories/plans';

export function summaryJson(plan: PlanSummary) {
  return {
    id: plan.id,
    title: plan.title,
    structure: plan.structure,
    status: plan.status,
    blockers: plan.blockers,
    warnings: plan.warnings,
    author: { id: plan.authorId, name: plan.authorName },
    currentRevision: plan.currentRevision,
    submittedAt: plan.submittedAt?.toISOString() ?? null,
    createdAt: plan.createdAt.toISOString(),
    updatedAt: plan.updatedAt.toISOString(),
  };
}

export function planJson(plan: PlanDetail) {
  return {
    ...summaryJson(plan),
    document: plan.document,
    report: plan.report,
    revisionCreatedAt: plan.revisionCreatedAt.toISOString(),
  };
}

/**
 * What every checker rule receives and returns. A rule is a pure function of this context; how
 * findings are shown (panel, JSON, PDF) is someone else's code.
 */
import type { CableSize, PlanDocument } from '@/lib/schemas/plan';
import type { FaultFigures, NetworkFigures } from '@/lib/domain/calc/contract';
import type { PlanModel } from '@/lib/domain/plan-model';
import type { SetContext } from '@/lib/domain/sets-in-plan';
import type { Finding } from '@/lib/domain/report';
import type { UnitSystem } from '@/lib/domain/units';
import type { ZoneMap } from '@/lib/domain/zones';

export type { Finding, Severity } from '@/lib/domain/report';

export interface RuleContext {
  plan: PlanDocument;
  model: PlanModel;
  zones: ZoneMap;
  fault: FaultFigures;
  /** Dalziel tolerable body current for the clearing time and body weight, A (IEEE Std 80). */
  tolerableBodyAmps: number;
  network: NetworkFigures;
  /** Rating of a cable size for this plan's clearing time and frequency, kA, to suggest a size that suffices. */
  cableRatingKa(cable: CableSize): number;
  /** The grounding sets the plan names, when an inventory was given (set-* rules); `plan` then carries the sets' figures. */
  sets?: SetContext | null;
  /** The units the findings' sentences give lengths in (the reader's choice; figures stay SI). */
  units: UnitSystem;
}

export type Rule = (ctx: RuleContext) => Finding[];

/** The body weight the plan's criteria select (docs/plan-format.md: default 50 kg). */
export function bodyKgOf(plan: PlanDocument): 50 | 70 {
  return plan.criteria?.bodyKg ?? 50;
}

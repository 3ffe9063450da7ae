/** Configuration tags of a plan, for filtering the library: what kind of work it shows. */
import type { PlanDocument } from '@/lib/schemas/plan';

export const PLAN_TAGS = ['bucket work', 'climber', 'ground worker', 'truck', 'mat', 'driven rod', 'double circuit', 'shield wire', 'wood', 'steel', 'concrete', 'fiberglass'] as const;
export type PlanTag = (typeof PLAN_TAGS)[number];

/** Tags derived from the document alone (no stored labels to drift out of date). */
export function planTags(plan: PlanDocument): PlanTag[] {
  const kindOf = new Map(plan.nodes.map((n) => [n.id, n.kind]));
  const tags = new Set<PlanTag>();
  for (const node of plan.nodes) {
    if (node.kind === 'worker') {
      const stand = node.standsOn === undefined ? undefined : kindOf.get(node.standsOn);
      if (stand === 'bucket') tags.add('bucket work');
      else if (stand === 'earth' || stand === 'mat' || stand === 'truck') tags.add('ground worker');
      else tags.add('climber');
    }
    if (node.kind === 'truck') tags.add('truck');
    if (node.kind === 'mat') tags.add('mat');
    if (node.kind === 'ground-rod') tags.add('driven rod');
    if (node.kind === 'shield-wire') tags.add('shield wire');
    if (node.kind === 'structure') tags.add(node.material);
  }
  if (plan.nodes.filter((n) => n.kind === 'phase').length >= 6) tags.add('double circuit');
  return PLAN_TAGS.filter((t) => tags.has(t));
}

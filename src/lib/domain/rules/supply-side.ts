import { capitalise, isBondingLink, isConductive, isGroundSource, isPoleGround, isSpan } from '@/lib/domain/plan-model';
import { listOf } from './format';
import type { Finding, RuleContext } from './types';

export const SUPPLY_SIDE_UNGROUNDED = 'supply-side-ungrounded';
export const SUPPLY_SIDE_SINGLE_POINT = 'supply-side-single-point';

const BASIS = 'grounds go between the work location and every source, or at the work location (former OSHA 29 CFR 1926.954; 1910.269(n)(3))';

/** Phases at the work: the phases a worker's reach line touches. */
function workPhases(ctx: RuleContext): Set<string> {
  const { model } = ctx;
  const work = new Set<string>();
  for (const reach of model.linksOf('reach')) {
    const target = model.reachTarget(reach);
    if (target !== undefined && model.node(target)?.kind === 'phase') work.add(target);
  }
  return work;
}

/**
 * Phases grounded where they are: joined to a ground source (not a pole ground) by jumpers and
 * bonds without crossing a span, so grounds at one structure do not count for the next.
 */
function groundedHere(ctx: RuleContext): Set<string> {
  const { model } = ctx;
  const parent = new Map<string, string>();
  const find = (id: string): string => {
    let root = id;
    while (parent.has(root) && parent.get(root) !== root) root = parent.get(root) as string;
    parent.set(id, root);
    return root;
  };
  for (const link of ctx.plan.links) {
    if (!isBondingLink(link) || model.isEarthLink(link)) continue;
    const from = model.node(link.from);
    const to = model.node(link.to);
    if (!from || !to || !isConductive(from) || !isConductive(to) || isSpan(link, from, to)) continue;
    if (isPoleGround(from) || isPoleGround(to)) continue;
    parent.set(find(link.from), find(link.to));
  }
  const sourced = new Set(ctx.plan.nodes.filter((n) => n.kind !== 'earth' && !isPoleGround(n) && isGroundSource(n)).map((n) => find(n.id)));
  return new Set(model.nodesOf('phase').filter((p) => sourced.has(find(p.id))).map((p) => p.id));
}

/** Phase-to-phase spans: the line between structures, which a source's voltage travels along. */
function spanNeighbours(ctx: RuleContext): Map<string, string[]> {
  const { model } = ctx;
  const next = new Map<string, string[]>();
  for (const link of model.linksOf('bond')) {
    const from = model.node(link.from);
    const to = model.node(link.to);
    if (from?.kind !== 'phase' || to?.kind !== 'phase' || !isSpan(link, from, to)) continue;
    next.set(from.id, [...(next.get(from.id) ?? []), to.id]);
    next.set(to.id, [...(next.get(to.id) ?? []), from.id]);
  }
  return next;
}

/**
 * For each supply end (a `supply-end` node naming the phases a source can feed the work through),
 * follows those phases along spans towards the phases a worker reaches; a phase counts as grounds
 * on the way when it is jumpered to a ground source at its own structure (no span between):
 * - `supply-side-ungrounded`, blocker: a phase at the work is reached with no solidly grounded
 *   phase on the way nor at the work; elements: the supply end, then those phases;
 * - `supply-side-single-point`, note: from this side the only grounds are at the work location
 *   itself (single-point grounding at the work, not bracket grounding on both sides): the workers
 *   must stay inside that zone; elements: the supply end, then the grounded work phases.
 * Basis: grounds between the work location and every source (bracket grounding), or at the work
 * location (former OSHA 29 CFR 1926.954; OSHA 29 CFR 1910.269(n)(3)).
 */
export function checkSupplySide(ctx: RuleContext): Finding[] {
  const { model, zones } = ctx;
  const supplies = model.nodesOf('supply-end');
  if (supplies.length === 0) return [];
  const work = workPhases(ctx);
  const spans = spanNeighbours(ctx);
  const here = groundedHere(ctx);
  return supplies.flatMap((supply): Finding[] => {
    const unguarded: string[] = [];
    const atWork: string[] = [];
    const seen = new Set<string>(supply.phases);
    const queue = [...supply.phases];
    for (let head = 0; head < queue.length; head++) {
      const phase = queue[head];
      const grounded = here.has(phase) && zones.isSolidlyGrounded(phase);
      if (work.has(phase)) (grounded ? atWork : unguarded).push(phase);
      if (work.has(phase) || grounded) continue;
      for (const next of spans.get(phase) ?? []) if (!seen.has(next) && (seen.add(next), true)) queue.push(next);
    }
    const name = capitalise(model.nameOf(supply.id));
    if (unguarded.length > 0) {
      return [{
        rule: SUPPLY_SIDE_UNGROUNDED,
        severity: 'blocker',
        elements: [supply.id, ...unguarded],
        message:
          `${name} can energize ${listOf(unguarded.map(model.nameOf))} at the work with no grounds between it and the workers; ` +
          'install grounds on this side of the work, or at the work location with the workers inside that zone.',
        basis: BASIS,
      }];
    }
    if (atWork.length === 0) return [];
    return [{
      rule: SUPPLY_SIDE_SINGLE_POINT,
      severity: 'note',
      elements: [supply.id, ...atWork],
      message:
        `From ${model.nameOf(supply.id)} the only grounds are at the work location (single-point grounding at the work): keep every worker inside that zone; ` +
        'grounds on both sides of the work (bracket grounding) also limit what a worker outside the zone can touch.',
      basis: BASIS,
    }];
  });
}

/** The blocker half of checkSupplySide, registered under its own id. */
export const checkSupplySideUngrounded = (ctx: RuleContext): Finding[] => checkSupplySide(ctx).filter((f) => f.rule === SUPPLY_SIDE_UNGROUNDED);
/** The note half of checkSupplySide, registered under its own id. */
export const checkSupplySideSinglePoint = (ctx: RuleContext): Finding[] => checkSupplySide(ctx).filter((f) => f.rule === SUPPLY_SIDE_SINGLE_POINT);

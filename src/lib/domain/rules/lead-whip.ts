import { capitalise } from '@/lib/domain/plan-model';
import { forcePerLength, listOf, metres } from './format';
import type { Finding, RuleContext } from './types';

export const LEAD_WHIP = 'lead-whip';

/**
 * Peak force per metre between phase leads above which a lead with slack is expected to whip
 * violently, N/m: 100 N/m (10 kgf per metre of lead at the first peak). Our own threshold, common
 * practice that long sagging leads whip under fault current; no published figure is known to us.
 */
export const WHIP_FORCE_N_PER_M = 100;
/** Length over the straight distance between clamps that counts as slack for whip, m (common practice: any visible sag). */
export const WHIP_SLACK_M = 0.3;

/**
 * Under fault current the leads jump violently: long leads sagging between phases and separate
 * long leads from each phase to one point whip farthest; phase-to-phase jumpering with one short
 * lead down moves least (common practice). With the plan's phase spacing and the first-peak force
 * (fault.peakForceNPerM, 2×10⁻⁷·i_p²/d) at or above WHIP_FORCE_N_PER_M:
 * - a warning for each phase lead (a jumper with a phase end) whose length exceeds its span by
 *   more than WHIP_SLACK_M; elements: the jumper;
 * - a note for each point that two or more phases reach by separate leads, recommending
 *   phase-to-phase jumpering with shortened leads; elements: the common point, then its leads.
 */
export function checkLeadWhip(ctx: RuleContext): Finding[] {
  const force = ctx.fault.peakForceNPerM;
  if (force === null || !Number.isFinite(force) || force < WHIP_FORCE_N_PER_M) return [];
  const { model } = ctx;
  const basis = `common practice: slack leads whip under fault current; the force between phase leads is 2×10⁻⁷·I²/d (N/m, with I the first-peak current in A and d the phase spacing in m); threshold ${WHIP_FORCE_N_PER_M} N/m is Bondmap's own`;
  const findings: Finding[] = [];
  const leadsTo = new Map<string, string[]>();
  for (const jumper of model.linksOf('jumper')) {
    const ends = [model.node(jumper.from), model.node(jumper.to)];
    const phaseEnd = ends.find((n) => n?.kind === 'phase');
    if (!phaseEnd) continue;
    const other = ends.find((n) => n !== phaseEnd);
    if (other && other.kind !== 'phase') leadsTo.set(other.id, [...(leadsTo.get(other.id) ?? []), jumper.id]);
    if (jumper.spanM === undefined || jumper.lengthM - jumper.spanM <= WHIP_SLACK_M) continue;
    findings.push({
      rule: LEAD_WHIP,
      severity: 'warning',
      elements: [jumper.id],
      message:
        `${capitalise(model.nameOf(jumper.id))} has ${metres(jumper.lengthM - jumper.spanM, ctx.units)} of slack and the phase leads pull at ${forcePerLength(force, ctx.units)} at the first fault peak, so it will whip; ` +
        'shorten it and tie it off, or jumper phase to phase with one short lead down.',
      basis,
    });
  }
  for (const [point, leads] of leadsTo) {
    if (leads.length < 2) continue;
    findings.push({
      rule: LEAD_WHIP,
      severity: 'note',
      elements: [point, ...leads],
      message:
        `${capitalise(listOf(leads.map(model.nameOf)))} run separately from each phase to ${model.nameOf(point)}; at ${forcePerLength(force, ctx.units)} separate leads whip farthest, ` +
        'so consider jumpering phase to phase with shortened leads and one lead down.',
      basis,
    });
  }
  return findings;
}

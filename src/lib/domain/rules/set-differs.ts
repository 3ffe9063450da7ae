import type { LinkOf } from '@/lib/schemas/plan';
import { cableName, formatKiloamps, listOf, metres } from './format';
import type { Finding, RuleContext } from './types';
import type { UnitSystem } from '@/lib/domain/units';

export const SET_DIFFERS = 'set-differs';

type Jumper = LinkOf<'jumper'>;
const LENGTH_TOLERANCE_M = 0.05;

/** What the plan says that the set's record does not: only fields the plan gives are compared. */
function differences(drawn: Jumper, used: Jumper, units: UnitSystem): string[] {
  const out: string[] = [];
  if (drawn.cable !== used.cable) out.push(`cable ${cableName(drawn.cable)} (set: ${cableName(used.cable)})`);
  if (Math.abs(drawn.lengthM - used.lengthM) > LENGTH_TOLERANCE_M) out.push(`length ${metres(drawn.lengthM, units)} (set: ${metres(used.lengthM, units)})`);
  if (drawn.clampKa !== undefined && drawn.clampKa !== used.clampKa) out.push(`clamp rating ${formatKiloamps(drawn.clampKa)} (set: ${formatKiloamps(used.clampKa ?? NaN)})`);
  if (drawn.clampCycles !== undefined && drawn.clampCycles !== used.clampCycles) out.push(`clamp rating time ${drawn.clampCycles} cycles (set: ${used.clampCycles} cycles)`);
  if (drawn.clampKind !== undefined && drawn.clampKind !== used.clampKind) out.push(`clamp kind ${drawn.clampKind} (set: ${used.clampKind})`);
  if (drawn.connection !== undefined && drawn.connection !== used.connection) out.push(`connection ${drawn.connection} (set: ${used.connection})`);
  return out;
}

/**
 * Warning when a jumper's drawn figures differ from its set's record; the check has used the set's
 * own figures for the ratings. Elements: the jumper.
 */
export function checkSetDiffers(ctx: RuleContext): Finding[] {
  const sets = ctx.sets;
  if (!sets) return [];
  const drawn = new Map(sets.original.links.flatMap((l) => (l.kind === 'jumper' ? [[l.id, l] as const] : [])));
  return sets.uses.flatMap((use) => {
    if (!use.set) return [];
    return use.jumpers.flatMap((id) => {
      const before = drawn.get(id);
      const after = ctx.plan.links.find((l): l is Jumper => l.id === id && l.kind === 'jumper');
      const diff = before && after ? differences(before, after, ctx.units) : [];
      if (diff.length === 0) return [];
      return [
        {
          rule: SET_DIFFERS,
          severity: 'warning' as const,
          elements: [id],
          message: `${ctx.model.nameOf(id)} is drawn with ${listOf(diff)}; the check used set ${use.tag}'s own figures. Correct the drawing or pick the set you mean.`,
          basis: "The set's record is what was built and tested, so its figures are the ones rated (OSHA 29 CFR 1910.269(n)(4)(i))",
        },
      ];
    });
  });
}

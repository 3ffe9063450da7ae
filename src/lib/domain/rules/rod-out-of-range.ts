import { ROD_MIN_LENGTH_TO_RADIUS, rodInRange } from '@/lib/domain/calc/rods';
import { capitalise } from '@/lib/domain/plan-model';
import { diameter, shortLength } from './format';
import type { Finding, RuleContext } from './types';

export const ROD_OUT_OF_RANGE = 'rod-out-of-range';

/**
 * Blocker for a ground rod outside the range of Dwight's formula (driven length at least 20
 * radii, calc/rods.ts ROD_MIN_LENGTH_TO_RADIUS): its resistance cannot be computed, so the rod is
 * refused — not a ground source and left out of the solve (IEEE Std 142, Dwight: L ≫ a; the
 * limit is our own). Elements: the rod.
 */
export function checkRodOutOfRange(ctx: RuleContext): Finding[] {
  return ctx.model.nodesOf('ground-rod').flatMap((rod) => {
    if (rodInRange(rod.lengthM, rod.diameterMm)) return [];
    const minimumM = (ROD_MIN_LENGTH_TO_RADIUS * rod.diameterMm) / 2000;
    return [
      {
        rule: ROD_OUT_OF_RANGE,
        severity: 'blocker' as const,
        elements: [rod.id],
        message:
          `${capitalise(ctx.model.nameOf(rod.id))} is ${shortLength(rod.lengthM, ctx.units)} long and ${diameter(rod.diameterMm, ctx.units)} across; the rod formula needs a driven length of at least ${ROD_MIN_LENGTH_TO_RADIUS} radii (${shortLength(minimumM, ctx.units)} here), ` +
          'so it was not counted as a ground; check the length and diameter.',
        basis: `Dwight's rod formula (IEEE Std 142) holds for a long thin rod; Bondmap refuses L < ${ROD_MIN_LENGTH_TO_RADIUS}·a`,
      },
    ];
  });
}

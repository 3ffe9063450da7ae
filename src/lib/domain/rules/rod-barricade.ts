import { metres, volts } from './format';
import type { Finding, RuleContext } from './types';

export const ROD_BARRICADE = 'rod-barricade';

/**
 * Note for every driven rod, with the radius inside which the step voltage of a fault could exceed
 * the tolerable step voltage (IEEE Std 80 step criterion; common practice: barricade temporary
 * rods); a warning when the plan puts a work position inside that radius. Elements: the rod.
 */
export function checkRodBarricade(ctx: RuleContext): Finding[] {
  return ctx.network.rods.flatMap((rod): Finding[] => {
    const node = ctx.model.node(rod.node);
    if (!node || node.kind !== 'ground-rod' || !Number.isFinite(rod.barricadeRadiusM)) return [];
    const radius = metres(rod.barricadeRadiusM, ctx.units);
    const step = Number.isFinite(rod.tolerableStepVolts) ? ` (tolerable step ${volts(rod.tolerableStepVolts)})` : '';
    const basis = `${rod.barricadeMethod || 'IEEE Std 80 step criterion'}; common practice: barricade temporary rods`;
    const inside = node.workDistanceM !== undefined && node.workDistanceM < rod.barricadeRadiusM;
    if (inside) {
      return [
        {
          rule: ROD_BARRICADE,
          severity: 'warning' as const,
          elements: [node.id],
          message:
            `The work position is ${metres(node.workDistanceM as number, ctx.units)} from ${ctx.model.nameOf(node.id)}, inside its ${radius} barricade radius${step}; ` +
            'drive the rod farther from where people stand, or stand on a mat bonded to it.',
          basis,
        },
      ];
    }
    return [
      {
        rule: ROD_BARRICADE,
        severity: 'note' as const,
        elements: [node.id],
        message: `Barricade ${ctx.model.nameOf(node.id)} out to ${radius}${step} and keep people outside that circle while the grounds are on.`,
        basis,
      },
    ];
  });
}

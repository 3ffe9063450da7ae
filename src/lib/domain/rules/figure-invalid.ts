import type { Finding, RuleContext } from './types';

export const FIGURE_INVALID = 'figure-invalid';

type Row = Record<string, unknown>;

/** Names of the numeric fields of `row` that hold NaN or an infinity (null means "not given" and is fine). */
function badFields(row: object, fields: readonly string[]): string[] {
  return fields.filter((field) => {
    const value = (row as Row)[field];
    return typeof value === 'number' && !Number.isFinite(value);
  });
}

const FAULT_FIELDS = ['symmetricalKa', 'durationS', 'decrementFactor', 'asymmetricalKa', 'peakFactor', 'peakKa', 'peakForceNPerM'] as const;
const CONTACT_FIELDS = ['touchVolts', 'bodyAmps', 'limitAmps'] as const;
const JUMPER_FIELDS = ['ohms', 'resistanceOhms', 'reactanceOhms', 'dutyKa', 'cableRatingKa', 'fusingKa', 'clampRatingKa', 'currentKa'] as const;
const ROD_FIELDS = ['ohms', 'currentKa', 'potentialRiseVolts', 'barricadeRadiusM', 'tolerableStepVolts'] as const;

/**
 * Blocker for every figure the calculation returned as NaN or infinite: the report shows it as
 * null, and a figure that cannot be computed cannot show the plan safe (our own rule: the JSON
 * report never carries an impossible number). Elements: the element the figure belongs to.
 */
export function checkFigureInvalid(ctx: RuleContext): Finding[] {
  const findings: Finding[] = [];
  const add = (elements: string[], what: string, fields: string[]) => {
    if (fields.length === 0) return;
    findings.push({
      rule: FIGURE_INVALID,
      severity: 'blocker',
      elements,
      message: `The ${fields.join(', ')} of ${what} could not be computed from the values entered; check them before relying on this plan.`,
      basis: 'Bondmap checker: a figure that cannot be computed cannot show the plan safe',
    });
  };
  const faultBad = badFields(ctx.fault, FAULT_FIELDS);
  if (!Number.isFinite(ctx.tolerableBodyAmps)) faultBad.push('tolerable body current');
  add([], 'the fault', faultBad);
  for (const contact of ctx.network.contacts) {
    if (contact.status !== 'solved') continue;
    add([contact.worker, contact.surface], `the contact of ${ctx.model.nameOf(contact.worker)} with ${ctx.model.nameOf(contact.surface)}`, badFields(contact, CONTACT_FIELDS));
  }
  for (const jumper of ctx.network.jumpers) add([jumper.link], ctx.model.nameOf(jumper.link), badFields(jumper, JUMPER_FIELDS));
  for (const rod of ctx.network.rods) add([rod.node], ctx.model.nameOf(rod.node), badFields(rod, ROD_FIELDS));
  for (const assumption of ctx.network.assumptions) {
    add([assumption.element], `the assumed ${assumption.field} of ${ctx.model.nameOf(assumption.element)}`, badFields(assumption, ['value']));
  }
  return findings;
}

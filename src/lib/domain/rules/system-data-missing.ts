import type { PlanSystem } from '@/lib/schemas/plan';
import type { Finding, RuleContext } from './types';

export const SYSTEM_DATA_MISSING = 'system-data-missing';

/** The system data a check cannot do without, in the words a crew reads. */
const REQUIRED: readonly { key: 'faultKa' | 'clearingCycles' | 'xOverR'; name: string }[] = [
  { key: 'faultKa', name: 'the available fault current (kA)' },
  { key: 'clearingCycles', name: 'the clearing time (cycles)' },
  { key: 'xOverR', name: 'the X/R ratio' },
];

/** Names of the required system data the plan does not give yet. */
export function missingSystemData(system: PlanSystem): string[] {
  return REQUIRED.filter((r) => system[r.key] === undefined).map((r) => r.name);
}

/**
 * Blocker while the fault data for the work location is missing: every current, rating and body
 * figure depends on it, so a plan without it must never read as clear. Names what is missing.
 * No elements.
 */
export function checkSystemDataMissing(ctx: RuleContext): Finding[] {
  const missing = missingSystemData(ctx.plan.system);
  if (missing.length === 0) return [];
  const list = missing.length === 1 ? missing[0] : `${missing.slice(0, -1).join(', ')} and ${missing[missing.length - 1]}`;
  return [
    {
      rule: SYSTEM_DATA_MISSING,
      severity: 'blocker',
      elements: [],
      message: `The plan does not give ${list} at the work location, so no current, rating or touch figure could be worked out. Enter the fault data from your system operator under System data.`,
      basis: 'Currents, ratings and body-current limits all depend on the available fault current and its clearing time (IEEE Std 80)',
    },
  ];
}

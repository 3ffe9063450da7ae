/** Tiny plan builder for calculation tests: parses through the real schema so every plan is valid. */
import { parsePlan, type PlanDocument } from '@/lib/schemas/plan';

export function tinyPlan(nodes: Record<string, unknown>[], links: Record<string, unknown>[], system: Record<string, unknown> = {}, criteria: Record<string, unknown> = {}): PlanDocument {
  const parsed = parsePlan({
    format: 'bondmap-plan',
    version: 1,
    title: 'calc test',
    system: { frequencyHz: 60, faultKa: 10, clearingCycles: 15, xOverR: 10, ...system },
    criteria: { bodyKg: 50, bodyOhms: 1000, ...criteria },
    nodes,
    links,
  });
  if (!parsed.ok) throw new Error(`test plan invalid: ${JSON.stringify(parsed.issues)}`);
  return parsed.plan;
}

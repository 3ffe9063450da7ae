import { describe, expect, it } from 'vitest';
import { checkPlan } from '@/lib/domain/checker';
import { findStarter } from '@/lib/domain/starters';
import { parsePlan, type PlanDocument } from '@/lib/schemas/plan';

const starter = () => findStarter('tangent-bucket')!.build('System data');
const without = (plan: PlanDocument, ...keys: ('faultKa' | 'clearingCycles' | 'xOverR')[]): PlanDocument => {
  const system = { ...plan.system };
  for (const k of keys) delete system[k];
  return { ...plan, system };
};

describe('system data missing', () => {
  it('a plan without fault data parses, and its check blocks naming everything missing', () => {
    const plan = without(starter(), 'faultKa', 'clearingCycles', 'xOverR');
    const parsed = parsePlan(plan);
    expect(parsed.ok).toBe(true);
    const report = checkPlan(plan);
    expect(report.ok).toBe(false);
    const finding = report.findings.find((f) => f.rule === 'system-data-missing');
    expect(finding?.severity).toBe('blocker');
    expect(finding?.message).toContain('the available fault current (kA), the clearing time (cycles) and the X/R ratio');
    // One blocker says the figures are unknown; no second one calls them wrong, and nothing crashes.
    expect(report.findings.some((f) => f.rule === 'figure-invalid' && f.elements.length === 0)).toBe(false);
    expect(report.findings.some((f) => f.rule === 'calc-failed')).toBe(false);
  });

  it('names only what is missing, and goes away once the data is given', () => {
    const report = checkPlan(without(starter(), 'xOverR'));
    const finding = report.findings.find((f) => f.rule === 'system-data-missing');
    expect(finding?.message).toContain('does not give the X/R ratio at');
    expect(finding?.message).not.toContain('fault current');
    const full = checkPlan(starter());
    expect(full.findings.some((f) => f.rule === 'system-data-missing')).toBe(false);
    expect(full.ok).toBe(true);
  });
});

import { describe, expect, it } from 'vitest';
import { parsePlan } from '@/lib/schemas/plan';

const base = {
  format: 'bondmap-plan',
  version: 1,
  title: 'Tangent pole 14, three-phase, bucket work',
  system: { nominalKv: 12.47, frequencyHz: 60, faultKa: 10, clearingCycles: 15, xOverR: 10, phaseSpacingM: 0.9 },
  criteria: { bodyKg: 50, bodyOhms: 1000 },
  nodes: [],
  links: [],
};

describe('plan schema', () => {
  it('accepts the document example of docs/plan-format.md', () => {
    expect(parsePlan(base)).toMatchObject({ ok: true });
  });

  it('lists field and reference problems together, by path', () => {
    const result = parsePlan({
      ...base,
      system: { ...base.system, faultKa: -1 },
      nodes: [{ id: 'W1', kind: 'worker', standsOn: 'B9' }],
    });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues).toEqual([
      { path: 'system.faultKa', message: 'must be greater than 0' },
      { path: 'nodes[0].standsOn', message: 'no node with id "B9"' },
    ]);
  });
});

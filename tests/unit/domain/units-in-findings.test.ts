import { describe, expect, it } from 'vitest';
import { checkPlan } from '@/lib/domain/checker';
import { findStarter } from '@/lib/domain/starters';
import type { PlanDocument } from '@/lib/schemas/plan';

// A rod driven 1 m from where a person works, jumpered to the cluster bar.
const plan = (): PlanDocument => {
  const base = findStarter('tangent-bucket')!.build('Units');
  return {
    ...base,
    nodes: [...base.nodes, { id: 'R1', kind: 'ground-rod', lengthM: 2.4384, diameterMm: 15.875, soilOhmM: 100, workDistanceM: 1 }],
    links: [...base.links, { id: 'jR', kind: 'jumper', from: 'CB', to: 'R1', cable: '2/0', lengthM: 3 }],
  };
};
const rodSentences = (units?: 'metric' | 'imperial') =>
  checkPlan(plan(), undefined, units ? { units } : {}).findings.filter((f) => f.rule === 'rod-barricade').map((f) => f.message).join(' ');

describe('lengths in the findings follow the unit choice', () => {
  it('metric by default', () => {
    const text = rodSentences();
    expect(text).toMatch(/\d m\b/);
    expect(text).not.toMatch(/\bft\b/);
  });
  it('feet and inches for a crew working in feet, with no metres left', () => {
    const text = rodSentences('imperial');
    expect(text).toMatch(/\d+ ft \d+ in/);
    expect(text).not.toMatch(/\d m\b/);
  });
});

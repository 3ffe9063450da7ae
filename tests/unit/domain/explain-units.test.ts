import { describe, expect, it } from 'vitest';
import { checkPlan } from '@/lib/domain/checker';
import { explainPlan } from '@/lib/domain/explain';
import { bucketLinks, bucketNodes, makePlan } from '../../helpers/plan-factory';

// A bucket plan with a driven rod bonded to the cluster bar, so the check gives a barricade radius.
const doc = makePlan({
  nodes: [...bucketNodes(), { id: 'R9', kind: 'ground-rod', lengthM: 2.4384, diameterMm: 15.875, soilOhmM: 100 }],
  links: [...bucketLinks(), { id: 'jR9', kind: 'jumper', from: 'CB', to: 'R9', cable: '2/0', lengthM: 3, spanM: 2.5 }],
} as never);

describe('explain in the reader\'s units', () => {
  const report = checkPlan(doc);
  it('gives the barricade radius in feet and inches in feet mode and in metres otherwise', () => {
    const rod = (units: 'metric' | 'imperial') => explainPlan(doc, report, units).find((e) => e.id === 'R9')!.lines.join(' ');
    expect(report.rods.find((r) => r.node === 'R9')?.barricadeRadiusM).toBeGreaterThan(0);
    expect(rod('imperial')).toMatch(/barricade \d+ ft \d+ in around it/);
    expect(rod('metric')).toMatch(/barricade \d+(\.\d)? m around it/);
  });
  it('gives body current in milliamperes, as the editor does', () => {
    const lines = explainPlan(doc, report, 'imperial').flatMap((e) => e.lines).filter((l) => l.includes('through it'));
    expect(lines.length).toBeGreaterThan(0);
    for (const l of lines) expect(l).toMatch(/\d+ mA through it, against a limit of \d+ mA/);
  });
});

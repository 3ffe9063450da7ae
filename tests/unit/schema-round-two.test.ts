/**
 * The plan schema's additions for the checker's second round: every new field optional, every
 * reference checked by path, and bad values refused with the field named.
 */
import { describe, expect, it } from 'vitest';
import { parsePlan } from '@/lib/schemas/plan';
import { bucketLinks, bucketNodes, link, node, rawPlan } from '../helpers/plan-factory';

const issuesOf = (doc: Record<string, unknown>) => {
  const result = parsePlan(doc);
  return result.ok ? [] : result.issues.map((i) => `${i.path}: ${i.message}`);
};
const NODES = bucketNodes().length;

describe('plan schema, round two', () => {
  it('accepts every new optional field', () => {
    const doc = rawPlan({
      nodes: [
        ...bucketNodes(),
        node.truck('T1'),
        { id: 'BK2', kind: 'bucket', insulatedBoom: false, onTruck: 'T1' },
        node.hardware('GW', { groundOhms: 20 }),
        node.rod('R1', { count: 3, spacingM: 2.4, arrangement: 'ring' }),
        { id: 'S1', kind: 'supply-end', label: 'Substation side', phases: ['A', 'B'] },
      ],
      links: [...bucketLinks({ clampKind: 'grounding', connection: 'ferrule' }), link.bond('sp', 'A', 'B', { span: true, ohms: 0.02 })],
    });
    expect(issuesOf(doc)).toEqual([]);
  });

  it('names the field of a bad value', () => {
    const doc = rawPlan({
      nodes: [...bucketNodes(), node.rod('R1', { arrangement: 'star' }), { id: 'S1', kind: 'supply-end', phases: [] }],
      links: [...bucketLinks({ clampKind: 'hot', connection: 'twisted' }).slice(0, 1), link.bond('b', 'A', 'CB', { span: 'yes' })],
    });
    expect(issuesOf(doc)).toEqual(
      expect.arrayContaining([
        `nodes[${NODES}].arrangement: must be one of line, ring, grid`,
        `nodes[${NODES + 1}].phases: must name at least one phase`,
        'links[0].clampKind: must be one of grounding, live-line',
        'links[0].connection: must be one of ferrule, bare-strands',
        'links[1].span: must be true or false',
      ]),
    );
  });

  it('checks the new references: a bucket’s truck, a supply end’s phases, no links to a supply end', () => {
    const doc = rawPlan({
      nodes: [...bucketNodes(), { id: 'BK2', kind: 'bucket', onTruck: 'CB' }, { id: 'S1', kind: 'supply-end', phases: ['A', 'N', 'Q'] }],
      links: [link.jumper('jS', 'S1', 'CB')],
    });
    expect(issuesOf(doc)).toEqual([
      `nodes[${NODES}].onTruck: no truck with id "CB"`,
      `nodes[${NODES + 1}].phases[1]: no phase with id "N"`,
      `nodes[${NODES + 1}].phases[2]: no phase with id "Q"`,
      'links[0].from: a supply end is a marker: it names its phases and takes no links',
    ]);
  });

  it('still loads a version-1 plan written before these fields existed (concrete footing, bond spans, earth links)', () => {
    const doc = rawPlan({
      nodes: [...bucketNodes(), node.structure('S1', 'concrete', { groundOhms: 50 }), node.earth('E')],
      links: [...bucketLinks(), link.bond('b1', 'S1', 'E'), link.bond('line', 'A', 'B', { ohms: 0.02 })],
    });
    expect(issuesOf(doc)).toEqual([]);
  });
});

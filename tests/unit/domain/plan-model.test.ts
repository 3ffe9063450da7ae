import { describe, expect, it } from 'vitest';
import { buildPlanModel, compareIds, isConductive, isGroundSource, isNonBonding, isPoleGround } from '@/lib/domain/plan-model';
import { makePlan, node } from '../../helpers/plan-factory';

const kinds = makePlan({
  nodes: [
    node.phase('A'),
    node.neutral('N'),
    node.shield('SW'),
    node.structure('Pw', 'wood'),
    node.structure('Pf', 'fiberglass'),
    node.structure('Ps', 'steel'),
    node.structure('Pc', 'concrete'),
    node.crossarm('Xw', 'wood'),
    node.crossarm('Xs', 'steel'),
    node.hardware('H'),
    node.cluster('CB'),
    node.rod('R1'),
    node.earth('E'),
    node.bucket('BK'),
    node.truck('T1', { groundOhms: 20 }),
    node.mat('M1'),
    node.poleGround('PG'),
    node.worker('W1', 'CB'),
  ],
}).nodes;

// Expected character of each kind, from docs/plan-format.md ("Wood and fiberglass are not bonding
// paths", pole ground "conducts but is never relied on") and the brief's list of ground sources.
describe.each([
  ['A', true, false, false],
  ['N', true, true, false],
  ['SW', true, true, false],
  ['Pw', false, false, false],
  ['Pf', false, false, false],
  ['Ps', true, true, false],
  ['Pc', false, false, false],
  ['Xw', false, false, false],
  ['Xs', true, false, false],
  ['H', true, false, false],
  ['CB', true, false, false],
  ['R1', true, true, false],
  ['E', true, true, false],
  ['BK', true, false, false],
  ['T1', true, false, false],
  ['M1', true, false, false],
  ['PG', true, false, true],
  ['W1', false, false, false],
])('node %s', (id, conductive, source, poleGround) => {
  const n = kinds.find((k) => k.id === id);
  it(`conducts: ${conductive}, ground source: ${source}, pole ground: ${poleGround}`, () => {
    expect(n).toBeDefined();
    if (!n) return;
    expect(isConductive(n)).toBe(conductive);
    expect(isGroundSource(n)).toBe(source);
    expect(isPoleGround(n)).toBe(poleGround);
    expect(isNonBonding(n)).toBe(['Pw', 'Pf', 'Pc', 'Xw'].includes(id));
  });
});

describe('plan model lookups', () => {
  const plan = makePlan({
    nodes: [node.cluster('CB', { label: 'Cluster bar' }), node.phase('A'), node.worker('W1', 'CB')],
    links: [{ id: 'j1', kind: 'jumper', from: 'A', to: 'CB', cable: '2/0', lengthM: 2 }, { id: 'r1', kind: 'reach', from: 'W1', to: 'A' }],
  });
  const model = buildPlanModel(plan);

  it('names labelled elements by label and id, unlabelled ones by kind and id', () => {
    expect(model.nameOf('CB')).toBe('Cluster bar (CB)');
    expect(model.nameOf('j1')).toBe('jumper j1');
    expect(model.nameOf('W1')).toBe('worker W1');
    expect(model.nameOf('nothing')).toBe('nothing');
  });

  it('finds nodes, links and reaches by id and kind', () => {
    expect(model.node('A')?.kind).toBe('phase');
    expect(model.link('j1')?.kind).toBe('jumper');
    expect(model.nodesOf('worker').map((w) => w.id)).toEqual(['W1']);
    expect(model.linksOf('jumper').map((l) => l.id)).toEqual(['j1']);
    expect(model.reachesOf('W1').map((l) => l.id)).toEqual(['r1']);
    expect(model.reachesOf('CB')).toEqual([]);
  });

  it('orders ids by code unit, independent of locale', () => {
    expect(['b', 'B', 'a', 'A10', 'A2'].sort(compareIds)).toEqual(['A10', 'A2', 'B', 'a', 'b']);
  });
});

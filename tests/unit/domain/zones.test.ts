import { describe, expect, it } from 'vitest';
import { findZones } from '@/lib/domain/zones';
import { bucketPlan, link, makePlan, node } from '../../helpers/plan-factory';

const summary = (plan: Parameters<typeof findZones>[0]) =>
  findZones(plan).map((z) => ({ nodes: z.nodes, grounded: z.grounded, viaPoleGround: z.groundedOnlyViaPoleGround }));

describe('findZones', () => {
  it('joins everything jumpered to the cluster bar into one grounded zone', () => {
    expect(summary(bucketPlan())).toEqual([{ nodes: ['A', 'B', 'BK', 'C', 'CB', 'N'], grounded: true, viaPoleGround: false }]);
  });

  it('does not join through a wood pole: a clamp on wood makes no connection', () => {
    const plan = makePlan({
      nodes: [node.structure('P1', 'wood'), node.phase('A'), node.neutral('N')],
      links: [link.jumper('j1', 'A', 'P1'), link.jumper('j2', 'P1', 'N')],
    });
    expect(summary(plan)).toEqual([
      { nodes: ['A'], grounded: false, viaPoleGround: false },
      { nodes: ['N'], grounded: true, viaPoleGround: false },
    ]);
  });

  it('leaves workers and fiberglass out of every zone', () => {
    const plan = makePlan({
      nodes: [node.crossarm('X1', 'fiberglass'), node.cluster('CB'), node.worker('W1', 'CB')],
      links: [link.bond('b1', 'X1', 'CB')],
    });
    expect(findZones(plan).flatMap((z) => z.nodes)).toEqual(['CB']);
  });

  it('counts a steel structure as grounded through its footing, a truck not by itself', () => {
    const plan = makePlan({ nodes: [node.structure('S1', 'steel'), node.truck('T1', { groundOhms: 10 })] });
    expect(summary(plan)).toEqual([
      { nodes: ['S1'], grounded: true, viaPoleGround: false },
      { nodes: ['T1'], grounded: false, viaPoleGround: false },
    ]);
  });

  it('treats a zone whose only ground is a pole ground as not grounded', () => {
    const plan = makePlan({
      nodes: [node.phase('A'), node.cluster('CB'), node.poleGround('PG')],
      links: [link.jumper('j1', 'A', 'CB'), link.jumper('j2', 'CB', 'PG')],
    });
    const [zone] = findZones(plan);
    expect(zone).toMatchObject({ nodes: ['A', 'CB', 'PG'], grounded: false, groundedOnlyViaPoleGround: true, poleGroundDependent: ['A'], poleGrounds: ['PG'] });
  });

  it('treats a phase that reaches the neutral only through the pole ground as relying on it', () => {
    const plan = makePlan({
      nodes: [node.phase('A'), node.cluster('CB'), node.poleGround('PG'), node.neutral('N')],
      links: [link.jumper('j1', 'A', 'CB'), link.jumper('j2', 'CB', 'PG'), link.bond('b1', 'PG', 'N')],
    });
    expect(findZones(plan)[0]).toMatchObject({ grounded: false, groundedOnlyViaPoleGround: true, poleGroundDependent: ['A'] });
  });

  it('does not mind a pole ground hanging off a zone that is grounded directly', () => {
    const plan = makePlan({
      nodes: [node.phase('A'), node.cluster('CB'), node.poleGround('PG'), node.neutral('N'), node.hardware('G1')],
      links: [link.jumper('j1', 'A', 'CB'), link.jumper('j2', 'CB', 'N'), link.bond('b1', 'PG', 'N'), link.bond('b2', 'G1', 'PG')],
    });
    expect(findZones(plan)[0]).toMatchObject({ grounded: true, groundedOnlyViaPoleGround: false, poleGroundDependent: [] });
  });

  it('makes every earth node the same remote earth, and joins nothing through a link to it', () => {
    const plan = makePlan({
      nodes: [node.earth('E1'), node.earth('E2'), node.mat('M1'), node.truck('T1')],
      links: [link.bond('b1', 'M1', 'E1'), link.bond('b2', 'T1', 'E2')],
    });
    expect(summary(plan)).toEqual([
      { nodes: ['E1', 'E2'], grounded: true, viaPoleGround: false },
      { nodes: ['M1'], grounded: false, viaPoleGround: false },
      { nodes: ['T1'], grounded: false, viaPoleGround: false },
    ]);
  });

  it('puts a truck in its bucket’s zone when the boom is not insulated', () => {
    const bucket = (insulatedBoom: boolean) => ({ id: 'BK', kind: 'bucket', insulatedBoom });
    const plan = (insulatedBoom: boolean) =>
      makePlan({ nodes: [node.cluster('CB'), bucket(insulatedBoom), node.truck('T1')] as never[], links: [link.jumper('j1', 'BK', 'CB')] });
    expect(findZones(plan(false)).map((z) => z.nodes)).toEqual([['BK', 'CB', 'T1']]);
    expect(findZones(plan(true)).map((z) => z.nodes)).toEqual([['BK', 'CB'], ['T1']]);
  });

  it('sorts nodes within a zone and zones by their first node, by code unit', () => {
    const plan = makePlan({
      nodes: [node.hardware('b'), node.hardware('Z'), node.hardware('a'), node.hardware('A')],
      links: [link.bond('l1', 'b', 'A'), link.bond('l2', 'Z', 'a')],
    });
    expect(findZones(plan).map((z) => z.nodes)).toEqual([
      ['A', 'b'],
      ['Z', 'a'],
    ]);
  });

  it('ignores reach links when joining zones', () => {
    const plan = makePlan({ nodes: [node.cluster('CB'), node.phase('A'), node.worker('W1', 'CB')], links: [link.reach('r1', 'W1', 'A')] });
    expect(findZones(plan).map((z) => z.nodes)).toEqual([['A'], ['CB']]);
  });
});

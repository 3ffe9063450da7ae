/**
 * Starter layouts: small, valid plan documents with canvas positions, so a crew lead starts from
 * a familiar arrangement instead of an empty sheet. Labels and numbers are invented examples;
 * every value must be checked against the job (fault data from the system operator).
 */
import type { PlanDocument, PlanLink, PlanNode } from '@/lib/schemas/plan';

export interface Starter {
  id: string;
  name: string;
  description: string;
  build: (title?: string) => PlanDocument;
}

const SYSTEM = { nominalKv: 12.47, frequencyHz: 60 as const, faultKa: 10, clearingCycles: 15, xOverR: 10, phaseSpacingM: 0.9 };

type N = PlanNode;
const at = (x: number, y: number) => ({ x, y });
const phase = (id: string, letter: string, x: number, y = 40, label = `Phase ${letter}`): N => ({ id, kind: 'phase', phase: letter, label, position: at(x, y) });
const jumper = (id: string, from: string, to: string, lengthM = 3, cable: '2/0' | '4/0' = '2/0'): PlanLink => ({ id, kind: 'jumper', from, to, cable, lengthM });
const reach = (id: string, from: string, to: string): PlanLink => ({ id, kind: 'reach', from, to });
const bond = (id: string, from: string, to: string): PlanLink => ({ id, kind: 'bond', from, to });

function doc(title: string, nodes: N[], links: PlanLink[], system: Partial<PlanDocument['system']> = {}): PlanDocument {
  return { format: 'bondmap-plan', version: 1, title, system: { ...SYSTEM, ...system }, criteria: { bodyKg: 50, bodyOhms: 1000 }, nodes, links };
}

const threePhase = (prefix = '', y = 40, x0 = 120): N[] => ['A', 'B', 'C'].map((l, i) => phase(`${l}${prefix}`, l, x0 + i * 160, y, prefix ? `Circuit ${prefix} phase ${l}` : undefined));

export const STARTERS: readonly Starter[] = [
  {
    id: 'tangent-bucket',
    name: 'Tangent pole, bucket work',
    description: 'Three phases jumpered to a cluster bar and the neutral; the bucket bonded to the bar.',
    build: (title = 'Tangent pole, bucket work') =>
      doc(title, [
        ...threePhase(),
        { id: 'N', kind: 'neutral', label: 'Neutral', groundOhms: 5, position: at(600, 160) },
        { id: 'CB', kind: 'cluster-bar', label: 'Cluster bar', position: at(280, 200) },
        { id: 'P1', kind: 'structure', material: 'wood', label: 'Pole', position: at(80, 320) },
        { id: 'BK', kind: 'bucket', label: 'Bucket', insulatedBoom: true, position: at(440, 320) },
        { id: 'W1', kind: 'worker', label: 'Lineworker', standsOn: 'BK', position: at(600, 320) },
      ], [
        jumper('jA', 'A', 'CB'), jumper('jB', 'B', 'CB'), jumper('jC', 'C', 'CB'), jumper('jN', 'CB', 'N'), jumper('jBK', 'BK', 'CB'),
        reach('rA', 'W1', 'A'), reach('rB', 'W1', 'B'), reach('rC', 'W1', 'C'),
      ]),
  },
  {
    id: 'climber-wood',
    name: 'Climber on a wood pole',
    description: 'Cluster bar at the climber\u2019s feet, phases and neutral jumpered to it.',
    build: (title = 'Wood pole, climber') =>
      doc(title, [
        ...threePhase(),
        { id: 'X1', kind: 'crossarm', material: 'wood', label: 'Crossarm', position: at(280, 140) },
        { id: 'N', kind: 'neutral', label: 'Neutral', groundOhms: 5, position: at(600, 220) },
        { id: 'CB', kind: 'cluster-bar', label: 'Cluster bar at feet', position: at(280, 260) },
        { id: 'P1', kind: 'structure', material: 'wood', label: 'Pole', position: at(80, 260) },
        { id: 'W1', kind: 'worker', label: 'Climber', standsOn: 'CB', position: at(280, 380) },
      ], [
        jumper('jA', 'A', 'CB'), jumper('jB', 'B', 'CB'), jumper('jC', 'C', 'CB'), jumper('jN', 'CB', 'N', 2),
        reach('rA', 'W1', 'A'), reach('rB', 'W1', 'B'), reach('rC', 'W1', 'C'),
      ]),
  },
  {
    id: 'steel-structure',
    name: 'Steel structure',
    description: 'Phases jumpered to a steel structure with a grounded footing; shield wire bonded.',
    build: (title = 'Steel structure, climber') =>
      doc(title, [
        { id: 'SW', kind: 'shield-wire', label: 'Shield wire', groundOhms: 10, position: at(280, -80) },
        ...threePhase(),
        { id: 'S1', kind: 'structure', material: 'steel', label: 'Steel structure', groundOhms: 8, position: at(280, 220) },
        { id: 'W1', kind: 'worker', label: 'Climber', standsOn: 'S1', position: at(520, 220) },
      ], [
        jumper('jA', 'A', 'S1', 4), jumper('jB', 'B', 'S1', 4), jumper('jC', 'C', 'S1', 4), bond('bSW', 'SW', 'S1'),
        reach('rA', 'W1', 'A'), reach('rB', 'W1', 'B'), reach('rC', 'W1', 'C'),
      ], { nominalKv: 69, faultKa: 15, clearingCycles: 10, xOverR: 12, phaseSpacingM: 2.4 }),
  },
  {
    id: 'double-circuit',
    name: 'Double circuit',
    description: 'Both circuits jumpered to one cluster bar and the neutral; bucket bonded.',
    build: (title = 'Double-circuit pole, bucket work') =>
      doc(title, [
        ...threePhase('1', 0),
        ...threePhase('2', 100),
        { id: 'N', kind: 'neutral', label: 'Neutral', groundOhms: 5, position: at(640, 220) },
        { id: 'CB', kind: 'cluster-bar', label: 'Cluster bar', position: at(280, 240) },
        { id: 'BK', kind: 'bucket', label: 'Bucket', insulatedBoom: true, position: at(440, 360) },
        { id: 'W1', kind: 'worker', label: 'Lineworker', standsOn: 'BK', position: at(640, 360) },
      ], [
        ...['A1', 'B1', 'C1', 'A2', 'B2', 'C2'].map((p) => jumper(`j${p}`, p, 'CB')),
        jumper('jN', 'CB', 'N'), jumper('jBK', 'BK', 'CB'),
        ...['A1', 'B1', 'C1'].map((p) => reach(`r${p}`, 'W1', p)),
      ]),
  },
  {
    id: 'underbuilt-truck',
    name: 'Underbuilt neutral, ground worker at the truck',
    description: 'Neutral below the phases; truck bonded to it; the ground worker on a mat bonded to the truck.',
    build: (title = 'Underbuilt neutral, truck and ground worker') =>
      doc(title, [
        ...threePhase(),
        { id: 'NU', kind: 'neutral', label: 'Underbuilt neutral', groundOhms: 3, position: at(280, 160) },
        { id: 'CB', kind: 'cluster-bar', label: 'Cluster bar', position: at(120, 260) },
        { id: 'BK', kind: 'bucket', label: 'Bucket', insulatedBoom: true, position: at(440, 260) },
        { id: 'W1', kind: 'worker', label: 'Lineworker', standsOn: 'BK', position: at(600, 260) },
        { id: 'T1', kind: 'truck', label: 'Truck', position: at(280, 400) },
        { id: 'M1', kind: 'mat', label: 'Mat', position: at(440, 480) },
        { id: 'W2', kind: 'worker', label: 'Ground worker', standsOn: 'M1', position: at(600, 480) },
      ], [
        jumper('jA', 'A', 'CB'), jumper('jB', 'B', 'CB'), jumper('jC', 'C', 'CB'), jumper('jN', 'CB', 'NU', 2), jumper('jBK', 'BK', 'CB'),
        jumper('jT', 'T1', 'NU', 6), jumper('jM', 'M1', 'T1', 2),
        reach('rA', 'W1', 'A'), reach('rB', 'W1', 'B'), reach('rC', 'W1', 'C'), reach('rT', 'W2', 'T1'),
      ]),
  },
];

export function findStarter(id: string): Starter | undefined {
  return STARTERS.find((s) => s.id === id);
}

/** An empty plan with the given system data. */
export function emptyPlan(title = 'Untitled plan', system: PlanDocument['system'] = SYSTEM): PlanDocument {
  return doc(title, [], [], system);
}

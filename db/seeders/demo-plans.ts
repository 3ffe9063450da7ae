/**
 * Invented demo plans for the demo organisation. Every name, place and number is made up;
 * no real utility, structure or product is described.
 */
import type { PlanDocument, PlanLink, PlanNode } from '@/lib/schemas/plan';
import type { PlanStatus } from '@/lib/domain/plan-status';
import { metresFromFeet } from '@/lib/domain/units';

// The demo co-operative works in feet: lengths are round feet, stored in metres as every plan is.
const system = { nominalKv: 12.47, frequencyHz: 60 as const, faultKa: 8, clearingCycles: 15, xOverR: 8, phaseSpacingM: metresFromFeet(3) };

/** A jumper of `lengthFt` feet of lead over a `spanFt` gap. */
const jumper = (id: string, from: string, to: string, cable: '2/0' | '4/0' | '2', lengthFt: number, spanFt: number): PlanLink => ({ id, kind: 'jumper', from, to, cable, lengthM: metresFromFeet(lengthFt), spanM: metresFromFeet(spanFt), clampKa: 30, clampCycles: 15 });
const reach = (id: string, from: string, to: string): PlanLink => ({ id, kind: 'reach', from, to });

function document(title: string, nodes: PlanNode[], links: PlanLink[]): PlanDocument {
  return { format: 'bondmap-plan', version: 1, title, system, criteria: { bodyKg: 50, bodyOhms: 1000 }, nodes, links };
}

const phases = (y: number): PlanNode[] => [
  { id: 'A', kind: 'phase', phase: 'A', label: 'Phase A', position: { x: 60, y } },
  { id: 'B', kind: 'phase', phase: 'B', label: 'Phase B', position: { x: 300, y } },
  { id: 'C', kind: 'phase', phase: 'C', label: 'Phase C', position: { x: 540, y } },
];

export interface DemoPlan {
  title: string;
  status: PlanStatus;
  author: 'lead' | 'admin';
  document: PlanDocument;
  /** For approved plans: the reviewer's teaching note. For returned ones: the reviewer's comment. */
  reviewNote?: string;
  /** Comments the reviewer pinned to elements before deciding. */
  pins?: { elementId: string; body: string }[];
}

export const DEMO_PLANS: DemoPlan[] = [
  {
    title: 'Pole 14 on Wren Hollow Road, bucket work',
    status: 'approved',
    author: 'lead',
    reviewNote: 'The bucket is bonded to the same cluster bar as the phases and the neutral, so the lineworker rises with everything in reach.',
    document: document(
      'Pole 14 on Wren Hollow Road, bucket work',
      [
        ...phases(40),
        { id: 'N', kind: 'neutral', label: 'Neutral', groundOhms: 5, position: { x: 300, y: 360 } },
        { id: 'P14', kind: 'structure', material: 'wood', label: 'Pole 14', position: { x: 60, y: 460 } },
        { id: 'CB', kind: 'cluster-bar', label: 'Cluster bar', position: { x: 300, y: 200 } },
        { id: 'BK', kind: 'bucket', insulatedBoom: true, label: 'Bucket', position: { x: 560, y: 240 } },
        { id: 'W1', kind: 'worker', standsOn: 'BK', label: 'Lineworker in bucket', position: { x: 760, y: 140 } },
      ],
      [
        jumper('jA', 'A', 'CB', '2/0', 8, 6.5),
        jumper('jB', 'B', 'CB', '2/0', 6, 5),
        jumper('jC', 'C', 'CB', '2/0', 8, 6.5),
        jumper('jN', 'CB', 'N', '2/0', 6, 5),
        jumper('jBK', 'BK', 'CB', '2/0', 10, 8),
        reach('rA', 'W1', 'A'),
        reach('rB', 'W1', 'B'),
        reach('rC', 'W1', 'C'),
      ],
    ),
  },
  {
    title: 'Pole 31 at Millrace Crossing, climber',
    status: 'submitted',
    author: 'lead',
    document: document(
      'Pole 31 at Millrace Crossing, climber',
      [
        ...phases(40),
        { id: 'N', kind: 'neutral', label: 'Neutral', groundOhms: 8, position: { x: 300, y: 360 } },
        { id: 'P31', kind: 'structure', material: 'wood', label: 'Pole 31', position: { x: 60, y: 460 } },
        { id: 'XA', kind: 'crossarm', material: 'wood', label: 'Crossarm', position: { x: 60, y: 200 } },
        { id: 'CB', kind: 'cluster-bar', label: 'Cluster bar at the climber\'s feet', position: { x: 300, y: 200 } },
        { id: 'W1', kind: 'worker', standsOn: 'CB', label: 'Climber', position: { x: 540, y: 260 } },
      ],
      [
        jumper('jA', 'A', 'CB', '2/0', 8, 6.5),
        jumper('jB', 'B', 'CB', '2/0', 5, 4),
        jumper('jC', 'C', 'CB', '2/0', 8, 6.5),
        jumper('jN', 'CB', 'N', '2/0', 4, 3.5),
        reach('rA', 'W1', 'A'),
        reach('rC', 'W1', 'C'),
      ],
    ),
  },
  {
    title: 'Riser pole 7 behind the Fernbrook depot, ground crew',
    status: 'returned',
    author: 'lead',
    reviewNote: 'Route the truck lead straight and shorter before this goes out.',
    pins: [{ elementId: 'jTR', body: 'This lead has 3 m of slack; coil-free and shorter, please.' }],
    document: document(
      'Riser pole 7 behind the Fernbrook depot, ground crew',
      [
        ...phases(40),
        { id: 'N', kind: 'neutral', label: 'Neutral', groundOhms: 5, position: { x: 300, y: 360 } },
        { id: 'P7', kind: 'structure', material: 'wood', label: 'Pole 7', position: { x: 60, y: 460 } },
        { id: 'CB', kind: 'cluster-bar', label: 'Cluster bar', position: { x: 300, y: 200 } },
        { id: 'TR', kind: 'truck', label: 'Line truck', position: { x: 560, y: 420 } },
        { id: 'M', kind: 'mat', label: 'Mat at the truck', position: { x: 780, y: 540 } },
        { id: 'W2', kind: 'worker', standsOn: 'M', label: 'Ground worker at the truck', position: { x: 800, y: 400 } },
      ],
      [
        jumper('jA', 'A', 'CB', '2/0', 8, 6.5),
        jumper('jB', 'B', 'CB', '2/0', 6, 5),
        jumper('jC', 'C', 'CB', '2/0', 8, 6.5),
        jumper('jN', 'CB', 'N', '2/0', 6, 5),
        jumper('jTR', 'TR', 'CB', '2/0', 40, 30),
        jumper('jM', 'M', 'TR', '2/0', 5, 4),
        reach('rTR', 'W2', 'TR'),
      ],
    ),
  },
  {
    title: 'Pole 22 on Thistle Lane, new draft',
    status: 'draft',
    author: 'lead',
    document: document(
      'Pole 22 on Thistle Lane, new draft',
      [
        ...phases(40),
        { id: 'N', kind: 'neutral', label: 'Neutral', position: { x: 300, y: 360 } },
        { id: 'P22', kind: 'structure', material: 'wood', label: 'Pole 22', position: { x: 60, y: 460 } },
        { id: 'CB', kind: 'cluster-bar', label: 'Cluster bar', position: { x: 300, y: 200 } },
        { id: 'W1', kind: 'worker', standsOn: 'P22', label: 'Climber', position: { x: 540, y: 260 } },
      ],
      [jumper('jA', 'A', 'CB', '2/0', 8, 6.5), jumper('jN', 'CB', 'N', '2/0', 6, 5), reach('rA', 'W1', 'A'), reach('rB', 'W1', 'B')],
    ),
  },
];

export const OTHER_ORG_PLAN: DemoPlan = {
  title: 'Tower 3 on the Quillback line',
  status: 'draft',
  author: 'lead',
  document: document(
    'Tower 3 on the Quillback line',
    [
      ...phases(40),
      { id: 'SW', kind: 'shield-wire', label: 'Shield wire', groundOhms: 10, position: { x: 300, y: -120 } },
      { id: 'T3', kind: 'structure', material: 'steel', label: 'Tower 3', groundOhms: 15, position: { x: 300, y: 260 } },
      { id: 'W1', kind: 'worker', standsOn: 'T3', label: 'Climber on the tower', position: { x: 560, y: 200 } },
    ],
    [
      jumper('jA', 'A', 'T3', '4/0', 10, 8),
      jumper('jB', 'B', 'T3', '4/0', 10, 8),
      jumper('jC', 'C', 'T3', '4/0', 10, 8),
      { id: 'bSW', kind: 'bond', from: 'SW', to: 'T3' },
      reach('rB', 'W1', 'B'),
    ],
  ),
};

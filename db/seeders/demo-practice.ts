/**
 * Invented practice for the demo co-operative: two more approved plans walked through the real
 * workflow, five exercises (a different gap each, all three kinds) and a few of the demo
 * apprentice's attempts. Everything is made up. Runs once: skipped when exercises exist.
 */
import { metresFromFeet } from '@/lib/domain/units';
import type { Db } from '@db/connection';
import { createPlan, describeStructure } from '@db/repositories/plans';
import { decidePlan, submitPlan } from '@db/repositories/review';
import { addAttempt, createExercise, findApprovedRevision } from '@db/repositories/practice';
import { checkPlan } from '@/lib/domain/checker';
import { fingerprint } from '@/lib/server/fingerprint';
import { gradeFind, gradeNumbers, prepareExercise, type ExerciseKind, type Modifications } from '@/lib/domain/practice';
import type { PlanDocument, PlanLink, PlanNode } from '@/lib/schemas/plan';

const system = { nominalKv: 12.47, frequencyHz: 60 as const, faultKa: 9, clearingCycles: 15, xOverR: 9, phaseSpacingM: metresFromFeet(3) };
/** A jumper of `lengthFt` feet over a `spanFt` gap (the demo co-operative works in feet). */
const jumper = (id: string, from: string, to: string, lengthFt: number, spanFt: number): PlanLink => ({ id, kind: 'jumper', from, to, cable: '2/0', lengthM: metresFromFeet(lengthFt), spanM: metresFromFeet(spanFt), clampKa: 30, clampCycles: 15 });
const reach = (id: string, from: string, to: string): PlanLink => ({ id, kind: 'reach', from, to });
const doc = (title: string, nodes: PlanNode[], links: PlanLink[]): PlanDocument => ({ format: 'bondmap-plan', version: 1, title, system, criteria: { bodyKg: 50, bodyOhms: 1000 }, nodes, links });
const phases: PlanNode[] = [
  { id: 'A', kind: 'phase', phase: 'A', label: 'Phase A', position: { x: 60, y: 40 } },
  { id: 'B', kind: 'phase', phase: 'B', label: 'Phase B', position: { x: 300, y: 40 } },
  { id: 'C', kind: 'phase', phase: 'C', label: 'Phase C', position: { x: 540, y: 40 } },
];
const phaseJumpers = [jumper('jA', 'A', 'CB', 8, 6.5), jumper('jB', 'B', 'CB', 6, 5), jumper('jC', 'C', 'CB', 8, 6.5)];

const GROUND_CREW: PlanDocument = doc('Riser pole 9 at Cobbler\'s Ford, ground crew on the mat', [
  ...phases,
  { id: 'N', kind: 'neutral', label: 'Neutral', groundOhms: 5, position: { x: 300, y: 360 } },
  { id: 'P9', kind: 'structure', material: 'wood', label: 'Pole 9', position: { x: 60, y: 460 } },
  { id: 'CB', kind: 'cluster-bar', label: 'Cluster bar', position: { x: 300, y: 200 } },
  { id: 'TR', kind: 'truck', label: 'Line truck', position: { x: 560, y: 420 } },
  { id: 'M', kind: 'mat', label: 'Mat at the truck', position: { x: 780, y: 540 } },
  { id: 'W2', kind: 'worker', standsOn: 'M', label: 'Ground worker at the controls', position: { x: 800, y: 380 } },
], [...phaseJumpers, jumper('jN', 'CB', 'N', 6, 5), jumper('jTR', 'TR', 'N', 13, 11.5), jumper('jM', 'M', 'TR', 5, 4), reach('rTR', 'W2', 'TR')]);

const POLE_GROUND: PlanDocument = doc('Pole 40 on Saltmarsh Lane, climber beside the pole ground', [
  ...phases,
  { id: 'N', kind: 'neutral', label: 'Neutral', groundOhms: 6, position: { x: 300, y: 360 } },
  { id: 'P40', kind: 'structure', material: 'wood', label: 'Pole 40', position: { x: 60, y: 460 } },
  { id: 'CB', kind: 'cluster-bar', label: 'Cluster bar at the climber\'s feet', position: { x: 300, y: 200 } },
  { id: 'PG', kind: 'pole-ground', label: 'Pole ground wire', position: { x: 540, y: 360 } },
  { id: 'W1', kind: 'worker', standsOn: 'CB', label: 'Climber', position: { x: 560, y: 220 } },
], [...phaseJumpers, jumper('jN', 'CB', 'N', 4, 3.5), jumper('jPG', 'CB', 'PG', 5, 4), reach('rA', 'W1', 'A'), reach('rB', 'W1', 'B'), reach('rC', 'W1', 'C')]);

export const DEMO_PRACTICE_PLANS = [GROUND_CREW, POLE_GROUND];

const NOTES: Record<string, string> = {
  [GROUND_CREW.title]: 'The mat is bonded to the truck, so the worker at the controls stands at the truck\'s potential.',
  [POLE_GROUND.title]: 'The cluster bar goes straight to the neutral; the pole ground is bonded in but never relied on.',
};

async function approve(db: Db, organizationId: number, leadId: string, reviewerId: string, document: PlanDocument): Promise<number> {
  const report = checkPlan(document);
  const plan = await createPlan(db, { organizationId, authorId: leadId, title: document.title, structure: describeStructure(document), document, report });
  if ((await submitPlan(db, organizationId, plan.id, leadId, report)).kind !== 'ok') throw new Error(`practice demo plan "${document.title}" cannot be submitted`);
  const decided = await decidePlan(db, organizationId, plan.id, reviewerId, { decision: 'approve', comment: null, teachingNote: NOTES[document.title], documentHash: fingerprint(plan.document), reportHash: fingerprint(report), revision: 1 });
  if (decided.kind !== 'ok') throw new Error(`practice demo plan "${document.title}" cannot be approved`);
  return plan.id;
}

export interface DemoExercise {
  plan: string;
  kind: ExerciseKind;
  mods: Modifications;
  prompt: string;
  note: string;
  /** The demo apprentice's answers, oldest first: element ids shown to them (as `L…` after renaming), or a choice. */
  answers: ({ marks: (elements: string[]) => string[] } | { choice: (correct: number) => number })[];
}

const BUCKET = 'Pole 14 on Wren Hollow Road, bucket work';
export const DEMO_EXERCISES: DemoExercise[] = [
  { plan: BUCKET, kind: 'find', mods: { removeLinks: ['jB'], changeLinks: [] }, prompt: 'One lead is missing. Mark every element that is unsafe or outside the work zone.', note: 'Every phase in reach gets its own jumper to the cluster bar.', answers: [{ marks: (key) => key.slice(0, 1) }, { marks: (key) => key }] },
  { plan: BUCKET, kind: 'fix', mods: { removeLinks: ['jBK'], changeLinks: [] }, prompt: 'Fix this plan on your copy so the lineworker in the bucket is inside the zone.', note: 'The bucket rises with the phases only when it is bonded to the same cluster bar.', answers: [] },
  { plan: BUCKET, kind: 'numbers', mods: { removeLinks: [], changeLinks: [{ id: 'jA', cable: '4' }] }, prompt: 'A smaller lead went on phase A. What is it rated to carry?', note: 'No. 4 is below the No. 2 minimum whatever the fault current.', answers: [{ choice: (c) => (c + 1) % 4 }] },
  { plan: GROUND_CREW.title, kind: 'find', mods: { removeLinks: ['jM'], changeLinks: [] }, prompt: 'Mark what puts the ground worker at risk.', note: 'A mat only helps when it is bonded to what the worker touches.', answers: [{ marks: (key) => [...key.slice(0, 1), 'TR'] }] },
  { plan: POLE_GROUND.title, kind: 'find', mods: { removeLinks: ['jN'], changeLinks: [] }, prompt: 'Where does this zone get its ground? Mark what is unsafe.', note: 'A pole ground may be broken or undersized: never the only way to ground.', answers: [] },
];

/** Adds the practice demo; returns how many plans it added. */
export async function seedPractice(db: Db, organizationId: number, ids: { lead: string; reviewer: string; apprentice: string }): Promise<number> {
  if ((await db.models.PracticeExercise.count({ where: { organizationId } })) > 0) return 0;
  const planIds = new Map<string, number>();
  for (const p of await db.models.Plan.findAll({ where: { organizationId }, attributes: ['id', 'title'] })) planIds.set(p.title, p.id);
  let added = 0;
  for (const document of [GROUND_CREW, POLE_GROUND]) {
    if (planIds.has(document.title)) continue;
    planIds.set(document.title, await approve(db, organizationId, ids.lead, ids.reviewer, document));
    added += 1;
  }
  for (const ex of DEMO_EXERCISES) {
    const approved = planIds.has(ex.plan) ? await findApprovedRevision(db, organizationId, planIds.get(ex.plan)!) : null;
    if (!approved) continue;
    const built = prepareExercise(approved.document, ex.kind, ex.mods);
    if (!built.ok) throw new Error(`practice demo exercise on "${ex.plan}" has no gap: ${built.reason}`);
    const { document, key, gap } = built.exercise;
    const made = await createExercise(db, organizationId, { planId: approved.planId, revision: approved.revision, kind: ex.kind, gap, modifications: ex.mods, document, key, prompt: ex.prompt, teachingNote: ex.note, published: true, createdBy: ids.reviewer });
    for (const a of ex.answers) {
      const elements = 'marks' in a ? a.marks(key.elements) : null;
      const choice = 'choice' in a ? a.choice(key.numbers!.correctIndex) : 0;
      const graded = elements ? gradeFind(key, elements) : gradeNumbers(key, choice);
      await addAttempt(db, organizationId, { exerciseId: made.id, apprenticeId: ids.apprentice, answer: elements ? { elements } : { choice }, score: graded.score, details: graded });
    }
  }
  return added;
}

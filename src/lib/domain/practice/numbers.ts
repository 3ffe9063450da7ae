/**
 * Numbers exercises: the checker's own figure with three wrong answers, each one a mistake people
 * make (the other body-weight constant, the wrong clearing time, the neighbouring cable row, the
 * fusing figure instead of the withstand rating).
 */
import { tolerableBodyAmps } from '@/lib/domain/calc/body';
import { cableRating } from '@/lib/domain/calc/ratings';
import type { CableSize, PlanDocument } from '@/lib/schemas/plan';
import { CABLE_SIZES } from '@/lib/schemas/plan';
import type { NumbersQuestion } from './types';

/** Three significant figures: what the choices show and how they are told apart. */
export const roundFigure = (value: number): number => Number(value.toPrecision(3));

interface Candidate {
  value: number;
  reason: string;
}

function pickChoices(correct: Candidate, wrong: Candidate[]): { choices: Candidate[]; correctIndex: number } | null {
  const picked: Candidate[] = [{ ...correct, value: roundFigure(correct.value) }];
  for (const c of wrong) {
    const value = roundFigure(c.value);
    if (picked.length < 4 && Number.isFinite(value) && value > 0 && !picked.some((p) => p.value === value)) picked.push({ ...c, value });
  }
  if (picked.length < 4) return null;
  const choices = [...picked].sort((a, b) => a.value - b.value);
  return { choices, correctIndex: choices.indexOf(picked[0]) };
}

/**
 * Tolerable body current, A — IEEE Std 80 (Dalziel) k/√t with k 0.116 (50 kg) or 0.157 (70 kg) and
 * t the clearing time; the wrong answers use the other k, the other system frequency for t, and k/t.
 */
export function bodyCurrentQuestion(plan: PlanDocument): NumbersQuestion | null {
  const cycles = plan.system.clearingCycles;
  if (cycles === undefined) return null;
  const kg = plan.criteria?.bodyKg ?? 50;
  const otherKg = kg === 50 ? 70 : 50;
  const f = plan.system.frequencyHz;
  const otherF = f === 60 ? 50 : 60;
  const t = cycles / f;
  const tWrong = cycles / otherF;
  const k = kg === 70 ? 0.157 : 0.116;
  const picked = pickChoices({ value: tolerableBodyAmps(t, kg), reason: `Right: k/√t with k for ${kg} kg and t = ${cycles} cycles ÷ ${f} Hz.` }, [
    { value: tolerableBodyAmps(t, otherKg), reason: `The ${otherKg} kg constant instead of the plan's ${kg} kg.` },
    { value: tolerableBodyAmps(tWrong, kg), reason: `The clearing time counted in cycles of ${otherF} Hz instead of ${f} Hz.` },
    { value: k / Math.max(t, 0.03), reason: 'k divided by t, without the square root.' },
    { value: k, reason: 'The clearing time taken as 1 s.' },
    { value: tolerableBodyAmps(tWrong, otherKg), reason: `Both the ${otherKg} kg constant and ${otherF} Hz cycles.` },
  ]);
  if (!picked) return null;
  return {
    quantity: 'tolerable-body-current',
    question: `What current can a ${kg} kg body tolerate for this plan's clearing time (${plan.system.clearingCycles} cycles at ${f} Hz)?`,
    unit: 'A',
    choices: picked.choices.map((c) => ({ value: c.value, label: `${c.value} A` })),
    correctIndex: picked.correctIndex,
    reasons: picked.choices.map((c) => c.reason),
    basis: 'IEEE Std 80 (Dalziel): I = 0.116/√t A for 50 kg, 0.157/√t A for 70 kg',
  };
}

const neighbour = (cable: CableSize, step: number): CableSize | null => CABLE_SIZES[CABLE_SIZES.indexOf(cable) + step] ?? null;

/**
 * A jumper cable's withstand rating, kA, for the plan's clearing time — the same grade-table and
 * Onderdonk figures the checker uses; wrong answers read the neighbouring row, the other
 * tabulated column (15 vs 30 cycles) or the fusing figure.
 */
export function cableRatingQuestion(plan: PlanDocument, linkId: string): NumbersQuestion | null {
  const link = plan.links.find((l) => l.id === linkId);
  if (!link || link.kind !== 'jumper') return null;
  const cycles = plan.system.clearingCycles;
  if (cycles === undefined) return null;
  const f = plan.system.frequencyHz;
  const t = cycles / f;
  const right = cableRating(link.cable, t, f);
  const wrongT = t <= 0.25 ? 0.5 : 0.25;
  const wrong: Candidate[] = [];
  const up = neighbour(link.cable, 1);
  const down = neighbour(link.cable, -1);
  if (up) wrong.push({ value: cableRating(up, t, f).ratingKa, reason: `The row for ${up} instead of ${link.cable}.` });
  wrong.push({ value: cableRating(link.cable, wrongT, f).ratingKa, reason: `The ${wrongT === 0.5 ? '30' : '15'}-cycle column instead of the plan's clearing time.` });
  wrong.push({ value: right.fusingKa, reason: 'The fusing (melting) current instead of the withstand rating.' });
  if (down) wrong.push({ value: cableRating(down, t, f).ratingKa, reason: `The row for ${down} instead of ${link.cable}.` });
  const picked = pickChoices({ value: right.ratingKa, reason: `Right: ${right.basis}.` }, wrong);
  if (!picked) return null;
  const name = (id: string) => plan.nodes.find((n) => n.id === id)?.label ?? id;
  const ends = `${name(link.from)} to ${name(link.to)}`;
  return {
    quantity: 'cable-rating',
    question: `What fault current is jumper ${link.id} (${link.cable} copper, ${ends}) rated to carry for this plan's clearing time (${plan.system.clearingCycles} cycles at ${f} Hz)?`,
    unit: 'kA',
    choices: picked.choices.map((c) => ({ value: c.value, label: `${c.value} kA` })),
    correctIndex: picked.correctIndex,
    reasons: picked.choices.map((c) => c.reason),
    basis: right.basis,
  };
}

/**
 * Practice exercises: a gap put into a copy of an approved plan, which the apprentice finds,
 * fixes, or answers a figure about. These are the shapes the pure practice functions share.
 */
import type { CableSize } from '@/lib/schemas/plan';
import type { Finding } from '@/lib/domain/report';

/** What the apprentice does: mark the unsafe elements, repair a copy, or pick a figure. */
export const EXERCISE_KINDS = ['find', 'fix', 'numbers'] as const;
export type ExerciseKind = (typeof EXERCISE_KINDS)[number];

/**
 * The kind of gap an exercise plants, named from what the checker finds on the modified plan.
 * Progress is counted per gap so an apprentice sees which kind they keep missing.
 */
export const GAP_KINDS = ['phase-ungrounded', 'bucket-unbonded', 'mat-unbonded', 'cable-underrated', 'pole-ground-only', 'zone-gap'] as const;
export type GapKind = (typeof GAP_KINDS)[number];

export const GAP_LABELS: Record<GapKind, string> = {
  'phase-ungrounded': 'Phase left ungrounded',
  'bucket-unbonded': 'Bucket not bonded',
  'mat-unbonded': 'Ground worker off the mat\'s zone',
  'cable-underrated': 'Under-rated cable',
  'pole-ground-only': 'Pole ground left as the only ground',
  'zone-gap': 'Surface outside the zone',
};

export const KIND_LABELS: Record<ExerciseKind, string> = { find: 'Find the gap', fix: 'Fix the gap', numbers: 'Figures' };

/** The changes that make an exercise out of an approved plan (ids of the original plan). */
export interface Modifications {
  /** Jumpers or bonds taken out. */
  removeLinks: string[];
  /** Jumpers whose cable is swapped for another size. */
  changeLinks: { id: string; cable: CableSize }[];
}

/** A numbers question: one figure the checker computes, four choices sorted by value. */
export interface NumbersQuestion {
  quantity: 'tolerable-body-current' | 'cable-rating';
  /** The question in a sentence, naming the element asked about. */
  question: string;
  unit: 'A' | 'kA';
  choices: { value: number; label: string }[];
  correctIndex: number;
  /** How the correct value comes about, and which mistake each wrong choice stands for. */
  reasons: string[];
  basis: string;
}

/** Everything the server keeps secret from the apprentice until they answer. */
export interface AnswerKey {
  /** Blocker findings on the modified plan that the approved original does not have. */
  planted: Finding[];
  /** Element ids (as the apprentice sees them) named by the planted findings. */
  elements: string[];
  /** Original link id → the id shown to the apprentice (removed links are absent). */
  linkIds: Record<string, string>;
  numbers?: NumbersQuestion;
}

/** A planted finding's identity across documents: rule plus elements in a fixed order. */
export const findingKey = (finding: Pick<Finding, 'rule' | 'elements'>): string => JSON.stringify([finding.rule, [...finding.elements].sort()]);

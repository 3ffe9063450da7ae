/**
 * Grading: found, missed and wrongly marked elements for find; the fixed copy's own check for fix;
 * the exact choice for numbers. Scores are 0–100 and 100 means passed.
 */
import { canonicalJson } from '@/lib/domain/canonical-json';
import { checkPlan } from '@/lib/domain/checker';
import type { CheckReport, Finding } from '@/lib/domain/report';
import type { PlanDocument } from '@/lib/schemas/plan';
import { findingKey, type AnswerKey } from './types';

export interface FindGrade {
  score: number;
  found: string[];
  missed: string[];
  wrong: string[];
}

/**
 * Find: the score is the overlap of marked and key over their union (Jaccard), in percent, so
 * marking everything scores as badly as marking nothing.
 */
export function gradeFind(key: AnswerKey, marked: string[]): FindGrade {
  const answer = new Set(key.elements);
  const picks = new Set(marked);
  const found = [...picks].filter((e) => answer.has(e)).sort();
  const missed = [...answer].filter((e) => !picks.has(e)).sort();
  const wrong = [...picks].filter((e) => !answer.has(e)).sort();
  const union = found.length + missed.length + wrong.length;
  return { score: union ? Math.round((100 * found.length) / union) : 0, found, missed, wrong };
}

export interface FixGrade {
  score: number;
  /** Planted blockers the fix cleared. */
  found: Finding[];
  /** Planted blockers still there. */
  missed: Finding[];
  /** Blockers the fix added, and changes a fix may not make. */
  wrong: Finding[];
}

const CHANGED_PLAN = 'practice-changed-plan';

const changed = (message: string, elements: string[] = []): Finding => ({
  rule: CHANGED_PLAN,
  severity: 'blocker',
  elements,
  message,
  basis: 'Practice: a fix adds or changes grounding; the plan\'s people, surfaces and system stay as given',
});

/** A node as JSON without where it is drawn or what it is called: the parts a fix must keep. */
const strip = (item: object) => canonicalJson(Object.fromEntries(Object.entries(item).filter(([k]) => k !== 'position' && k !== 'label')));

/** What a fix may not do: remove or alter a node or a reach line, or change the system data. */
export function fixIntegrity(given: PlanDocument, fixed: PlanDocument): Finding[] {
  const out: Finding[] = [];
  const nodes = new Map(fixed.nodes.map((n) => [n.id, n]));
  for (const node of given.nodes) {
    const now = nodes.get(node.id);
    if (!now) out.push(changed(`${node.label ?? node.id} was deleted; a fix keeps every element of the plan.`, [node.id]));
    else if (strip(now) !== strip(node)) out.push(changed(`${node.label ?? node.id} was changed; a fix adds grounding, it does not change the structure, the people or what they stand on.`, [node.id]));
  }
  const reaches = new Set(fixed.links.filter((l) => l.kind === 'reach').map((l) => `${l.from}>${l.to}`));
  const name = (id: string) => given.nodes.find((n) => n.id === id)?.label ?? id;
  for (const reach of given.links.filter((l) => l.kind === 'reach')) {
    if (!reaches.has(`${reach.from}>${reach.to}`)) out.push(changed(`The reach from ${name(reach.from)} to ${name(reach.to)} was removed; what a worker can touch stays as given.`, [reach.id]));
  }
  if (canonicalJson(given.system) !== canonicalJson(fixed.system) || canonicalJson(given.criteria ?? {}) !== canonicalJson(fixed.criteria ?? {})) {
    out.push(changed('The system data or criteria were changed; the fault and the people are what they are.'));
  }
  return out;
}

/**
 * Fix: the fixed copy is checked; it passes when none of the planted blockers remain and it has
 * no blocker the given plan did not have (and changes nothing a fix may not change). The server
 * passes the fixed copy's report, checked in its worker pool (a handed-in drawing can be large).
 */
export function gradeFix(key: AnswerKey, given: PlanDocument, givenBlockers: Finding[], fixed: PlanDocument, report: CheckReport = checkPlan(fixed)): FixGrade {
  const now = report.findings.filter((f) => f.severity === 'blocker');
  const nowKeys = new Set(now.map(findingKey));
  const plantedKeys = new Set(key.planted.map(findingKey));
  const givenKeys = new Set(givenBlockers.map(findingKey));
  const found = key.planted.filter((f) => !nowKeys.has(findingKey(f)));
  const missed = key.planted.filter((f) => nowKeys.has(findingKey(f)));
  const wrong = [...fixIntegrity(given, fixed), ...now.filter((f) => !plantedKeys.has(findingKey(f)) && !givenKeys.has(findingKey(f)))];
  const total = key.planted.length + wrong.length;
  const score = missed.length === 0 && wrong.length === 0 ? 100 : Math.min(99, Math.round((100 * found.length) / total));
  return { score, found, missed, wrong };
}

export interface NumbersGrade {
  score: number;
  found: string[];
  missed: string[];
  wrong: string[];
}

/** Numbers: the exact choice (by index into the four shown) scores 100, anything else 0. */
export function gradeNumbers(key: AnswerKey, choice: number): NumbersGrade {
  const q = key.numbers;
  if (!q) return { score: 0, found: [], missed: [], wrong: [] };
  const right = q.choices[q.correctIndex].label;
  if (choice === q.correctIndex) return { score: 100, found: [right], missed: [], wrong: [] };
  return { score: 0, found: [], missed: [right], wrong: q.choices[choice] ? [q.choices[choice].label] : [] };
}

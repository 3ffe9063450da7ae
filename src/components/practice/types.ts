/** What the practice islands receive from their pages and the API (the learner's view, never the answer). */
import { KIND_LABELS } from '@/components/editor/plan-ops';
import type { Finding } from '@/lib/domain/report';
import type { PlanDocument } from '@/lib/schemas/plan';

export interface LearnerExercise {
  id: number;
  kind: 'find' | 'fix' | 'numbers';
  prompt: string;
  document: PlanDocument;
  question?: { text: string; unit: string; choices: string[] };
  mine: { attempts: number; best: number | null; latest: number | null };
}

export interface AttemptResult {
  score: number;
  passed: boolean;
  found: (string | Finding)[];
  missed: (string | Finding)[];
  wrong: (string | Finding)[];
  explanation: {
    gaps: { rule: string; elements: string[]; message: string; basis: string }[];
    teachingNote: string | null;
    original: { planId: number; revision: number; title: string; href: string };
    numbers?: { question: string; choices: string[]; correctIndex: number; reasons: string[]; basis: string };
  };
  mine: { attempts: number; best: number | null; latest: number | null };
}

/** A short name for an element of the drawing: its label, or its kind and ends. */
export function elementName(doc: PlanDocument, id: string): string {
  const node = doc.nodes.find((n) => n.id === id);
  if (node) return node.label ? `${node.label} (${id})` : `${KIND_LABELS[node.kind] ?? node.kind} ${id}`;
  const link = doc.links.find((l) => l.id === id);
  if (!link) return id;
  const end = (n: string) => doc.nodes.find((x) => x.id === n)?.label ?? n;
  return `${link.kind}${link.kind === 'jumper' ? ` ${link.cable}` : ''} ${end(link.from)} – ${end(link.to)} (${id})`;
}

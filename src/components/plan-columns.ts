/**
 * The columns a plan list can show, for PlanTable: each one's header word, the sort it stands for
 * (null: not sortable) and its cell's classes in a table. Pages choose which and in what order.
 */
import type { PlanSort } from '@/lib/schemas/api';

export type PlanColumn = 'title' | 'structure' | 'status' | 'findings' | 'author' | 'updated' | 'waiting' | 'note';

export const PLAN_COLUMNS: Record<PlanColumn, { label: string; sort: PlanSort | null; cell: string }> = {
  title: { label: 'Title', sort: 'title', cell: '' },
  structure: { label: 'Structure', sort: 'structure', cell: '' },
  status: { label: 'Status', sort: 'status', cell: '' },
  findings: { label: 'Findings', sort: 'blockers', cell: '' },
  author: { label: 'Author', sort: null, cell: '' },
  updated: { label: 'Last change', sort: 'updated', cell: 'num text-sm' },
  waiting: { label: 'Waiting', sort: 'submitted', cell: 'num' },
  note: { label: 'Note', sort: null, cell: 'text-sm font-semibold text-warning' },
};

/** A column by its key, or with a header word of the page's own. */
export type PlanColumnChoice = PlanColumn | { key: PlanColumn; label: string };

export function planColumns(choices: readonly PlanColumnChoice[]): { key: PlanColumn; label: string; sort: PlanSort | null; cell: string }[] {
  return choices.map((c) => (typeof c === 'string' ? { key: c, ...PLAN_COLUMNS[c] } : { ...PLAN_COLUMNS[c.key], key: c.key, label: c.label }));
}

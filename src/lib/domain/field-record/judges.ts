/**
 * The two questions a store asks under its lock, answered from the plan document and the entries
 * so far: may this entry be appended (and how many sets are on after it), and may the record close.
 */
import type { PlanDocument } from '@/lib/schemas/plan';
import type { Refusal } from './refusals';
import { applyEntry, judgeClose, judgeEntry, recordPlanFrom, replay } from './rules';
import type { SetStatusLookup } from './set-status';
import type { FieldEntry, Flag } from './types';

export type StoreVerdict = { ok: true; flags: Flag[]; setsOn: number } | { ok: false; refusal: Refusal };

/** `entries` ends with the entry being judged; the ones before it are already recorded. */
export function judgeAppend(document: PlanDocument, entries: readonly FieldEntry[], closed: boolean, sets: SetStatusLookup): StoreVerdict {
  const plan = recordPlanFrom(document);
  const entry = entries[entries.length - 1];
  const before = replay(plan, entries.slice(0, -1), closed);
  const verdict = judgeEntry(plan, before, entry, sets);
  if (!verdict.ok) return verdict;
  return { ok: true, flags: verdict.flags, setsOn: applyEntry(plan, before, entry, verdict.flags).on.length };
}

export function judgeCloseOut(document: PlanDocument, entries: readonly FieldEntry[], closed: boolean): StoreVerdict {
  const verdict = judgeClose(replay(recordPlanFrom(document), entries, closed));
  return verdict.ok ? { ok: true, flags: [], setsOn: 0 } : verdict;
}

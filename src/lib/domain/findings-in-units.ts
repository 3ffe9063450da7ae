/**
 * Findings as stored, worded in the reader's units: the stored report's findings keep their place,
 * severity and elements; a message is taken from a re-run of the check in the reader's units only
 * where that re-run found the very same finding (same rule, severity and elements) at the same place.
 * Anything that drifted since (a set's test falling due) keeps the stored wording.
 */
import type { Finding } from './report';

const same = (a: Finding, b: Finding | undefined) =>
  b !== undefined && a.rule === b.rule && a.severity === b.severity && a.elements.length === b.elements.length && a.elements.every((e, i) => e === b.elements[i]);

export function findingsInUnits(stored: Finding[], reworded: Finding[]): Finding[] {
  return stored.map((f, i) => (same(f, reworded[i]) ? { ...f, message: reworded[i].message } : f));
}

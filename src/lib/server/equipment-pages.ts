/** Helpers of the equipment pages: list links and the CSV import from a form. */
import type { Db } from '@db/connection';
import { saveSets, type SetJson } from '@db/repositories/equipment';
import type { ListSetsQuery, SetSort } from '@/lib/schemas/equipment';
import { parseInventoryCsv, type CsvIssue } from '@/lib/schemas/equipment-csv';
import { today } from './equipment-http';

export function setListLinks(query: ListSetsQuery) {
  const href = (changes: Partial<Record<keyof ListSetsQuery, string | number | undefined>>): string => {
    const params = new URLSearchParams();
    const merged = { status: query.status, due: query.due, q: query.q, sort: query.sort, dir: query.dir, page: query.page, ...changes };
    for (const [key, value] of Object.entries(merged)) {
      if (value === undefined || value === '') continue;
      if ((key === 'page' && value === 1) || (key === 'sort' && value === 'tag') || (key === 'dir' && value === 'asc')) continue;
      params.set(key, String(value));
    }
    const s = params.toString();
    return `/equipment${s ? `?${s}` : ''}`;
  };
  return { href, sortHref: (sort: SetSort) => href({ sort, dir: query.sort === sort && query.dir === 'asc' ? 'desc' : 'asc', page: 1 }) };
}

export type ImportResult = { ok: true; created: SetJson[]; updated: SetJson[] } | { ok: false; issues: CsvIssue[] };

/**
 * Imports a CSV inventory, all or nothing (POST /api/equipment/import and the page's upload form):
 * rows whose tag exists update that set, the others are added.
 */
export async function importInventory(db: Db, organizationId: number, actorId: string, text: string): Promise<ImportResult> {
  const parsed = parseInventoryCsv(text);
  if (!parsed.ok) return parsed;
  const day = today();
  const future = parsed.rows.filter((r) => r.body.lastTestedOn && r.body.lastTestedOn > day);
  if (future.length) return { ok: false, issues: future.map((r) => ({ path: `line ${r.line}.lastTestedOn`, message: 'must not be in the future' })) };
  const outcome = await saveSets(db, organizationId, actorId, parsed.rows.map((r) => r.body), 'upsert');
  if (outcome.kind !== 'ok') return { ok: false, issues: [{ path: 'tag', message: 'another import changed the same tags at the same moment; import again' }] };
  return { ok: true, ...outcome.value };
}

/** Helpers of the equipment pages: the list's links. */
import type { ListSetsQuery, SetSort } from '@/lib/schemas/equipment';

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

/** Links for server-rendered plan tables: each filter, sort and page is a plain URL (works without JavaScript). */
import { defaultSortDir, type ListPlansQuery, type PlanSort } from '@/lib/schemas/api';

export function listLinks(path: string, query: ListPlansQuery, defaultSort: PlanSort = 'updated') {
  const currentDir = query.dir ?? defaultSortDir(query.sort);
  const href = (changes: Partial<Record<keyof ListPlansQuery, string | number | undefined>>): string => {
    const params = new URLSearchParams();
    const merged = { status: query.status, q: query.q, sort: query.sort, dir: query.dir, page: query.page, ...changes };
    for (const [key, value] of Object.entries(merged)) {
      if (value === undefined || value === '') continue;
      if (key === 'page' && value === 1) continue;
      if (key === 'sort' && value === defaultSort) continue;
      params.set(key, String(value));
    }
    const s = params.toString();
    return `${path}${s ? `?${s}` : ''}`;
  };
  return {
    currentDir,
    href,
    sortHref: (sort: PlanSort) => href({ sort, dir: query.sort === sort ? (currentDir === 'asc' ? 'desc' : 'asc') : undefined, page: 1 }),
  };
}

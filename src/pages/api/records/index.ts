import { getDb } from '@db/connection';
import { listRecords } from '@db/repositories/field-records';
import { listRecordsQuery } from '@/lib/schemas/field-record';
import { requireUser } from '@/lib/server/guards';
import { endpoint, json, readQuery } from '@/lib/server/http';

/** The organisation's field records, open ones with sets on first: ?status=&page=&pageSize= */
export const GET = endpoint(async (ctx) => {
  const person = requireUser(ctx);
  const query = readQuery(ctx.url, listRecordsQuery);
  // Apprentices see closed records only.
  const status = person.role === 'apprentice' ? 'closed' : query.status;
  if (person.role === 'apprentice' && query.status === 'open') return json({ items: [], total: 0, page: query.page, pageSize: query.pageSize, pages: 1 });
  return json(await listRecords(getDb(), person.organizationId, { ...query, status }));
});

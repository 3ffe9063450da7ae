import { getDb } from '@db/connection';
import { listRecords } from '@db/repositories/field-records';
import { listRecordsQuery } from '@/lib/schemas/field-record';
import { can } from '@/lib/domain/permissions';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, readQuery } from '@/lib/server/http';

/** The organisation's field records, open ones with sets on first: ?status=&page=&pageSize= */
export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'records.view');
  const query = readQuery(ctx.url, listRecordsQuery);
  // Apprentices see closed records only.
  const seesOpen = can(person.role, 'records.view-open');
  const status = seesOpen ? query.status : 'closed';
  if (!seesOpen && query.status === 'open') return json({ items: [], total: 0, page: query.page, pageSize: query.pageSize, pages: 1 });
  return json(await listRecords(getDb(), person.organizationId, { ...query, status }));
});

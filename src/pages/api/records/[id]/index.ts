import { idParam } from '@/lib/schemas/api';
import { inventoryCopy, readableRecord, recordJson } from '@/lib/server/field-records';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, parseWith } from '@/lib/server/http';

/** One record with its entries in order, the counts, the next step, and (open) the organisation's sets. */
export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'records.view');
  const record = await readableRecord(person, parseWith(idParam, ctx.params.id));
  return json({ record: recordJson(record, record.status === 'open' ? await inventoryCopy(person.organizationId) : undefined) });
});

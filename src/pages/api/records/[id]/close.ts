import { idParam } from '@/lib/schemas/api';
import { closeOut, recordJson } from '@/lib/server/field-records';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, parseWith } from '@/lib/server/http';

/** Closes out the record: 409 listing the sets still on; once closed, every write is 409. */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'records.write');
  const record = await closeOut(person, parseWith(idParam, ctx.params.id), ctx.url);
  return json({ record: recordJson(record) });
});

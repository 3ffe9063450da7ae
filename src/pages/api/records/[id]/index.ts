import { idParam } from '../../../../lib/schemas/api';
import { readableRecord, recordJson } from '../../../../lib/server/field-records';
import { requireUser } from '../../../../lib/server/guards';
import { endpoint, json, parseWith } from '../../../../lib/server/http';

/** One record with its entries in order, the counts of sets on and off, and the next step. */
export const GET = endpoint(async (ctx) => {
  const person = requireUser(ctx);
  return json({ record: recordJson(await readableRecord(person, parseWith(idParam, ctx.params.id))) });
});

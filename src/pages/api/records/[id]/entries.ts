import { idParam } from '@/lib/schemas/api';
import { entryBody } from '@/lib/schemas/field-record';
import { entryJson, recordEntry } from '@/lib/server/field-records';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, parseWith, readJson } from '@/lib/server/http';

/** Records one entry: 201 when new, 200 with the stored entry when its clientId was seen before. */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'records.write');
  const recordId = parseWith(idParam, ctx.params.id);
  const input = await readJson(ctx, entryBody, 64 * 1024);
  const { created, entry } = await recordEntry(person, recordId, input, ctx.url);
  return json({ entry: entryJson(entry) }, created ? 201 : 200);
});

import { idParam } from '@/lib/schemas/api';
import { setTestBody } from '@/lib/schemas/equipment';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, parseWith, readJson } from '@/lib/server/http';
import { recordSetTest } from '@/lib/server/services/equipment';

/** Records an in-service test (admin, crew lead); a pass can put the set back in service. */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'sets.test');
  const id = parseWith(idParam, ctx.params.id);
  const body = await readJson(ctx, setTestBody);
  return json(await recordSetTest(person, id, body), 201);
});

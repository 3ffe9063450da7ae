import { getDb } from '@db/connection';
import { recordTest } from '@db/repositories/equipment';
import { idParam } from '@/lib/schemas/api';
import { setTestBody } from '@/lib/schemas/equipment';
import { AppError } from '@/lib/server/errors';
import { today, unwrap } from '@/lib/server/equipment-http';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, parseWith, readJson } from '@/lib/server/http';

/** Records an in-service test (admin, crew lead); a pass can put the set back in service. */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'sets.test');
  const id = parseWith(idParam, ctx.params.id);
  const body = await readJson(ctx, setTestBody);
  if (body.testedOn > today()) throw new AppError('VALIDATION', { issues: [{ path: 'testedOn', message: 'must not be in the future' }] });
  const value = unwrap(await recordTest(getDb(), person.organizationId, id, person.id, body));
  return json(value, 201);
});

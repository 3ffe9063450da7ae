import { updateUserBody } from '@/lib/schemas/api';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, readJson } from '@/lib/server/http';
import { changePerson } from '@/lib/server/services/people';

/** Changes a person's role or disables them; disabling ends every session they have. */
export const PATCH = endpoint(async (ctx) => {
  const admin = requireCan(ctx, 'people.manage');
  const body = await readJson(ctx, updateUserBody, 16 * 1024);
  return json({ person: await changePerson(admin, String(ctx.params.id ?? ''), body) });
});

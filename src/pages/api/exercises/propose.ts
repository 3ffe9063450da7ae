import { proposeBody } from '@/lib/schemas/practice';
import { requireCan } from '@/lib/server/guards';
import { endpoint, json, readJson } from '@/lib/server/http';
import { propose } from '@/lib/server/practice';

/** `{planId, revision?}` → removals or cable swaps that each plant a blocker of a different kind, with the findings. */
export const POST = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'practice.manage');
  const body = await readJson(ctx, proposeBody, 16 * 1024);
  return json(await propose(person, body.planId, body.revision));
});

import { requireCan } from '@/lib/server/guards';
import { endpoint, json } from '@/lib/server/http';
import { progress } from '@/lib/server/practice';

/** Apprentices × exercises of the organisation: attempts, best and latest score, last attempt. */
export const GET = endpoint(async (ctx) => {
  const person = requireCan(ctx, 'practice.manage');
  return json(await progress(person));
});

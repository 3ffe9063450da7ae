import { requireRole } from '@/lib/server/guards';
import { endpoint, json } from '@/lib/server/http';
import { PRACTICE_STAFF, progress } from '@/lib/server/practice';

/** Apprentices × exercises of the organisation: attempts, best and latest score, last attempt. */
export const GET = endpoint(async (ctx) => {
  const person = requireRole(ctx, ...PRACTICE_STAFF);
  return json(await progress(person));
});

import { signOut } from '@/lib/server/auth';
import { endpoint, json } from '@/lib/server/http';

/** Ends this session. Signed out already is fine too. */
export const POST = endpoint(async (ctx) => {
  await signOut(ctx);
  return json({ ok: true });
});

import { setPasswordBody } from '@/lib/schemas/api';
import { endpoint, json, readJson } from '@/lib/server/http';
import { setPassword } from '@/lib/server/services/account';

/** Sets a password through a one-time link (invitation or reset); the link then stops working. */
export const POST = endpoint(async (ctx) => {
  const body = await readJson(ctx, setPasswordBody, 16 * 1024);
  await setPassword(ctx, body.token, body.password);
  return json({ ok: true });
});

import { loginBody } from '@/lib/schemas/api';
import { endpoint, json, readJson } from '@/lib/server/http';
import { attemptSignIn } from '@/lib/server/services/account';

/** Signs in with `{email, password}`. Unknown e-mail and wrong password get the same answer. */
export const POST = endpoint(async (ctx) => {
  const body = await readJson(ctx, loginBody, 16 * 1024);
  const person = await attemptSignIn(ctx, body.email, body.password);
  return json({ person });
});

import { setPasswordBody } from '@/lib/schemas/api';
import { AppError } from '@/lib/server/errors';
import { endpoint, json, readJson } from '@/lib/server/http';
import { setPasswordWithToken } from '@/lib/server/passwords';
import { throttleLinkUse } from '@/lib/server/throttle';

/** Sets a password through a one-time link (invitation or reset); the link then stops working. */
export const POST = endpoint(async (ctx) => {
  const body = await readJson(ctx, setPasswordBody, 16 * 1024);
  const throttle = await throttleLinkUse(ctx);
  if (!(await setPasswordWithToken(body.token, body.password, { personId: ctx.locals.person?.id ?? null, sessionToken: ctx.locals.sessionId }))) throw new AppError('TOKEN_INVALID');
  await throttle.succeeded();
  return json({ ok: true });
});

import { forgotPasswordBody } from '@/lib/schemas/api';
import { endpoint, json, readJson } from '@/lib/server/http';
import { requestPasswordReset } from '@/lib/server/services/account';

/** Sends a reset link if the e-mail belongs to an active person; the answer is the same either way. */
export const POST = endpoint(async (ctx) => {
  const body = await readJson(ctx, forgotPasswordBody, 4 * 1024);
  await requestPasswordReset(ctx, body.email);
  return json({ ok: true, message: 'If that e-mail belongs to an active account, a reset link is on its way.' });
});

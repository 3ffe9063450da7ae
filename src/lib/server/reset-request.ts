/**
 * "Forgot password", shared by the JSON endpoint and the page. The request does the same work for
 * every e-mail — take its throttle hits, schedule the job — and answers; looking the person up,
 * making the link and queueing the mail happen after the answer, so its timing says nothing about
 * whether the address exists.
 */
import type { APIContext } from 'astro';
import { afterResponse } from './log';
import { sendPasswordReset } from './people-admin';
import { throttleResetRequest } from './throttle';

export async function requestPasswordReset(ctx: Pick<APIContext, 'request' | 'clientAddress' | 'url'>, email: string): Promise<void> {
  await throttleResetRequest(ctx, email);
  const requestUrl = new URL(ctx.url);
  afterResponse(() => sendPasswordReset(email, requestUrl), 'password reset mail');
}

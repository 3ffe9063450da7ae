/**
 * A person's own account, for the auth endpoints and the sign-in, forgot-password and
 * set-password pages alike: sign in (throttled), ask for a reset link, set a password through a
 * one-time link. These take the request context: the throttles count by client address.
 */
import type { APIContext } from 'astro';
import { getDb } from '@db/connection';
import { recordEvent } from '@db/repositories/audit';
import { findPersonForSignIn } from '@db/repositories/people';
import { createPasswordToken } from '@db/repositories/sign-in';
import { tidyBuckets } from '@db/repositories/throttle';
import type { Person } from '@/lib/domain/people';
import { signIn, verifyPassword } from '@/lib/server/auth';
import { AppError } from '@/lib/server/errors';
import { afterResponse } from '@/lib/server/log';
import { queueMail } from '@/lib/server/mail';
import { resetMessage } from '@/lib/server/mail-messages';
import { setPasswordWithToken } from '@/lib/server/passwords';
import { publicUrl } from '@/lib/server/settings';
import { throttleLinkUse, throttleResetRequest, throttleSignIn } from '@/lib/server/throttle';

type RequestContext = Pick<APIContext, 'request' | 'clientAddress' | 'url'>;

export const RESET_HOURS = 1;

/**
 * Checks e-mail and password and starts a session. The attempt is counted before the password is
 * checked (src/lib/server/throttle.ts); a refused attempt is 429 AUTH_THROTTLED with Retry-After.
 */
export async function attemptSignIn(ctx: RequestContext & Pick<APIContext, 'cookies'>, email: string, password: string): Promise<Person> {
  const db = getDb();
  const throttle = await throttleSignIn(ctx, email);
  const found = await findPersonForSignIn(db, email);
  const passwordOk = await verifyPassword(found?.passwordHash ?? null, password);
  if (!found || !passwordOk || found.person.disabled) throw new AppError('AUTH_INVALID');
  await throttle.succeeded();
  await tidyBuckets(db);
  await signIn(ctx, found.person.id);
  return found.person;
}

/**
 * "Forgot password". The request does the same work for every e-mail — take its throttle hits,
 * schedule the job — and answers; looking the person up, making the link and queueing the mail
 * happen after the answer, so its timing says nothing about whether the address exists.
 */
export async function requestPasswordReset(ctx: RequestContext, email: string): Promise<void> {
  await throttleResetRequest(ctx, email);
  const requestUrl = new URL(ctx.url);
  afterResponse(() => sendPasswordReset(email, requestUrl), 'password reset mail');
}

/**
 * Sends a password-reset link to an active person with this e-mail. Says nothing about whether
 * the address exists: the caller answers the same either way.
 */
async function sendPasswordReset(email: string, requestUrl?: URL): Promise<void> {
  const db = getDb();
  const found = await findPersonForSignIn(db, email);
  if (!found || found.person.disabled) return;
  const token = await createPasswordToken(db, found.person.id, 'reset', new Date(Date.now() + RESET_HOURS * 3600_000));
  await queueMail([resetMessage(found.person.email, found.person.name, `${publicUrl(requestUrl)}/set-password/${token}`, RESET_HOURS)]);
  await recordEvent(db, { organizationId: found.person.organizationId, actorId: null, action: 'user.reset-requested', subjectType: 'user', subjectId: found.person.id });
}

/**
 * Sets a password through a one-time link (invitation or reset); the link then stops working.
 * Uses of links are throttled by client address; a spent or unknown link is TOKEN_INVALID.
 */
export async function setPassword(ctx: RequestContext & Pick<APIContext, 'locals'>, token: string, password: string): Promise<void> {
  const throttle = await throttleLinkUse(ctx);
  if (!(await setPasswordWithToken(token, password, { personId: ctx.locals.person?.id ?? null, sessionToken: ctx.locals.sessionId }))) throw new AppError('TOKEN_INVALID');
  await throttle.succeeded();
}

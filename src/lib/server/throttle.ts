/**
 * Throttling of sign-in, reset requests and set-password links (README "Security" says the scheme):
 *   - per client address, a hard block: a sprayer trying many e-mails from one address stops after
 *     ADDRESS_FREE failures in 15 minutes until that window ends;
 *   - per e-mail, a slow back-off: after EMAIL_FREE failures in 15 minutes each further attempt waits
 *     1 s, 2 s, 4 s … at most 60 s after the previous one — never a lock-out, so a stranger can
 *     slow an owner down by at most a minute an attempt, and cannot keep guessing fast either.
 * Every attempt takes its hit BEFORE the password is checked, atomically in the database, so
 * parallel attempts are each counted; a right password clears the e-mail's bucket and gives the
 * address its hit back.
 */
import type { APIContext } from 'astro';
import { getDb } from '@db/connection';
import { bucketKey, clearBucket, refundHit, takeHits, type BucketPolicy } from '@db/repositories/throttle';
import { normaliseEmail } from '@/lib/domain/people';
import { AppError, type ErrorCode } from './errors';
import { settings } from './settings';

const MINUTES_15 = 15 * 60_000;
export const ADDRESS_FREE = 30;
export const EMAIL_FREE = 5;
export const RESETS_PER_HOUR = 3;

const addressPolicy: BucketPolicy = { windowMs: MINUTES_15, free: ADDRESS_FREE, after: 'block' };
const emailPolicy: BucketPolicy = { windowMs: MINUTES_15, free: EMAIL_FREE, after: 'backoff', backoffBaseMs: 1000, backoffMaxMs: 60_000 };
const resetPolicy: BucketPolicy = { windowMs: 60 * 60_000, free: RESETS_PER_HOUR, after: 'block' };

/** The client's address: the socket's, or the last X-Forwarded-For entry behind a trusted proxy. */
export function clientAddress(ctx: Pick<APIContext, 'request' | 'clientAddress'>): string {
  if (settings().BONDMAP_TRUST_PROXY === '1') {
    const forwarded = ctx.request.headers.get('x-forwarded-for');
    const last = forwarded?.split(',').map((s) => s.trim()).filter(Boolean).pop();
    if (last) return last;
  }
  try {
    return ctx.clientAddress || 'unknown';
  } catch {
    return 'unknown';
  }
}

function refusal(retryAfterMs: number, code: ErrorCode): AppError {
  const retryAfterSeconds = Math.max(1, Math.ceil(retryAfterMs / 1000));
  return new AppError(code, { headers: { 'retry-after': String(retryAfterSeconds) }, extra: { retryAfterSeconds } });
}

export interface SignInThrottle {
  /** A right password: clear the e-mail's failures and give the address its hit back. */
  succeeded(): Promise<void>;
}

/** Takes a sign-in attempt's hits, or throws AUTH_THROTTLED (429 with Retry-After). */
export async function throttleSignIn(ctx: Pick<APIContext, 'request' | 'clientAddress'>, email: string): Promise<SignInThrottle> {
  const db = getDb();
  const address = bucketKey('signin', 'addr', clientAddress(ctx));
  const mailbox = bucketKey('signin', 'email', normaliseEmail(email));
  const taken = await takeHits(db, [
    { key: address, policy: addressPolicy },
    { key: mailbox, policy: emailPolicy },
  ]);
  if (!taken.ok) throw refusal(taken.retryAfterMs, 'AUTH_THROTTLED');
  return {
    async succeeded() {
      await clearBucket(db, mailbox);
      await refundHit(db, address);
    },
  };
}

/** A reset request: RESETS_PER_HOUR per e-mail (known or not, so it reveals nothing) and the address limit. */
export async function throttleResetRequest(ctx: Pick<APIContext, 'request' | 'clientAddress'>, email: string): Promise<void> {
  const taken = await takeHits(getDb(), [
    { key: bucketKey('reset', 'addr', clientAddress(ctx)), policy: addressPolicy },
    { key: bucketKey('reset', 'email', normaliseEmail(email)), policy: resetPolicy },
  ]);
  if (!taken.ok) throw refusal(taken.retryAfterMs, 'TOO_MANY_ATTEMPTS');
}

/** A set-password attempt with a link: the address limit; a used link gives its hit back. */
export async function throttleLinkUse(ctx: Pick<APIContext, 'request' | 'clientAddress'>): Promise<{ succeeded(): Promise<void> }> {
  const db = getDb();
  const key = bucketKey('link', 'addr', clientAddress(ctx));
  const taken = await takeHits(db, [{ key, policy: addressPolicy }]);
  if (!taken.ok) throw refusal(taken.retryAfterMs, 'TOO_MANY_ATTEMPTS');
  return { succeeded: () => refundHit(db, key) };
}

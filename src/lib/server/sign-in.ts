/** Sign-in with throttling, shared by the JSON endpoint and the sign-in page's form. */
import type { APIContext } from 'astro';
import { getDb } from '../../../db/connection';
import { findPersonForSignIn } from '../../../db/repositories/people';
import { clearFailures, recentFailures, recordFailure } from '../../../db/repositories/sign-in';
import type { Person } from '../domain/people';
import { signIn, verifyPassword } from './auth';
import { AppError } from './errors';

export const MAX_FAILURES = 5;
export const WINDOW_MS = 15 * 60 * 1000;

/**
 * Checks e-mail and password and starts a session. After MAX_FAILURES failures for one e-mail
 * within WINDOW_MS, every attempt is refused (429 with Retry-After) until the oldest ages out.
 */
export async function attemptSignIn(ctx: Pick<APIContext, 'cookies' | 'url'>, email: string, password: string): Promise<Person> {
  const db = getDb();
  const now = new Date();
  const failures = await recentFailures(db, email, new Date(now.getTime() - WINDOW_MS));
  if (failures.length >= MAX_FAILURES) {
    const freeAt = failures[failures.length - MAX_FAILURES].getTime() + WINDOW_MS;
    const retryAfterS = Math.max(1, Math.ceil((freeAt - now.getTime()) / 1000));
    throw new AppError('AUTH_THROTTLED', { headers: { 'retry-after': String(retryAfterS) }, extra: { retryAfterSeconds: retryAfterS } });
  }
  const found = await findPersonForSignIn(db, email);
  const passwordOk = await verifyPassword(found?.passwordHash ?? null, password);
  if (!found || !passwordOk || found.person.disabled) {
    await recordFailure(db, email, now);
    throw new AppError('AUTH_INVALID');
  }
  await clearFailures(db, email);
  await signIn(ctx, found.person.id);
  return found.person;
}

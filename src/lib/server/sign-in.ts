/** Sign-in with throttling, shared by the JSON endpoint and the sign-in page's form. */
import type { APIContext } from 'astro';
import { getDb } from '@db/connection';
import { findPersonForSignIn } from '@db/repositories/people';
import { tidyBuckets } from '@db/repositories/throttle';
import type { Person } from '@/lib/domain/people';
import { signIn, verifyPassword } from './auth';
import { AppError } from './errors';
import { throttleSignIn } from './throttle';

/**
 * Checks e-mail and password and starts a session. The attempt is counted before the password is
 * checked (src/lib/server/throttle.ts); a refused attempt is 429 AUTH_THROTTLED with Retry-After.
 */
export async function attemptSignIn(ctx: Pick<APIContext, 'cookies' | 'url' | 'request' | 'clientAddress'>, email: string, password: string): Promise<Person> {
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

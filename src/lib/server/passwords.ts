/** Setting a password through a one-time link, shared by the endpoint and the set-password page. */
import { getDb } from '../../../db/connection';
import { recordEvent } from '../../../db/repositories/audit';
import { setPasswordHash } from '../../../db/repositories/people';
import { consumeToken, findUsableToken } from '../../../db/repositories/sign-in';
import { endAllSessions, hashPassword } from './auth';

export async function isUsableToken(token: string): Promise<boolean> {
  return (await findUsableToken(getDb(), token, new Date())) !== null;
}

/** Uses the token once: sets the password, ends old sessions, records it. False if the link is spent. */
export async function setPasswordWithToken(token: string, password: string): Promise<boolean> {
  const db = getDb();
  const usable = await findUsableToken(db, token, new Date());
  if (!usable) return false;
  const passwordHash = await hashPassword(password);
  if (!(await consumeToken(db, token, new Date()))) return false;
  await setPasswordHash(db, usable.userId, passwordHash);
  await endAllSessions(usable.userId);
  const user = await db.models.User.findByPk(usable.userId);
  if (user) {
    await recordEvent(db, { organizationId: user.organizationId, actorId: user.id, action: 'user.password-set', subjectType: 'user', subjectId: user.id, details: { via: usable.purpose } });
  }
  return true;
}

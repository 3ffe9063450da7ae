/** Setting a password through a one-time link, shared by the endpoint and the set-password page. */
import { getDb } from '@db/connection';
import { recordEvent } from '@db/repositories/audit';
import { setPasswordHash } from '@db/repositories/people';
import { consumeToken, findUsableToken, revokeTokens } from '@db/repositories/sign-in';
import { endOtherSessions, hashPassword } from './auth';

export async function isUsableToken(token: string): Promise<boolean> {
  return (await findUsableToken(getDb(), token, new Date())) !== null;
}

/**
 * Uses the token once: sets the password, ends every other link of that person (an older reset
 * link must not work after a newer one was used) and every session but the caller's own when the
 * caller is that person; records it. False if the link is spent. All of it or none of it.
 */
export async function setPasswordWithToken(token: string, password: string, caller: { personId: string | null; sessionToken: string | null } = { personId: null, sessionToken: null }): Promise<boolean> {
  const db = getDb();
  const usable = await findUsableToken(db, token, new Date());
  if (!usable) return false;
  const passwordHash = await hashPassword(password);
  const done = await db.sequelize.transaction(async (transaction) => {
    const now = new Date();
    if (!(await consumeToken(db, token, now, transaction))) return false;
    await setPasswordHash(db, usable.userId, passwordHash, transaction);
    await revokeTokens(db, usable.userId, now, transaction);
    const user = await db.models.User.findByPk(usable.userId, { transaction });
    if (user) {
      await recordEvent(db, { organizationId: user.organizationId, actorId: user.id, action: 'user.password-set', subjectType: 'user', subjectId: user.id, details: { via: usable.purpose } }, transaction);
    }
    return true;
  });
  if (done) await endOtherSessions(usable.userId, caller.personId === usable.userId ? caller.sessionToken : null);
  return done;
}

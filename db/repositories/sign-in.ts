/** One-time password links, stored hashed (failed sign-ins are counted in db/repositories/throttle.ts). */
import { randomBytes } from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import type { Db } from '@db/connection';
import { sha256Hex } from '@/lib/server/fingerprint';

const hashToken = sha256Hex;

/** Creates a one-time token for a person; returns the token itself (only its hash is stored). */
export async function createPasswordToken(db: Db, userId: string, purpose: 'invite' | 'reset', expiresAt: Date, transaction?: Transaction): Promise<string> {
  const token = randomBytes(24).toString('base64url');
  await db.models.PasswordToken.create({ tokenHash: hashToken(token), userId, purpose, expiresAt, usedAt: null }, { transaction });
  return token;
}

/** Finds a usable token (not used, not expired) and the person it belongs to. */
export async function findUsableToken(db: Db, token: string, now: Date): Promise<{ userId: string; purpose: 'invite' | 'reset' } | null> {
  const row = await db.models.PasswordToken.findOne({
    where: { tokenHash: hashToken(token), usedAt: null, expiresAt: { [Op.gt]: now } },
  });
  return row ? { userId: row.userId, purpose: row.purpose } : null;
}

/** Marks the token used; false when another request used it first. */
export async function consumeToken(db: Db, token: string, now: Date, transaction?: Transaction): Promise<boolean> {
  const [count] = await db.models.PasswordToken.update(
    { usedAt: now },
    { where: { tokenHash: hashToken(token), usedAt: null, expiresAt: { [Op.gt]: now } }, transaction },
  );
  return count === 1;
}

/** Ends every outstanding invitation and reset link of a person (their password just changed). */
export async function revokeTokens(db: Db, userId: string, now: Date, transaction?: Transaction): Promise<void> {
  await db.models.PasswordToken.update({ usedAt: now }, { where: { userId, usedAt: null }, transaction });
}

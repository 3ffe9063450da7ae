/**
 * Sessions and passwords. The only file that knows Lucia: Lucia 3 is deprecated upstream, so
 * everything else calls the functions here and a later swap touches one file.
 */
import { hash, verify } from '@node-rs/argon2';
import type { APIContext, AstroCookies } from 'astro';
import { Lucia, TimeSpan, type Adapter, type DatabaseSession, type DatabaseUser } from 'lucia';
import { Op, QueryTypes } from 'sequelize';
import { getDb, type Db } from '@db/connection';
import type { Person } from '@/lib/domain/people';
import { log } from './log';
import { sha256Hex } from './fingerprint';

/** The key a session is stored under: the SHA-256 of its token, so the table hands out no session. */
export function sessionKey(token: string): string {
  return sha256Hex(token);
}

/**
 * Lucia's storage over our Sequelize models (sessions table; users resolved through people.ts).
 * Lucia hands the adapter the token itself; only its hash is ever written or looked up.
 */
class SequelizeSessionAdapter implements Adapter {
  constructor(private readonly db: () => Db) {}

  async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    const row = await this.db().models.Session.findByPk(sessionKey(sessionId));
    if (!row) return [null, null];
    const user = await this.db().models.User.findByPk(row.userId, { attributes: ['id', 'organizationId', 'disabled'] });
    if (!user) return [null, null];
    return [
      { id: sessionId, userId: row.userId, expiresAt: row.expiresAt, attributes: {} },
      { id: user.id, attributes: { organizationId: user.organizationId, disabled: user.disabled } },
    ];
  }

  /** The ids here are the stored hashes (the tokens are not kept); nothing in the app calls this. */
  async getUserSessions(userId: string): Promise<DatabaseSession[]> {
    const rows = await this.db().models.Session.findAll({ where: { userId } });
    return rows.map((r) => ({ id: r.id, userId: r.userId, expiresAt: r.expiresAt, attributes: {} }));
  }

  async setSession(session: DatabaseSession): Promise<void> {
    await this.db().models.Session.create({ id: sessionKey(session.id), userId: session.userId, expiresAt: session.expiresAt });
  }

  async updateSessionExpiration(sessionId: string, expiresAt: Date): Promise<void> {
    await this.db().models.Session.update({ expiresAt }, { where: { id: sessionKey(sessionId) } });
  }

  async deleteSession(sessionId: string): Promise<void> {
    await this.db().models.Session.destroy({ where: { id: sessionKey(sessionId) } });
  }

  async deleteUserSessions(userId: string): Promise<void> {
    await this.db().models.Session.destroy({ where: { userId } });
  }

  async deleteExpiredSessions(): Promise<void> {
    await this.db().models.Session.destroy({ where: { expiresAt: { [Op.lte]: new Date() } } });
  }
}

const SESSION_HOURS = 12;
const SESSION_MS = SESSION_HOURS * 3600_000;

const lucia = new Lucia(new SequelizeSessionAdapter(getDb), {
  sessionExpiresIn: new TimeSpan(SESSION_HOURS, 'h'),
  sessionCookie: { name: 'bondmap_session', attributes: { sameSite: 'lax' } },
  getUserAttributes: (attributes) => attributes,
});

declare module 'lucia' {
  interface Register {
    Lucia: typeof lucia;
    DatabaseUserAttributes: { organizationId: number; disabled: boolean };
  }
}

export const SESSION_COOKIE = lucia.sessionCookieName;

/**
 * The cookie is Secure when the public address is https. Without BONDMAP_PUBLIC_URL the request's
 * own scheme decides (plain http on 127.0.0.1 for the local demo).
 */
export function cookieIsSecure(publicUrl: string | undefined, requestUrl: URL): boolean {
  return publicUrl ? /^https:/i.test(publicUrl) : requestUrl.protocol === 'https:';
}

function writeCookie(cookies: AstroCookies, url: URL, cookie: ReturnType<typeof lucia.createBlankSessionCookie>): void {
  const secure = cookieIsSecure(process.env.BONDMAP_PUBLIC_URL || undefined, url);
  cookies.set(cookie.name, cookie.value, { ...cookie.attributes, secure, httpOnly: true, sameSite: 'lax', path: '/' });
}

/** Starts a session for the person and sets the cookie on the response. */
export async function signIn(ctx: Pick<APIContext, 'cookies' | 'url'>, userId: string): Promise<void> {
  // Sessions that ran out are tidied away for this person as they come back.
  await getDb().models.Session.destroy({ where: { userId, expiresAt: { [Op.lte]: new Date() } } });
  const session = await lucia.createSession(userId, {});
  writeCookie(ctx.cookies, ctx.url, lucia.createSessionCookie(session.id));
}

/** Ends the current session (if any) and clears the cookie. */
export async function signOut(ctx: Pick<APIContext, 'cookies' | 'url' | 'locals'>): Promise<void> {
  if (ctx.locals.sessionId) await lucia.invalidateSession(ctx.locals.sessionId);
  writeCookie(ctx.cookies, ctx.url, lucia.createBlankSessionCookie());
}

/** Ends every session of a person (used when they are disabled or their password changes). */
export async function endAllSessions(userId: string): Promise<void> {
  await lucia.invalidateUserSessions(userId);
}

/** Ends every session of a person except the one with this token (if any). */
export async function endOtherSessions(userId: string, keepToken: string | null): Promise<void> {
  await getDb().models.Session.destroy({ where: { userId, ...(keepToken ? { id: { [Op.ne]: sessionKey(keepToken) } } : {}) } });
}

/** The session and its person in one round trip (the hot path of every signed-in request). */
const SESSION_SQL = `SELECT s.user_id AS userId, UNIX_TIMESTAMP(s.expires_at) * 1000 AS expiresMs,
  u.organization_id AS organizationId, u.email, u.name, u.role, u.disabled, u.password_hash IS NOT NULL AS hasPassword,
  o.name AS organizationName
  FROM sessions s JOIN users u ON u.id = s.user_id LEFT JOIN organizations o ON o.id = u.organization_id
  WHERE s.id = ?`;

interface SessionRow { userId: string; expiresMs: number | string; organizationId: number; email: string; name: string; role: Person['role']; disabled: number | boolean; hasPassword: number | boolean; organizationName: string | null }

/**
 * Reads the session cookie and returns the signed-in person, refreshing the cookie when the
 * session is extended. A disabled person is treated as signed out. Same rules as Lucia's
 * validateSession (an expired session is deleted; past half its 12 h it is extended and only
 * then written back), but the session, the person and the organisation come in one query.
 */
export async function readSession(ctx: Pick<APIContext, 'cookies' | 'url'>, now = Date.now()): Promise<{ person: Person; sessionId: string } | null> {
  const id = ctx.cookies.get(SESSION_COOKIE)?.value;
  if (!id) return null;
  const db = getDb();
  const key = sessionKey(id);
  const [row] = await db.sequelize.query<SessionRow>(SESSION_SQL, { replacements: [key], type: QueryTypes.SELECT });
  const expiresAt = row ? Number(row.expiresMs) : 0;
  if (!row || expiresAt <= now) {
    if (row) await db.models.Session.destroy({ where: { id: key } });
    writeCookie(ctx.cookies, ctx.url, lucia.createBlankSessionCookie());
    return null;
  }
  if (Boolean(Number(row.disabled))) {
    await lucia.invalidateUserSessions(row.userId);
    writeCookie(ctx.cookies, ctx.url, lucia.createBlankSessionCookie());
    return null;
  }
  if (now >= expiresAt - SESSION_MS / 2) {
    await db.models.Session.update({ expiresAt: new Date(now + SESSION_MS) }, { where: { id: key } });
    writeCookie(ctx.cookies, ctx.url, lucia.createSessionCookie(id));
  }
  const person: Person = {
    id: row.userId,
    organizationId: Number(row.organizationId),
    organizationName: row.organizationName ?? '',
    email: row.email,
    name: row.name,
    role: row.role,
    disabled: false,
    hasPassword: Boolean(Number(row.hasPassword)),
  };
  return { person, sessionId: id };
}

// OWASP's minimum for Argon2id: 19 MiB memory, 2 iterations, 1 lane.
const ARGON = { memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, ARGON);
}

// A fixed hash to verify against when the e-mail is unknown, so both failures take as long.
let decoyHash: Promise<string> | null = null;

/** Verifies a password against a stored hash; with no hash it still does the work, then fails. */
export async function verifyPassword(passwordHash: string | null, password: string): Promise<boolean> {
  if (!passwordHash) {
    decoyHash ??= hashPassword('bondmap-decoy-password');
    await verify(await decoyHash, password).catch(() => false);
    return false;
  }
  return verify(passwordHash, password).catch((err: unknown) => {
    // A stored hash the library cannot read: the sign-in fails, and the reason is logged.
    log.error({ err }, 'password hash could not be verified');
    return false;
  });
}

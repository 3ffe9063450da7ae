/** What an admin may do to people, shared by the JSON API and the /admin/users page. */
import { getDb } from '../../../db/connection';
import { recordEvent } from '../../../db/repositories/audit';
import { countActiveAdmins, createPerson, emailExists, findPerson, findPersonForSignIn, updatePerson } from '../../../db/repositories/people';
import { createPasswordToken } from '../../../db/repositories/sign-in';
import type { Person } from '../domain/people';
import type { Role } from '../domain/roles';
import { endAllSessions } from './auth';
import { AppError } from './errors';
import { queueMail } from './mail';
import { invitationMessage, resetMessage } from './mail-messages';
import { publicUrl } from './settings';

export const INVITE_DAYS = 7;

export const RESET_HOURS = 1;

/** Adds a person without a password, e-mails their invitation, and returns the one-time path. */
export async function invitePerson(admin: Person, input: { email: string; name: string; role: Role }, requestUrl?: URL): Promise<{ person: Person; setPasswordPath: string }> {
  const db = getDb();
  if (await emailExists(db, input.email)) {
    throw new AppError('EMAIL_TAKEN', { issues: [{ path: 'email', message: 'is already in use' }] });
  }
  const person = await createPerson(db, { organizationId: admin.organizationId, ...input, passwordHash: null });
  const token = await createPasswordToken(db, person.id, 'invite', new Date(Date.now() + INVITE_DAYS * 86400_000));
  await recordEvent(db, { organizationId: admin.organizationId, actorId: admin.id, action: 'user.invited', subjectType: 'user', subjectId: person.id, details: { role: person.role } });
  const setPasswordPath = `/set-password/${token}`;
  await queueMail([invitationMessage(person.email, person.name, admin.organizationName, admin.name, `${publicUrl(requestUrl)}${setPasswordPath}`, INVITE_DAYS)]);
  return { person, setPasswordPath };
}

/**
 * Sends a password-reset link to an active person with this e-mail. Says nothing about whether
 * the address exists: the caller answers the same either way.
 */
export async function sendPasswordReset(email: string, requestUrl?: URL): Promise<void> {
  const db = getDb();
  const found = await findPersonForSignIn(db, email);
  if (!found || found.person.disabled) return;
  const token = await createPasswordToken(db, found.person.id, 'reset', new Date(Date.now() + RESET_HOURS * 3600_000));
  await queueMail([resetMessage(found.person.email, found.person.name, `${publicUrl(requestUrl)}/set-password/${token}`, RESET_HOURS)]);
  await recordEvent(db, { organizationId: found.person.organizationId, actorId: null, action: 'user.reset-requested', subjectType: 'user', subjectId: found.person.id });
}

/** Changes a role or disables/enables a person; never leaves the organisation without an admin. */
export async function changePerson(admin: Person, id: string, changes: { role?: Role; disabled?: boolean }): Promise<Person> {
  const db = getDb();
  const target = await findPerson(db, admin.organizationId, id);
  if (!target) throw new AppError('NOT_FOUND');
  const losesAdmin = (changes.role !== undefined && changes.role !== 'admin') || changes.disabled === true;
  if (target.id === admin.id && losesAdmin) throw new AppError('SELF_CHANGE');
  if (target.role === 'admin' && losesAdmin && (await countActiveAdmins(db, admin.organizationId, target.id)) === 0) {
    throw new AppError('SELF_CHANGE', { message: 'The organisation would be left without an active admin. Make someone else admin first.' });
  }
  const person = (await updatePerson(db, admin.organizationId, id, changes))!;
  if (changes.disabled) await endAllSessions(id);
  const action = changes.disabled === undefined ? 'user.role-changed' : changes.disabled ? 'user.disabled' : 'user.enabled';
  await recordEvent(db, { organizationId: admin.organizationId, actorId: admin.id, action, subjectType: 'user', subjectId: id, details: changes });
  return person;
}

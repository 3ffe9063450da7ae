/** What an admin may do to people: invite, change a role, disable or enable; for the JSON API and the /admin/users page. */
import { UniqueConstraintError } from 'sequelize';
import { getDb } from '@db/connection';
import { recordEvent } from '@db/repositories/audit';
import { countActiveAdmins, createPerson, emailOrganization, findPerson, lockOrganization, updatePerson } from '@db/repositories/people';
import { createPasswordToken } from '@db/repositories/sign-in';
import { normaliseEmail, type Person } from '@/lib/domain/people';
import { can } from '@/lib/domain/permissions';
import type { Role } from '@/lib/domain/roles';
import { endAllSessions } from '@/lib/server/auth';
import { AppError } from '@/lib/server/errors';
import { assertCan, roleRefusal } from '@/lib/server/guards';
import { queueMail } from '@/lib/server/mail';
import { addressInUseMessage, invitationMessage } from '@/lib/server/mail-messages';
import { publicUrl } from '@/lib/server/settings';

export const INVITE_DAYS = 7;

/** What an invitation answers: the same whether or not the address belongs to another organisation. */
export interface InvitationSent {
  email: string;
  name: string;
  role: Role;
  expiresInDays: number;
  message: string;
}

const emailTaken = () => new AppError('EMAIL_TAKEN', { issues: [{ path: 'email', message: 'is already in use in your organisation' }] });

/**
 * Adds a person without a password and e-mails them their one-time link; the link goes by mail
 * only, so an admin cannot set up a second account of their own without its mailbox. An address
 * already used in another organisation gets a short notice by mail instead and nothing is
 * created, and the admin is answered exactly as for an invitation: nothing here reveals who
 * belongs to another organisation. An address of the admin's own organisation is 409.
 */
export async function invitePerson(admin: Person, input: { email: string; name: string; role: Role }, requestUrl?: URL): Promise<InvitationSent> {
  assertCan(admin, 'people.manage');
  const db = getDb();
  const email = normaliseEmail(input.email);
  const sent: InvitationSent = { email, name: input.name, role: input.role, expiresInDays: INVITE_DAYS, message: `An invitation was sent to ${email}. The link in it works once and for ${INVITE_DAYS} days.` };
  const elsewhere = async (transaction?: Parameters<typeof queueMail>[1]) => {
    await queueMail([addressInUseMessage(email, admin.organizationName, `${publicUrl(requestUrl)}/login`)], transaction);
    return sent;
  };
  try {
    return await db.sequelize.transaction(async (transaction) => {
      await lockOrganization(db, admin.organizationId, transaction);
      const holder = await emailOrganization(db, email, transaction);
      if (holder === admin.organizationId) throw emailTaken();
      if (holder !== null) return elsewhere(transaction);
      const person = await createPerson(db, { organizationId: admin.organizationId, ...input, email, passwordHash: null, invitedBy: admin.id }, transaction);
      const token = await createPasswordToken(db, person.id, 'invite', new Date(Date.now() + INVITE_DAYS * 86400_000), transaction);
      await recordEvent(db, { organizationId: admin.organizationId, actorId: admin.id, action: 'user.invited', subjectType: 'user', subjectId: person.id, details: { role: person.role } }, transaction);
      await queueMail([invitationMessage(person.email, person.name, admin.organizationName, admin.name, `${publicUrl(requestUrl)}/set-password/${token}`, INVITE_DAYS)], transaction);
      return sent;
    });
  } catch (error) {
    // Another organisation's admin invited the same address a moment ago (the unique key on e-mail).
    if (!(error instanceof UniqueConstraintError)) throw error;
    if ((await emailOrganization(db, email)) === admin.organizationId) throw emailTaken();
    return elsewhere();
  }
}

/**
 * Changes a role or disables/enables a person; never leaves the organisation without an admin.
 * The organisation row is locked for the check and the change, so parallel changes go in turn.
 */
export async function changePerson(admin: Person, id: string, changes: { role?: Role; disabled?: boolean }): Promise<Person> {
  assertCan(admin, 'people.manage');
  const db = getDb();
  const person = await db.sequelize.transaction(async (transaction) => {
    await lockOrganization(db, admin.organizationId, transaction);
    // The caller may have lost the admin role to a change that was waiting ahead of this one.
    const actor = await findPerson(db, admin.organizationId, admin.id, transaction);
    if (!actor || !can(actor.role, 'people.manage') || actor.disabled) throw roleRefusal('people.manage');
    const target = await findPerson(db, admin.organizationId, id, transaction);
    if (!target) throw new AppError('NOT_FOUND');
    const losesAdmin = (changes.role !== undefined && !can(changes.role, 'people.manage')) || changes.disabled === true;
    if (target.id === admin.id && losesAdmin) throw new AppError('SELF_CHANGE');
    if (can(target.role, 'people.manage') && losesAdmin && (await countActiveAdmins(db, admin.organizationId, target.id, transaction)) === 0) {
      throw new AppError('SELF_CHANGE', { message: 'The organisation would be left without an active admin. Make someone else admin first.' });
    }
    const updated = (await updatePerson(db, admin.organizationId, id, changes, transaction))!;
    const action = changes.disabled === undefined ? 'user.role-changed' : changes.disabled ? 'user.disabled' : 'user.enabled';
    await recordEvent(db, { organizationId: admin.organizationId, actorId: admin.id, action, subjectType: 'user', subjectId: id, details: changes }, transaction);
    return updated;
  });
  if (changes.disabled) await endAllSessions(id);
  return person;
}

/** People and organisations: rows in, Person out. Every look-up but sign-in is scoped to an organisation. */
import { randomBytes } from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import type { Person } from '@/lib/domain/people';
import { normaliseEmail } from '@/lib/domain/people';
import { rolesFor } from '@/lib/domain/permissions';
import type { Role } from '@/lib/domain/roles';
import type { Db } from '@db/connection';
import type { User } from '@db/models';

export function newId(): string {
  return randomBytes(12).toString('base64url');
}

type UserWithOrg = User & { organization?: { name: string } };

export function toPerson(row: UserWithOrg): Person {
  return {
    id: row.id,
    organizationId: row.organizationId,
    organizationName: row.organization?.name ?? '',
    email: row.email,
    name: row.name,
    role: row.role,
    disabled: row.disabled,
    hasPassword: row.passwordHash !== null,
  };
}

const withOrg = (db: Db) => ({ model: db.models.Organization, as: 'organization', attributes: ['name'] });

export async function findPersonForSignIn(db: Db, email: string): Promise<{ person: Person; passwordHash: string | null } | null> {
  const row = (await db.models.User.findOne({ where: { email: normaliseEmail(email) }, include: [withOrg(db)] })) as UserWithOrg | null;
  return row ? { person: toPerson(row), passwordHash: row.passwordHash } : null;
}

export async function findPerson(db: Db, organizationId: number, id: string, transaction?: Transaction): Promise<Person | null> {
  const row = (await db.models.User.findOne({ where: { id, organizationId }, include: [withOrg(db)], transaction })) as UserWithOrg | null;
  return row ? toPerson(row) : null;
}

export async function listPeople(db: Db, organizationId: number): Promise<Person[]> {
  const rows = (await db.models.User.findAll({
    where: { organizationId },
    include: [withOrg(db)],
    order: [['disabled', 'ASC'], ['name', 'ASC']],
  })) as UserWithOrg[];
  return rows.map(toPerson);
}

/** The organisation of whoever holds this e-mail, or null when nobody does. */
export async function emailOrganization(db: Db, email: string, transaction?: Transaction): Promise<number | null> {
  const row = await db.models.User.findOne({ where: { email: normaliseEmail(email) }, attributes: ['organizationId'], transaction });
  return row?.organizationId ?? null;
}

export async function createPerson(
  db: Db,
  input: { organizationId: number; email: string; name: string; role: Role; passwordHash: string | null; invitedBy?: string | null },
  transaction?: Transaction,
): Promise<Person> {
  const row = await db.models.User.create({ id: newId(), ...input, email: normaliseEmail(input.email) }, { transaction });
  const found = await findPerson(db, input.organizationId, row.id, transaction);
  return found!;
}

export async function updatePerson(db: Db, organizationId: number, id: string, changes: { role?: Role; disabled?: boolean; name?: string }, transaction?: Transaction): Promise<Person | null> {
  await db.models.User.update(changes, { where: { id, organizationId }, transaction });
  return findPerson(db, organizationId, id, transaction);
}

/**
 * Locks the organisation's row for the rest of the transaction: changes to who is admin, and
 * invitations, go one at a time per organisation, so two admins demoting each other at once
 * cannot leave it without an admin.
 */
export async function lockOrganization(db: Db, organizationId: number, transaction: Transaction): Promise<void> {
  await db.models.Organization.findOne({ where: { id: organizationId }, attributes: ['id'], lock: transaction.LOCK.UPDATE, transaction });
}

export async function setPasswordHash(db: Db, userId: string, passwordHash: string, transaction?: Transaction): Promise<void> {
  await db.models.User.update({ passwordHash }, { where: { id: userId }, transaction });
}

export async function countActiveAdmins(db: Db, organizationId: number, exceptId?: string, transaction?: Transaction): Promise<number> {
  return db.models.User.count({
    where: { organizationId, role: [...rolesFor('people.manage')], disabled: false, ...(exceptId ? { id: { [Op.ne]: exceptId } } : {}) },
    transaction,
  });
}

export async function findOrganizationBySlug(db: Db, slug: string) {
  return db.models.Organization.findOne({ where: { slug } });
}

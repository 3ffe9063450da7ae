/** People and organisations: rows in, Person out. Every look-up but sign-in is scoped to an organisation. */
import { randomBytes } from 'node:crypto';
import { Op } from 'sequelize';
import type { Person } from '../../src/lib/domain/people';
import { normaliseEmail } from '../../src/lib/domain/people';
import type { Role } from '../../src/lib/domain/roles';
import type { Db } from '../connection';
import type { User } from '../models';

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

export async function findPerson(db: Db, organizationId: number, id: string): Promise<Person | null> {
  const row = (await db.models.User.findOne({ where: { id, organizationId }, include: [withOrg(db)] })) as UserWithOrg | null;
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

export async function emailExists(db: Db, email: string): Promise<boolean> {
  return (await db.models.User.count({ where: { email: normaliseEmail(email) } })) > 0;
}

export async function createPerson(
  db: Db,
  input: { organizationId: number; email: string; name: string; role: Role; passwordHash: string | null },
): Promise<Person> {
  const row = await db.models.User.create({ id: newId(), ...input, email: normaliseEmail(input.email) });
  const found = await findPerson(db, input.organizationId, row.id);
  return found!;
}

export async function updatePerson(db: Db, organizationId: number, id: string, changes: { role?: Role; disabled?: boolean; name?: string }): Promise<Person | null> {
  await db.models.User.update(changes, { where: { id, organizationId } });
  return findPerson(db, organizationId, id);
}

export async function setPasswordHash(db: Db, userId: string, passwordHash: string): Promise<void> {
  await db.models.User.update({ passwordHash }, { where: { id: userId } });
}

export async function countActiveAdmins(db: Db, organizationId: number, exceptId?: string): Promise<number> {
  return db.models.User.count({
    where: { organizationId, role: 'admin', disabled: false, ...(exceptId ? { id: { [Op.ne]: exceptId } } : {}) },
  });
}

export async function findOrganizationBySlug(db: Db, slug: string) {
  return db.models.Organization.findOne({ where: { slug } });
}

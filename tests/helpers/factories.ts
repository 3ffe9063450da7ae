/**
 * Rows for the server tests, written straight into the test database (the same MariaDB the
 * server under test uses). Each call makes unique e-mails, so test files never collide.
 */
import { hash } from '@node-rs/argon2';
import { randomBytes } from 'node:crypto';
import { createDb, type Db } from '@db/connection';
import { readDbConfig } from '@db/config';
import { createPerson } from '@db/repositories/people';
import type { Role } from '@/lib/domain/roles';
import type { PlanDocument } from '@/lib/schemas/plan';

let db: Db | null = null;
export function testDb(): Db {
  db ??= createDb({ ...readDbConfig(), poolMax: 4 });
  return db;
}

export async function closeTestDb(): Promise<void> {
  await db?.sequelize.close();
  db = null;
}

export const PASSWORD = 'correct horse battery';
let passwordHash: Promise<string> | null = null;

const unique = () => randomBytes(5).toString('hex');

export async function makeOrganization(name = 'Invented Test Co-operative'): Promise<number> {
  const row = await testDb().models.Organization.create({ name: `${name} ${unique()}`, slug: `test-${unique()}` });
  return row.id;
}

export async function makePerson(organizationId: number, role: Role, overrides: { email?: string; name?: string; disabled?: boolean } = {}) {
  passwordHash ??= hash(PASSWORD, { memoryCost: 19456, timeCost: 2, parallelism: 1 });
  const email = overrides.email ?? `${role}-${unique()}@example.test`;
  const person = await createPerson(testDb(), { organizationId, email, name: overrides.name ?? `Test ${role.replace('_', ' ')}`, role, passwordHash: await passwordHash });
  if (overrides.disabled) await testDb().models.User.update({ disabled: true }, { where: { id: person.id } });
  return { ...person, password: PASSWORD };
}

/** An organisation with one person in each role. */
export async function makeTeam() {
  const organizationId = await makeOrganization();
  const [admin, reviewer, lead, apprentice] = await Promise.all([
    makePerson(organizationId, 'admin'),
    makePerson(organizationId, 'reviewer'),
    makePerson(organizationId, 'crew_lead'),
    makePerson(organizationId, 'apprentice'),
  ]);
  return { organizationId, admin, reviewer, lead, apprentice };
}

/** A small valid plan document (a climber on a cluster bar, all phases jumpered), with overrides. */
export function planDocument(overrides: Partial<PlanDocument> = {}): PlanDocument {
  return {
    format: 'bondmap-plan',
    version: 1,
    title: 'Invented test pole',
    system: { nominalKv: 12.47, frequencyHz: 60, faultKa: 10, clearingCycles: 15, xOverR: 10, phaseSpacingM: 0.9 },
    criteria: { bodyKg: 50, bodyOhms: 1000 },
    nodes: [
      { id: 'A', kind: 'phase', phase: 'A' },
      { id: 'B', kind: 'phase', phase: 'B' },
      { id: 'C', kind: 'phase', phase: 'C' },
      { id: 'N', kind: 'neutral', groundOhms: 5 },
      { id: 'CB', kind: 'cluster-bar' },
      { id: 'W1', kind: 'worker', standsOn: 'CB' },
    ],
    links: [
      { id: 'jA', kind: 'jumper', from: 'A', to: 'CB', cable: '2/0', lengthM: 2, spanM: 1.8 },
      { id: 'jB', kind: 'jumper', from: 'B', to: 'CB', cable: '2/0', lengthM: 2, spanM: 1.8 },
      { id: 'jC', kind: 'jumper', from: 'C', to: 'CB', cable: '2/0', lengthM: 2, spanM: 1.8 },
      { id: 'jN', kind: 'jumper', from: 'CB', to: 'N', cable: '2/0', lengthM: 1.5, spanM: 1.2 },
      { id: 'rA', kind: 'reach', from: 'W1', to: 'A' },
    ],
    ...overrides,
  };
}

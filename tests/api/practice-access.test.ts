/** Who may do what in practice: signed out, each role, and another organisation (404, never 403). */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makePerson, makeTeam, PASSWORD } from '../helpers/factories';
import { approvedPlan } from '../helpers/practice';

let clients: Record<'admin' | 'reviewer' | 'lead' | 'apprentice' | 'otherAdmin' | 'otherApprentice', Client>;
let plan: { id: number; revision: number };
let exerciseId: number;
let apprenticeId: string;

beforeAll(async () => {
  const team = await makeTeam();
  const other = await makeTeam();
  apprenticeId = team.apprentice.id;
  const [admin, reviewer, lead, apprentice, otherAdmin, otherApprentice] = await Promise.all([
    signedIn(team.admin.email, PASSWORD),
    signedIn(team.reviewer.email, PASSWORD),
    signedIn(team.lead.email, PASSWORD),
    signedIn(team.apprentice.email, PASSWORD),
    signedIn(other.admin.email, PASSWORD),
    signedIn(other.apprentice.email, PASSWORD),
  ]);
  clients = { admin, reviewer, lead, apprentice, otherAdmin, otherApprentice };
  plan = await approvedPlan(lead, reviewer);
  const made = await reviewer.post('/api/exercises', { planId: plan.id, revision: plan.revision, kind: 'find', prompt: 'Find the gap', removeLinks: ['jB'] });
  exerciseId = made.body.exercise.id;
  await makePerson(other.organizationId, 'apprentice');
});
afterAll(closeTestDb);

const create = () => ({ planId: plan.id, revision: plan.revision, kind: 'find', prompt: 'Find the gap', removeLinks: ['jC'] });
const requests = () => [
  ['GET', '/api/exercises', undefined],
  ['POST', '/api/exercises', create()],
  ['POST', '/api/exercises/propose', { planId: plan.id }],
  ['GET', `/api/exercises/${exerciseId}`, undefined],
  ['POST', `/api/exercises/${exerciseId}/attempts`, { answer: { elements: ['B'] } }],
  ['GET', '/api/exercises/progress', undefined],
  ['GET', '/api/exercises/progress.csv', undefined],
] as const;

// Expected status per role, in the order of requests().
const MATRIX: Record<keyof typeof clients | 'anonymous', number[]> = {
  anonymous: [401, 401, 401, 401, 401, 401, 401],
  admin: [200, 201, 200, 200, 403, 200, 200],
  reviewer: [200, 201, 200, 200, 403, 200, 200],
  lead: [200, 403, 403, 200, 403, 403, 403],
  apprentice: [200, 403, 403, 200, 201, 403, 403],
  otherAdmin: [200, 404, 404, 404, 403, 200, 200],
  otherApprentice: [200, 403, 403, 404, 404, 403, 403],
};

describe('the practice role matrix', () => {
  it.each(Object.keys(MATRIX) as (keyof typeof MATRIX)[])('%s', async (who) => {
    const client = who === 'anonymous' ? new Client() : clients[who];
    const got: number[] = [];
    for (const [method, path, body] of requests()) got.push((await client.request(method, path, body === undefined ? {} : { json: body })).status);
    expect(got).toEqual(MATRIX[who]);
  });

  it('another organisation sees none of our exercises, and its progress holds none of our people', async () => {
    const list = await clients.otherAdmin.get('/api/exercises');
    expect(list.body.items.some((e: { id: number }) => e.id === exerciseId)).toBe(false);
    const progress = await clients.otherAdmin.get('/api/exercises/progress');
    expect(progress.body.apprentices.some((a: { id: string }) => a.id === apprenticeId)).toBe(false);
    expect(progress.body.exercises.some((e: { id: number }) => e.id === exerciseId)).toBe(false);
    expect(progress.body.apprentices.length).toBeGreaterThan(0);
  });
});

/** Publishing is idempotent: publishing a published exercise (or withdrawing a withdrawn one) answers 200, not 404. */
import { afterAll, expect, it } from 'vitest';
import { signedIn } from '../helpers/api';
import { closeTestDb, makeTeam, PASSWORD } from '../helpers/factories';
import { approvedPlan } from '../helpers/practice';

afterAll(closeTestDb);

it('answers 200 to the same publish or withdraw twice, and 404 only for an exercise that is not there', async () => {
  const team = await makeTeam();
  const [lead, reviewer] = await Promise.all([signedIn(team.lead.email, PASSWORD), signedIn(team.reviewer.email, PASSWORD)]);
  const plan = await approvedPlan(lead, reviewer);
  const made = await reviewer.post('/api/exercises', { planId: plan.id, revision: plan.revision, kind: 'find', prompt: 'Find the gap', removeLinks: ['jB'] });
  expect(made.status).toBe(201);
  const id = made.body.exercise.id;
  for (const published of [true, true, false, false]) {
    const answer = await reviewer.patch(`/api/exercises/${id}`, { published });
    expect(answer.status, JSON.stringify(answer.body)).toBe(200);
    expect(answer.body.exercise.published).toBe(published);
  }
  expect((await reviewer.patch('/api/exercises/999999999', { published: true })).status).toBe(404);
});

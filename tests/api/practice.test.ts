/**
 * Practice over real HTTP: exercises made from approved revisions (refused without a gap), the
 * learner's body without the answer, grading of find, fix and numbers, retries with best and latest.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedIn, type Client } from '../helpers/api';
import { closeTestDb, makeTeam, PASSWORD } from '../helpers/factories';
import { approvedPlan, bucketDocument } from '../helpers/practice';

let lead: Client;
let reviewer: Client;
let apprentice: Client;
let plan: { id: number; revision: number };
let apprenticeId: string;

beforeAll(async () => {
  const team = await makeTeam();
  apprenticeId = team.apprentice.id;
  [lead, reviewer, apprentice] = await Promise.all([signedIn(team.lead.email, PASSWORD), signedIn(team.reviewer.email, PASSWORD), signedIn(team.apprentice.email, PASSWORD)]);
  plan = await approvedPlan(lead, reviewer);
});
afterAll(closeTestDb);

async function make(body: Record<string, unknown>) {
  const response = await reviewer.post('/api/exercises', { planId: plan.id, revision: plan.revision, kind: 'find', prompt: 'Mark every element that is unsafe or outside the zone.', teachingNote: 'Every phase in reach gets its own jumper.', ...body });
  expect(response.status, response.text).toBe(201);
  return response.body.exercise;
}

describe('making an exercise', () => {
  it('refuses a change that leaves no blocker (409 EXERCISE_NO_GAP) and a reach line or unknown id (400 by path)', async () => {
    const doc = bucketDocument();
    const spare = await approvedPlan(lead, reviewer, { ...doc, links: [...doc.links, { id: 'jN2', kind: 'jumper', from: 'CB', to: 'N', cable: '2/0', lengthM: 1.5, spanM: 1.2 }] });
    const noGap = await reviewer.post('/api/exercises', { planId: spare.id, revision: spare.revision, kind: 'find', prompt: 'Find it', removeLinks: ['jN2'] });
    expect(noGap.status).toBe(409);
    expect(noGap.body.error.code).toBe('EXERCISE_NO_GAP');
    const bad = await reviewer.post('/api/exercises', { planId: plan.id, revision: plan.revision, kind: 'find', prompt: 'Find it', removeLinks: ['rA', 'zz'] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues.map((i: { path: string }) => i.path)).toEqual(['removeLinks[0]', 'removeLinks[1]']);
    const missing = await reviewer.post('/api/exercises', { planId: plan.id, kind: 'guess' });
    expect(missing.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual(['kind', 'prompt', 'revision']);
  });

  it('refuses a revision that is not approved, and leaves the approved original unchanged', async () => {
    const draft = await lead.post('/api/plans', { title: 'Practice draft', document: bucketDocument() });
    const refused = await reviewer.post('/api/exercises', { planId: draft.body.plan.id, revision: 1, kind: 'find', prompt: 'x', removeLinks: ['jB'] });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('REVISION_NOT_APPROVED');
    const before = (await reviewer.get(`/api/plans/${plan.id}/revisions/${plan.revision}`)).body;
    await make({ removeLinks: ['jB'] });
    expect((await reviewer.get(`/api/plans/${plan.id}/revisions/${plan.revision}`)).body).toEqual(before);
  });

  it('proposes removals that each plant a blocker of a different kind', async () => {
    const response = await reviewer.post('/api/exercises/propose', { planId: plan.id });
    expect(response.status).toBe(200);
    const gaps = response.body.proposals.map((p: { gap: string }) => p.gap);
    expect(gaps).toEqual(expect.arrayContaining(['phase-ungrounded', 'bucket-unbonded', 'cable-underrated']));
    expect(new Set(gaps).size).toBe(gaps.length);
    for (const p of response.body.proposals) expect(p.findings.length).toBeGreaterThan(0);
  });
});

describe('what an apprentice receives', () => {
  it('carries no answer: no removed ids, planted findings, original plan, teaching note or gap', async () => {
    const made = await make({ removeLinks: ['jB'] });
    const response = await apprentice.get(`/api/exercises/${made.id}`);
    expect(response.status).toBe(200);
    const body = response.body.exercise;
    expect(Object.keys(body).sort()).toEqual(['createdAt', 'document', 'id', 'kind', 'mine', 'prompt']);
    const text = response.text;
    for (const secret of ['jB', 'planted', 'planId', 'revision', 'modifications', 'answerElements', 'linkIds', 'teachingNote', 'phase-ungrounded']) expect(text).not.toContain(secret);
    // The remaining link ids run L1…Ln without a hole, and none of the original ids is left.
    const ids = body.document.links.map((l: { id: string }) => l.id);
    expect(ids).toEqual(ids.map((_: string, i: number) => `L${i + 1}`));
    expect(body.document.title).toBe('Practice plan');
    // The reviewer sees the key.
    const full = (await reviewer.get(`/api/exercises/${made.id}`)).body.exercise;
    expect(full.modifications.removeLinks).toEqual(['jB']);
    expect(full.answerElements).toContain('B');
    // The list for an apprentice carries no answer either.
    const list = await apprentice.get('/api/exercises');
    expect(list.text).not.toContain('planted');
    expect(list.body.items.some((e: { id: number }) => e.id === made.id)).toBe(true);
  });

  it('hides unpublished exercises from apprentices (404) and lists them for reviewers', async () => {
    const made = await make({ removeLinks: ['jC'], published: false });
    expect((await apprentice.get(`/api/exercises/${made.id}`)).status).toBe(404);
    expect((await apprentice.get('/api/exercises')).body.items.some((e: { id: number }) => e.id === made.id)).toBe(false);
    expect((await reviewer.get('/api/exercises')).body.items.some((e: { id: number }) => e.id === made.id)).toBe(true);
    expect((await reviewer.patch(`/api/exercises/${made.id}`, { published: true })).status).toBe(200);
    expect((await apprentice.get(`/api/exercises/${made.id}`)).status).toBe(200);
  });
});

describe('grading', () => {
  it('find: perfect, partial and wrong answers, with the checker\'s sentences and the original linked', async () => {
    const made = await make({ removeLinks: ['jB'] });
    const key: string[] = made.answerElements;
    const perfect = await apprentice.post(`/api/exercises/${made.id}/attempts`, { answer: { elements: key } });
    expect(perfect.status).toBe(201);
    expect(perfect.body).toMatchObject({ score: 100, passed: true, found: key, missed: [], wrong: [] });
    expect(perfect.body.explanation.gaps.map((g: { rule: string }) => g.rule)).toContain('phase-ungrounded');
    expect(perfect.body.explanation.gaps.every((g: { message: string; basis: string }) => g.message.length > 10 && g.basis.length > 3)).toBe(true);
    expect(perfect.body.explanation.original).toEqual({ planId: plan.id, revision: plan.revision, title: expect.any(String), href: `/library/${plan.id}` });
    const partial = await apprentice.post(`/api/exercises/${made.id}/attempts`, { answer: { elements: [key[0]] } });
    expect(partial.body).toMatchObject({ found: [key[0]], missed: key.slice(1), wrong: [] });
    expect(partial.body.score).toBe(Math.round(100 / key.length));
    const wrong = await apprentice.post(`/api/exercises/${made.id}/attempts`, { answer: { elements: ['A', 'C'] } });
    expect(wrong.body).toMatchObject({ score: 0, found: [], wrong: ['A', 'C'] });
    // Retries are kept; best and latest count separately.
    expect(wrong.body.mine).toEqual({ attempts: 3, best: 100, latest: 0 });
    const unknown = await apprentice.post(`/api/exercises/${made.id}/attempts`, { answer: { elements: ['jB'] } });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.issues).toEqual([{ path: 'answer.elements[0]', message: 'no element "jB" on this drawing' }]);
    expect((await apprentice.post(`/api/exercises/${made.id}/attempts`, { answer: { elements: 'B' } })).body.error.issues[0].path).toBe('answer.elements');
  });

  it('fix: the jumper put back passes; a fix that removes the gap but adds another blocker fails', async () => {
    const made = await make({ kind: 'fix', removeLinks: ['jBK'] });
    const given = (await apprentice.get(`/api/exercises/${made.id}`)).body.exercise.document;
    const withJumper = (cable: string) => ({ ...given, links: [...given.links, { id: 'fix1', kind: 'jumper', from: 'BK', to: 'CB', cable, lengthM: 2.5, spanM: 2 }] });
    const good = await apprentice.post(`/api/exercises/${made.id}/attempts`, { answer: { document: withJumper('2/0') } });
    expect(good.body).toMatchObject({ score: 100, passed: true, missed: [], wrong: [] });
    const worse = await apprentice.post(`/api/exercises/${made.id}/attempts`, { answer: { document: withJumper('4') } });
    expect(worse.body.passed).toBe(false);
    expect(worse.body.missed).toEqual([]);
    expect(worse.body.wrong.map((f: { rule: string }) => f.rule)).toContain('cable-below-minimum');
    expect(worse.body.mine).toEqual({ attempts: 2, best: 100, latest: worse.body.score });
    const broken = await apprentice.post(`/api/exercises/${made.id}/attempts`, { answer: { document: { ...given, nodes: 'x' } } });
    expect(broken.status).toBe(400);
    expect(broken.body.error.issues[0].path).toMatch(/^answer\.document/);
  });

  it('numbers: four choices, the checker\'s figure is the one that scores', async () => {
    const made = await make({ kind: 'numbers', changeLinks: [{ id: 'jA', cable: '4' }], prompt: 'What is this jumper rated for?' });
    const seen = (await apprentice.get(`/api/exercises/${made.id}`)).body.exercise;
    expect(seen.question.choices).toHaveLength(4);
    expect(JSON.stringify(seen)).not.toContain('correctIndex');
    const right = made.numbers.correctIndex as number;
    expect((await apprentice.post(`/api/exercises/${made.id}/attempts`, { answer: { choice: (right + 1) % 4 } })).body.score).toBe(0);
    const ok = await apprentice.post(`/api/exercises/${made.id}/attempts`, { answer: { choice: right } });
    expect(ok.body).toMatchObject({ score: 100, explanation: { numbers: { correctIndex: right } } });
    expect((await apprentice.post(`/api/exercises/${made.id}/attempts`, { answer: { choice: 7 } })).body.error.issues[0].path).toBe('answer.choice');
  });
});

describe('progress', () => {
  it('counts attempts, best and latest per apprentice and exercise, and exports CSV', async () => {
    const made = await make({ removeLinks: ['jB'], prompt: 'Progress, "quoted", =SUM(1)' });
    await apprentice.post(`/api/exercises/${made.id}/attempts`, { answer: { elements: made.answerElements } });
    await apprentice.post(`/api/exercises/${made.id}/attempts`, { answer: { elements: ['A'] } });
    const response = await reviewer.get('/api/exercises/progress');
    expect(response.status).toBe(200);
    const cell = response.body.cells.find((c: { exerciseId: number; apprenticeId: string }) => c.exerciseId === made.id && c.apprenticeId === apprenticeId);
    expect(cell).toMatchObject({ attempts: 2, best: 100, latest: 0 });
    expect(response.body.apprentices.map((a: { id: string }) => a.id)).toContain(apprenticeId);
    const csv = await reviewer.get('/api/exercises/progress.csv');
    expect(csv.headers.get('content-type')).toMatch(/^text\/csv/);
    const line = csv.text.split('\r\n').find((l) => l.includes(`#${made.id} `))!;
    expect(line).toContain(',2,100,0,');
    expect(line).toContain('"#' + made.id + ' Progress, ""quoted"", =SUM(1)"');
  });
});

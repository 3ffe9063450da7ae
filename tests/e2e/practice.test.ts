/**
 * Practice in Chromium on a tablet: a reviewer makes a find exercise from a demo plan, an
 * apprentice finds the gap by tapping the drawing and reads the explanation, and the reviewer
 * sees the attempt in the progress table.
 */
import { expect, it } from 'vitest';
import { BASE_URL } from '../helpers/api';
import { useBrowser } from '../helpers/e2e';

const browser = useBrowser();
// A 10-inch tablet held in landscape, touch only.
const TABLET = { viewport: { width: 1180, height: 820 }, hasTouch: true, isMobile: true, deviceScaleFactor: 2 };

it('a reviewer makes an exercise, an apprentice finds the gap by tapping, the reviewer sees the attempt', async () => {
  const stamp = `Tablet practice ${Date.now()}`;
  const prompt = `${stamp}: mark what is outside the zone.`;
  const { page: reviewer } = await browser.signIn('reviewer@demo.test', TABLET);
  await reviewer.goto(`${BASE_URL}/practice/new`);
  await reviewer.getByLabel('Approved plan').selectOption({ label: 'Pole 14 on Wren Hollow Road, bucket work (revision 1)' });
  await reviewer.getByRole('button', { name: 'Use this plan' }).tap();
  await reviewer.getByTestId('exercise-form').waitFor();
  await reviewer.getByLabel(/Remove jumper 2\/0 Phase B – Cluster bar/).tap();
  await reviewer.getByLabel('Prompt').fill(prompt);
  await reviewer.getByRole('button', { name: 'Make the exercise' }).tap();
  await reviewer.waitForURL(/\/practice\/\d+$/);
  const id = Number(new URL(reviewer.url()).pathname.split('/').pop());
  const key = (await (await reviewer.request.get(`${BASE_URL}/api/exercises/${id}`)).json()).exercise.answerElements as string[];
  expect(key).toContain('B');

  const { page: apprentice } = await browser.signIn('apprentice@demo.test', TABLET);
  await apprentice.goto(`${BASE_URL}/practice`);
  await apprentice.getByTestId('learner-practice').getByRole('link', { name: new RegExp(stamp) }).tap();
  await apprentice.waitForURL(`${BASE_URL}/practice/${id}`);
  const canvas = apprentice.getByTestId('practice-canvas');
  await canvas.locator('.react-flow__node[data-id="B"]').waitFor();
  for (const [i, element] of key.entries()) {
    const onCanvas = canvas.locator(`.react-flow__node[data-id="${element}"]`);
    if (await onCanvas.count()) await onCanvas.tap();
    else await apprentice.getByTestId(`mark-${element}`).tap();
    await expect.poll(() => apprentice.getByTestId('marked-count').textContent()).toBe(`${i + 1} marked`);
  }
  // Every tap target in the element list is at least 44 px high.
  const box = await apprentice.getByTestId('mark-B').boundingBox();
  expect(box!.height).toBeGreaterThanOrEqual(44);
  await apprentice.getByRole('button', { name: 'Check my marks' }).tap();
  const result = apprentice.getByTestId('attempt-result');
  await result.waitFor();
  expect(await apprentice.getByTestId('score').textContent()).toBe('100');
  const explanation = await apprentice.getByTestId('explanation').textContent();
  expect(explanation).toMatch(/Phase B/);
  expect(explanation).toContain('Basis:');
  expect(await apprentice.getByRole('link', { name: /See the approved original/ }).getAttribute('href')).toMatch(/^\/library\/\d+$/);

  await reviewer.goto(`${BASE_URL}/practice/progress`);
  const row = reviewer.getByTestId('progress-table').locator('tr', { hasText: 'Junie Halvorsen-Mbeki' });
  expect(await row.locator(`td[data-exercise="${id}"]`).textContent()).toMatch(/1× · best 100 · latest 100/);
});

/**
 * The editor on a touch tablet (1024×768, touch only): a three-phase plan drawn from an empty
 * canvas with taps alone ends with exactly the links that were drawn, tapping the blank
 * inside of a symbol selects it, and the side panels fold away for the drawing.
 */
import type { Page } from 'playwright-core';
import { expect, it } from 'vitest';
import { BASE_URL } from '../helpers/api';
import { useBrowser } from '../helpers/e2e';
import { waitForSteady } from '../helpers/wait';

const browser = useBrowser();
const TABLET = { viewport: { width: 1024, height: 768 }, hasTouch: true, isMobile: false };

const node = (page: Page, id: string) => page.locator(`.react-flow__node[data-id="${id}"]`);
const linkIds = (page: Page) => page.locator('[data-testid^="link-"]').evaluateAll((els) => els.map((e) => e.getAttribute('data-testid')!.slice(5)).sort());

/** Taps a symbol at a fraction of its width (0.5: the blank middle; 0.9: near its link nub). */
async function tapNode(page: Page, id: string, across = 0.5) {
  const box = (await node(page, id).locator('.bm-glyph-box').boundingBox({ timeout: 5000 }))!;
  await page.touchscreen.tap(box.x + box.width * across, box.y + box.height / 2);
}

it('draws a three-phase plan with taps alone and gets exactly the links it drew', async () => {
  const { page } = await browser.signIn('lead@demo.test', TABLET);
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto(`${BASE_URL}/plans/new`);
  await page.getByLabel('Title').fill(`Touch ${Date.now()}`);
  await page.getByRole('button', { name: 'Create plan' }).tap();
  await page.waitForURL(/\/plans\/\d+$/);
  await page.getByTestId('editor').waitFor();

  for (const kind of ['phase', 'phase', 'phase', 'cluster bar', 'neutral']) await page.getByRole('button', { name: `Add ${kind}` }).tap();
  await expect.poll(() => page.locator('.react-flow__node').count()).toBe(5);
  // On a tablet the findings drawer starts folded to a strip so the drawing gets the room.
  expect(await page.getByTestId('drawer').getByRole('button', { name: 'Show' }).count()).toBe(1);
  await page.getByRole('button', { name: 'Fit', exact: true }).tap();
  await waitForSteady(() => page.locator('.react-flow__viewport').getAttribute('style'), { what: 'the drawing to be fitted' });

  await page.getByRole('button', { name: 'Jumper', exact: true }).tap();
  for (const [from, to] of [['A', 'CB'], ['B', 'CB'], ['C', 'CB'], ['CB', 'N1']]) {
    await tapNode(page, from);
    await tapNode(page, to, 0.9);
  }
  await expect.poll(() => linkIds(page)).toEqual(['j1', 'j2', 'j3', 'j4']);
  // No late second link from one tap: the list stays as it is.
  expect(await waitForSteady(() => linkIds(page), { quiet: 500, what: 'the links to stop changing' })).toEqual(['j1', 'j2', 'j3', 'j4']);

  // A second identical jumper is refused unless a parallel lead is asked for.
  await tapNode(page, 'A');
  await tapNode(page, 'CB');
  await expect.poll(() => page.getByTestId('editor-message').textContent()).toMatch(/already joined/i);
  expect(await linkIds(page)).toEqual(['j1', 'j2', 'j3', 'j4']);

  // Tapping the blank middle of a symbol selects it (tool put away first).
  await page.getByRole('button', { name: 'Jumper', exact: true }).tap();
  await tapNode(page, 'N1');
  await expect.poll(() => node(page, 'N1').getAttribute('class')).toMatch(/\bselected\b/);
  const box = (await node(page, 'N1').locator('.bm-glyph-box').boundingBox({ timeout: 5000 }))!;
  expect(Math.min(box.width, box.height)).toBeGreaterThanOrEqual(44);

  // The side panels fold away and give their room to the drawing.
  const before = (await page.locator('.react-flow').first().boundingBox())!.width;
  await page.getByRole('button', { name: 'Fold tools' }).tap();
  await page.getByRole('button', { name: 'Fold details' }).tap();
  await expect.poll(async () => (await page.locator('.react-flow').first().boundingBox())!.width).toBeGreaterThan(before + 300);
  expect(await page.getByRole('button', { name: 'Add phase' }).isVisible()).toBe(false);
  await page.getByRole('button', { name: 'Tools', exact: true }).tap();
  await page.getByRole('button', { name: 'Add phase' }).waitFor();
  expect(errors).toEqual([]);
});

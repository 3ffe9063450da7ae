/**
 * A reviewer on a 1024×768 touch tablet: labels stay legible when the drawing is zoomed out,
 * comment markers have a finger-sized target, and tapping an element (or its marker) fills
 * "Pin to" in the comment form.
 */
import type { Page } from 'playwright-core';
import { expect, it } from 'vitest';
import { BASE_URL } from '../helpers/api';
import { useBrowser } from '../helpers/e2e';
import { waitForSteady } from '../helpers/wait';

const browser = useBrowser();
const TABLET = { viewport: { width: 1024, height: 768 }, hasTouch: true };
const TITLE = 'Pole 31 at Millrace Crossing, climber';
const node = (page: Page, id: string) => page.locator(`.react-flow__node[data-id="${id}"]`);
const pinTo = (page: Page) => page.locator('#elementId').inputValue();
const zoomOf = (page: Page) => page.locator('.react-flow__viewport').evaluate((el) => new DOMMatrix(getComputedStyle(el).transform).a);

async function zoomOut(page: Page) {
  await page.getByRole('button', { name: 'Fit', exact: true }).click();
  for (let i = 0; i < 4; i++) await page.locator('.react-flow__controls-zoomout').click();
  await waitForSteady(() => zoomOf(page), { what: 'the zoom to settle' });
}

it('keeps labels legible and markers tappable on a tablet, and a tap fills "Pin to"', async () => {
  const { page } = await browser.signIn('reviewer@demo.test', TABLET);
  await page.goto(`${BASE_URL}/review`);
  await page.getByTestId('review-queue').getByRole('link', { name: TITLE }).click();
  await page.waitForURL(/\/review$/);
  await node(page, 'CB').waitFor();

  await node(page, 'CB').tap();
  await expect.poll(() => pinTo(page)).toBe('CB');

  // Far out, every id still renders at 11 px or more on screen, and the second line goes.
  await zoomOut(page);
  const zoom = await zoomOf(page);
  expect(zoom).toBeLessThan(0.55);
  const sizes = await page.locator('.bm-label > span.font-semibold').evaluateAll((els) => els.map((el) => parseFloat(getComputedStyle(el).fontSize)));
  expect(sizes.length).toBeGreaterThan(3);
  for (const px of sizes) expect(px * zoom).toBeGreaterThanOrEqual(10.9);
  expect(await page.locator('.bm-label-detail').first().isVisible()).toBe(false);

  // A comment pinned to the worker puts a marker on it: a 44 px target that selects the worker.
  await page.locator('#elementId').selectOption('W1');
  await page.locator('#body').fill(`Where does the climber stand? ${Date.now()}`);
  await page.getByRole('button', { name: 'Add comment' }).click();
  await page.getByTestId('pin-W1').waitFor();
  await zoomOut(page);
  const marker = page.getByTestId('pin-W1').locator('.bm-pin').first();
  const target = await marker.evaluate((el) => parseFloat(getComputedStyle(el, '::after').width));
  expect(target * (await zoomOf(page))).toBeGreaterThanOrEqual(44);
  await page.locator('#elementId').selectOption('');
  await marker.tap();
  await expect.poll(() => pinTo(page)).toBe('W1');
});

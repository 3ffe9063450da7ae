/**
 * The day-of-work pages on a 1024×768 touch tablet: the grounding sets table opens a set with a
 * finger-sized tap, and an apprentice works the demo fix exercise with taps alone (a jumper drawn
 * by tapping two symbols), with Check and Hand in inside the exercise, clear of the caution.
 */
import type { Page } from 'playwright-core';
import { expect, it } from 'vitest';
import { BASE_URL } from '../helpers/api';
import { useBrowser } from '../helpers/e2e';

const browser = useBrowser();
const TABLET = { viewport: { width: 1024, height: 768 }, hasTouch: true, isMobile: false };

/** Taps the middle of a symbol on the practice canvas. */
async function tapNode(page: Page, id: string) {
  const box = (await page.getByTestId('practice-canvas').locator(`.react-flow__node[data-id="${id}"] .bm-glyph-box`).boundingBox({ timeout: 5000 }))!;
  await page.touchscreen.tap(box.x + box.width / 2, box.y + box.height / 2);
}

const overlaps = (a: { x: number; y: number; width: number; height: number }, b: { x: number; y: number; width: number; height: number }) =>
  a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;

it('the grounding sets table opens a set from a 44 px tap target', async () => {
  const { page } = await browser.signIn('lead@demo.test', TABLET);
  await page.goto(`${BASE_URL}/equipment`);
  const link = page.getByRole('link', { name: 'LV-114', exact: true });
  const box = (await link.boundingBox())!;
  expect(box.height, 'height of the tag link').toBeGreaterThanOrEqual(44);
  expect(box.width, 'width of the tag link').toBeGreaterThanOrEqual(44);
  await link.tap();
  await page.waitForURL(/\/equipment\/\d+$/);
  expect(await page.getByRole('heading', { level: 1 }).textContent()).toContain('LV-114');
  const back = (await page.getByRole('link', { name: /Grounding sets/ }).filter({ hasText: '←' }).boundingBox())!;
  expect(back.height, 'height of the way back to the list').toBeGreaterThanOrEqual(44);
});

it('an apprentice fixes the demo plan with taps and hands it in; the buttons stay clear of the caution', async () => {
  const { page } = await browser.signIn('apprentice@demo.test', TABLET);
  await page.goto(`${BASE_URL}/practice`);
  await page.getByRole('link', { name: /Fix this plan on your copy so the lineworker in the bucket/ }).first().tap();
  await page.waitForURL(/\/practice\/\d+$/);
  await page.getByTestId('practice-canvas').locator('.react-flow__node[data-id="BK"]').waitFor();

  const handIn = page.getByRole('button', { name: 'Hand in' });
  const check = page.getByRole('button', { name: 'Check my copy' });
  const caution = page.getByRole('note').filter({ hasText: 'Caution.' });
  for (const button of [handIn, check]) {
    const box = (await button.boundingBox())!;
    expect(box.height).toBeGreaterThanOrEqual(44);
    expect(overlaps(box, (await caution.boundingBox())!), 'a button drawn over the caution').toBe(false);
    // Inside the exercise's own box, not spilling out of it.
    const exercise = (await page.getByTestId('practice-exercise').boundingBox())!;
    expect(box.y + box.height, 'the button ends inside the exercise').toBeLessThanOrEqual(exercise.y + exercise.height + 1);
  }

  // A jumper from the bucket to the cluster bar, by tapping the tool and then the two symbols.
  const links = () => page.getByTestId('practice-canvas').locator('[data-testid^="link-"]').count();
  const before = await links();
  await page.getByRole('button', { name: 'Jumper', exact: true }).tap();
  await tapNode(page, 'BK');
  await tapNode(page, 'CB');
  await expect.poll(links).toBe(before + 1);

  await handIn.scrollIntoViewIfNeeded();
  await handIn.tap();
  await page.getByTestId('attempt-result').waitFor();
  expect(await page.getByTestId('score').textContent()).toBe('100');
  expect(await smallTargets(page, '[data-testid="attempt-result"]')).toEqual([]);
});

it('every control of an open field record is a 44 px target on the tablet', async () => {
  const { page } = await browser.signIn('lead@demo.test', TABLET);
  await page.goto(`${BASE_URL}/records?status=open`);
  await page.getByTestId('record-table').getByRole('link').first().tap();
  await page.waitForURL(/\/records\/\d+$/);
  await page.getByTestId('next-step').waitFor();
  // Photos load lazily: bring them in so a link around a thumbnail is measured at its size.
  await page.evaluate(() => window.scrollTo(0, document.body.scrollHeight));
  await expect.poll(() => page.locator('main img').evaluateAll((imgs) => imgs.every((i) => (i as HTMLImageElement).complete && (i as HTMLImageElement).naturalWidth > 0))).toBe(true);
  const small = await page.locator('main').evaluate((main) =>
    [...main.querySelectorAll<HTMLElement>('a, button, summary, select, textarea, input:not([type=checkbox]):not([type=radio])')]
      .map((e) => ({ name: (e.textContent || e.getAttribute('aria-label') || e.getAttribute('name') || e.tagName).trim().slice(0, 40), box: e.getBoundingClientRect() }))
      .filter(({ box }) => box.width > 0 && box.height > 0 && (box.height < 44 || box.width < 44))
      .map(({ name, box }) => `${name} ${Math.round(box.width)}x${Math.round(box.height)}`));
  expect(small).toEqual([]);
});

it('the field drawing keeps showing the sets that are on when a finger taps it', async () => {
  const { page } = await browser.signIn('lead@demo.test', TABLET);
  await page.goto(`${BASE_URL}/records?status=open`);
  await page.getByTestId('record-table').getByRole('link').first().tap();
  await page.waitForURL(/\/records\/\d+$/);
  const drawing = page.getByTestId('field-drawing');
  await drawing.locator('.react-flow__node').first().waitFor();
  const on = (await drawing.getAttribute('data-on'))!.split(',').filter(Boolean).sort();
  expect(on.length).toBeGreaterThan(0);
  const shownOn = () => drawing.locator('.react-flow__edge.selected [data-testid^="link-"]').evaluateAll((els) => els.map((e) => e.getAttribute('data-testid')!.slice(5)).sort());
  await expect.poll(shownOn).toEqual(on);
  // A tap on a symbol, then on a jumper that has no set on: the drawing still shows what is on.
  await drawing.scrollIntoViewIfNeeded();
  const symbol = (await drawing.locator('.react-flow__node[data-id="CB"] .bm-glyph-box').boundingBox())!;
  await page.touchscreen.tap(symbol.x + symbol.width / 2, symbol.y + symbol.height / 2);
  const off = drawing.locator('.react-flow__edge:not(.selected)').first();
  const offBox = (await off.locator('text').first().boundingBox()) ?? (await off.boundingBox())!;
  await page.touchscreen.tap(offBox.x + offBox.width / 2, offBox.y + offBox.height / 2);
  await page.waitForTimeout(300);
  expect(await shownOn()).toEqual(on);
});

/** Links and controls in `scope` smaller than 44 px either way, as "name WxH". */
const smallTargets = (page: Page, scope: string) =>
  page.locator(scope).first().evaluate((root) =>
    [...root.querySelectorAll<HTMLElement>('a, button, summary, select, textarea, input:not([type=checkbox]):not([type=radio]):not([type=hidden])')]
      .map((e) => ({ name: (e.textContent || e.getAttribute('aria-label') || e.tagName).trim().slice(0, 40), box: e.getBoundingClientRect() }))
      .filter(({ box }) => box.width > 0 && box.height > 0 && (box.height < 44 || box.width < 44))
      .map(({ name, box }) => `${name} ${Math.round(box.width)}x${Math.round(box.height)}`));

it('the sets-due card, the test settings and the practice progress table are worked with 44 px targets', async () => {
  const { page: admin } = await browser.signIn('admin@demo.test', TABLET);
  await admin.goto(`${BASE_URL}/`);
  expect(await smallTargets(admin, '[data-testid="sets-due"]')).toEqual([]);
  await admin.goto(`${BASE_URL}/equipment/settings`);
  expect(await smallTargets(admin, 'main')).toEqual([]);
  const { page: reviewer } = await browser.signIn('reviewer@demo.test', TABLET);
  await reviewer.goto(`${BASE_URL}/practice/progress`);
  expect(await smallTargets(reviewer, 'main')).toEqual([]);
});

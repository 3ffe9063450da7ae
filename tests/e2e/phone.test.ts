/**
 * On a 390×844 phone the plan and library pages show the drawing (visible and pannable) and the
 * page is never wider than the screen.
 */
import type { Page } from 'playwright-core';
import { expect, it } from 'vitest';
import { BASE_URL } from '../helpers/api';
import { useBrowser } from '../helpers/e2e';
import { waitForSteady } from '../helpers/wait';

const browser = useBrowser();
const PHONE = { viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true };

async function expectDrawingFits(page: Page, name: string) {
  await page.locator('.react-flow__node').first().waitFor({ state: 'attached' });
  await waitForSteady(() => page.locator('.react-flow__viewport').getAttribute('style'), { what: 'the drawing to be fitted' });
  await page.screenshot({ path: `artifacts/phone-${name}.png` });
  const widths = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, client: document.documentElement.clientWidth }));
  expect(widths.scroll, `${name}: the page scrolls sideways`).toBeLessThanOrEqual(widths.client);
  const box = (await page.locator('.react-flow').first().boundingBox())!;
  expect(box.width, `${name}: drawing width`).toBeGreaterThanOrEqual(300);
  expect(box.height, `${name}: drawing height`).toBeGreaterThanOrEqual(250);
  // At least one symbol is inside the drawing's box on screen.
  const inside = await page.locator('.react-flow__node').evaluateAll((els, b) => els.some((el) => {
    const r = el.getBoundingClientRect();
    return r.right > b.x && r.left < b.x + b.width && r.bottom > b.y && r.top < b.y + b.height && r.width > 0;
  }), box);
  expect(inside, `${name}: a symbol is visible`).toBe(true);
}

it('the plan and library pages show the drawing on a phone with no sideways scroll', async () => {
  const { page } = await browser.signIn('lead@demo.test', PHONE);
  // A demo plan with a drawing (other tests leave plans of every shape in the list, empty ones too).
  await page.goto(`${BASE_URL}/plans?q=${encodeURIComponent('Pole 14 on Wren Hollow Road')}`);
  const href = await page.locator('a[href^="/plans/"]').evaluateAll((as) => as.map((a) => a.getAttribute('href')).find((h) => /^\/plans\/\d+$/.test(h ?? '')));
  expect(href).toBeTruthy();
  await page.goto(`${BASE_URL}${href}`);
  await expectDrawingFits(page, 'plan');

  await page.goto(`${BASE_URL}/library`);
  const entry = await page.locator('a[href^="/library/"]').first().getAttribute('href');
  await page.goto(`${BASE_URL}${entry}`);
  await expectDrawingFits(page, 'library');
});

it('home cards never wrap a plan title one word per line', async () => {
  const { page } = await browser.signIn('admin@demo.test', { viewport: { width: 820, height: 1000 } });
  await page.goto(`${BASE_URL}/`);
  const titles = page.getByTestId('plan-title');
  expect(await titles.count()).toBeGreaterThan(0);
  // Every title box is at least 14 rem wide (or the whole row), so words sit side by side.
  const widths = await titles.evaluateAll((els) => els.map((el) => el.getBoundingClientRect().width));
  for (const w of widths) expect(w).toBeGreaterThanOrEqual(200);
});

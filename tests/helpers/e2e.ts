/**
 * Browser sessions for the flows in tests/e2e: one Chromium per test file (launched before, closed
 * after), and a fresh context per signed-in person so their cookies never mix.
 */
import type { Browser, BrowserContext, BrowserContextOptions, Page } from 'playwright-core';
import { afterAll, beforeAll, expect } from 'vitest';
import { BASE_URL } from './api';
import { launchBrowser } from './browser';

export const DEMO_PASSWORD = 'bondmap-demo';

export function useBrowser() {
  let browser: Browser;
  const contexts: BrowserContext[] = [];
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    for (const c of contexts) await c.close();
    await browser?.close();
  });
  return {
    /** Signs a person in (a demo one unless `password` is given) through the sign-in form and returns their page (options: a tablet viewport, touch). */
    async signIn(email: string, options: BrowserContextOptions = {}, password = DEMO_PASSWORD): Promise<{ context: BrowserContext; page: Page }> {
      const context = await browser.newContext({ viewport: { width: 1366, height: 900 }, acceptDownloads: true, ...options });
      contexts.push(context);
      const page = await context.newPage();
      await page.goto(`${BASE_URL}/login`);
      await page.getByLabel('E-mail').fill(email);
      await page.getByLabel('Password').fill(password);
      await (options.hasTouch ? page.getByRole('button', { name: 'Sign in' }).tap() : page.getByRole('button', { name: 'Sign in' }).click());
      await page.waitForURL((url) => url.pathname !== '/login');
      return { context, page };
    },
  };
}

/** Fills the new-plan form's fault data (invented example values): a new plan starts without it. */
export async function fillFaultData(page: Page, values = { faultKa: '10', clearingCycles: '15', xOverR: '10' }): Promise<void> {
  await page.getByLabel('Available fault current (kA)').fill(values.faultKa);
  await page.getByLabel('Clearing time (cycles)').fill(values.clearingCycles);
  await page.getByLabel('X/R ratio').fill(values.xOverR);
}

/** The heading of the field record's next step (null until the island has drawn it). */
export const nextStepHeading = (page: Page) => page.getByTestId('next-step').getByRole('heading').textContent();

/**
 * Opens a new field record on the approved demo plan from the plans list and waits for its first
 * step. The plan page's editor island lays itself out after load and shifts what is below it, so
 * the button is pressed from the keyboard rather than at a point that may move.
 */
export async function startRecordOnDemoPlan(page: Page): Promise<void> {
  await page.goto(`${BASE_URL}/plans?status=approved`);
  await page.getByRole('link', { name: 'Pole 14 on Wren Hollow Road, bucket work' }).first().click();
  await page.getByTestId('editor').waitFor();
  await page.getByRole('button', { name: 'Start field record' }).focus();
  await page.keyboard.press('Enter');
  await page.waitForURL(/\/records\/\d+$/);
  await expect.poll(() => nextStepHeading(page)).toBe('Sign on the crew');
}

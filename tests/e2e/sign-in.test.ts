import { mkdirSync } from 'node:fs';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { BASE_URL } from '../helpers/api';
import { launchBrowser } from '../helpers/browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => browser?.close());

it('a crew lead signs in, sees the plans table and signs out', async () => {
  const page = await browser.newPage({ viewport: { width: 1024, height: 768 } });
  await page.goto(`${BASE_URL}/plans`);
  expect(new URL(page.url()).pathname).toBe('/login');

  await page.getByLabel('E-mail').fill('lead@demo.test');
  await page.getByLabel('Password').fill('not the password');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect.poll(() => page.getByTestId('login-error').textContent()).toContain('do not match');

  await page.getByLabel('Password').fill('bondmap-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(`${BASE_URL}/plans`);
  const table = page.getByTestId('plans-table');
  await expect.poll(() => table.locator('tbody tr').count()).toBeGreaterThanOrEqual(4);
  expect(await table.textContent()).toContain('Pole 14 on Wren Hollow Road, bucket work');
  expect(await page.getByRole('navigation', { name: 'Main' }).textContent()).not.toContain('People');
  mkdirSync('artifacts', { recursive: true });
  await page.screenshot({ path: 'artifacts/plans-table.png', fullPage: true });

  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.waitForURL(`${BASE_URL}/login`);
  await page.goto(`${BASE_URL}/plans`);
  expect(new URL(page.url()).pathname).toBe('/login');
});

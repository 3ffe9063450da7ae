/**
 * Grounding sets in Chromium: an admin imports an inventory on /equipment; a crew lead takes a set
 * for a jumper in the editor and sees the check change when the set is overdue for its test.
 */
import type { Page } from 'playwright-core';
import { expect, it } from 'vitest';
import { BASE_URL } from '../helpers/api';
import { fillFaultData, useBrowser } from '../helpers/e2e';
import { CSV_HEADER, monthsAgo } from '../helpers/equipment';

const browser = useBrowser();
const stamp = Date.now().toString(36).toUpperCase();
const GOOD = `E2E-${stamp}-GOOD`;
const OLD = `E2E-${stamp}-OLD`;
const finding = (page: Page, rule: string) => page.getByTestId('drawer').locator(`[data-testid="findings"] li[data-rule="${rule}"]`);

async function takeSet(page: Page, tag: string) {
  const picker = page.getByTestId('set-picker');
  await picker.getByRole('button', { name: /Take a set|Change set/ }).click();
  await picker.getByLabel('Search in-service sets by tag').fill(tag);
  await picker.locator(`button[data-tag="${tag}"]`).click();
  await expect.poll(() => picker.getByTestId('set-taken').textContent()).toContain(tag);
}

/** Every finding shown, as "severity:rule" (the tangent starter's three separate phase leads get the lead-whip note). */
const shownFindings = (page: Page) =>
  page.getByTestId('drawer').locator('[data-testid="findings"] li').evaluateAll((items) => items.map((li) => `${li.getAttribute('data-severity')}:${li.getAttribute('data-rule')}`).join(' '));
const ONLY_WHIP_NOTE = 'note:lead-whip';

it('an admin imports sets; a crew lead takes one for a jumper and the check flags the overdue one', async () => {
  const admin = await browser.signIn('admin@demo.test');
  await admin.page.goto(`${BASE_URL}/equipment`);
  const csv = [CSV_HEADER, `${GOOD},In date,2/0,3,grounding,27,15,ferrule,${monthsAgo(30)},in-service,,${monthsAgo(2)}`, `${OLD},Past its test,2/0,3,grounding,27,15,ferrule,${monthsAgo(30)},in-service,,${monthsAgo(14)}`].join('\n');
  await admin.page.getByTestId('import-file').setInputFiles({ name: 'sets.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
  await admin.page.getByRole('button', { name: 'Import' }).click();
  await admin.page.getByTestId('import-done').waitFor();
  await admin.page.goto(`${BASE_URL}/equipment?q=${stamp}`);
  expect(await admin.page.locator(`tr[data-tag="${OLD}"] [data-due="overdue"]`).textContent()).toContain('Overdue');

  const { page } = await browser.signIn('lead@demo.test');
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto(`${BASE_URL}/plans/new`);
  await fillFaultData(page);
  await page.getByLabel('Title').fill(`Sets flow ${stamp}`);
  await page.getByLabel(/Tangent pole, bucket work/).check();
  await page.getByRole('button', { name: 'Create plan' }).click();
  await page.waitForURL(/\/plans\/\d+$/);
  await expect.poll(() => shownFindings(page), { timeout: 10000 }).toBe(ONLY_WHIP_NOTE);

  await page.getByRole('tab', { name: 'Jumpers' }).click();
  await page.getByRole('tabpanel').getByRole('cell', { name: 'jA', exact: true }).click();
  await page.getByRole('tab', { name: /Findings/ }).click();
  await takeSet(page, GOOD);
  await expect.poll(() => shownFindings(page), { timeout: 10000 }).toBe(ONLY_WHIP_NOTE);

  await takeSet(page, OLD);
  await expect.poll(() => finding(page, 'set-test-overdue').count(), { timeout: 10000 }).toBe(1);
  expect(await finding(page, 'set-test-overdue').getAttribute('data-severity')).toBe('warning');
  expect(await finding(page, 'set-test-overdue').textContent()).toContain(OLD);
  expect(errors).toEqual([]);
});

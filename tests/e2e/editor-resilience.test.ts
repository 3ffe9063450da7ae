/**
 * The editor in Chromium beyond the starter flow: a plan drawn from an empty canvas until the
 * check is clear, and work kept through a lost connection and through a conflicting save.
 */
import type { Page } from 'playwright-core';
import { expect, it } from 'vitest';
import { BASE_URL } from '../helpers/api';
import { fillFaultData, useBrowser } from '../helpers/e2e';

const browser = useBrowser();
const signedInPage = () => browser.signIn('lead@demo.test');


async function newPlan(page: Page, title: string, starter?: RegExp): Promise<string> {
  await page.goto(`${BASE_URL}/plans/new`);
  await fillFaultData(page);
  await page.getByLabel('Title').fill(title);
  if (starter) await page.getByLabel(starter).check();
  await page.getByRole('button', { name: 'Create plan' }).click();
  await page.waitForURL(/\/plans\/\d+$/);
  await page.getByTestId('editor').waitFor();
  return new URL(page.url()).pathname;
}

const node = (page: Page, id: string) => page.locator(`.react-flow__node[data-id="${id}"]`);
const saveState = (page: Page) => page.getByTestId('save-state').getAttribute('data-state');
const findings = (page: Page, severity: string) => page.getByTestId('drawer').locator(`[data-testid="findings"] li[data-severity="${severity}"]`);

async function connect(page: Page, kind: 'Jumper' | 'Reach', from: string, to: string) {
  await page.getByRole('button', { name: kind, exact: true }).click();
  await node(page, from).click();
  await node(page, to).click();
  await page.keyboard.press('Escape');
}

it('draws a climber on a wood pole from an empty canvas until the check is clear', async () => {
  const { page } = await signedInPage();
  await newPlan(page, `From scratch ${Date.now()}`);
  for (const kind of ['phase', 'phase', 'cluster bar', 'neutral', 'structure', 'worker']) {
    await page.getByRole('button', { name: `Add ${kind}` }).click();
  }
  await expect.poll(() => page.locator('.react-flow__node').evaluateAll((els) => els.map((e) => e.getAttribute('data-id')).sort().join(' ')), { timeout: 10000 }).toBe('A B CB N1 S1 W1');

  // Phases are lettered A, B…; a new worker stands on nothing until chosen: the cluster bar here.
  // The worker reaches a phase that is not grounded yet.
  // Before the reach the plan is incomplete (a blocker too), so wait for the check of the reach itself.
  await page.getByTestId('inspector').getByLabel('Stands on').selectOption('CB');
  await page.getByTestId('inspector').getByRole('button', { name: 'Apply' }).click();
  await connect(page, 'Reach', 'W1', 'A');
  const blockerRules = () => findings(page, 'blocker').evaluateAll((items) => items.map((li) => li.getAttribute('data-rule')));
  // The check of the plan with the reach in it: phases still ungrounded, but no longer incomplete.
  await expect.poll(async () => { const rules = await blockerRules(); return rules.includes('phase-ungrounded') && !rules.includes('plan-incomplete'); }, { timeout: 10000 }).toBe(true);

  await connect(page, 'Jumper', 'A', 'CB');
  await connect(page, 'Jumper', 'B', 'CB');
  await connect(page, 'Jumper', 'CB', 'N1');
  await expect.poll(() => findings(page, 'blocker').count(), { timeout: 10000 }).toBe(0);
  expect(await findings(page, 'warning').count()).toBe(0);
  await expect.poll(() => saveState(page), { timeout: 15000 }).toBe('saved');
  await page.reload();
  await node(page, 'W1').waitFor();
  expect(await page.locator('[data-testid^="link-j"]').count()).toBe(3);
});

it('keeps work through a lost connection and resolves a conflicting save', async () => {
  const a = await signedInPage();
  const path = await newPlan(a.page, `Resilience ${Date.now()}`, /Climber on a wood pole/);
  await node(a.page, 'W1').waitFor();
  await expect.poll(() => saveState(a.page), { timeout: 15000 }).toBe('saved');

  // Offline: the change is kept on the device and sent when the connection returns.
  await a.context.setOffline(true);
  await a.page.getByRole('button', { name: 'Add hardware' }).click();
  await node(a.page, 'H1').waitFor();
  await expect.poll(() => saveState(a.page), { timeout: 15000 }).toBe('offline');
  await a.context.setOffline(false);
  await expect.poll(() => saveState(a.page), { timeout: 20000 }).toBe('saved');

  // Someone else saves the same plan; our next save is stale, and we keep ours as a new revision.
  const b = await signedInPage();
  await b.page.goto(`${BASE_URL}${path}`);
  await node(b.page, 'H1').waitFor();
  await b.page.getByRole('button', { name: 'Add mat' }).click();
  await node(b.page, 'M1').waitFor();
  await expect.poll(() => saveState(b.page), { timeout: 15000 }).toBe('saved');

  await a.page.getByRole('button', { name: 'Add ground rod' }).click();
  await node(a.page, 'R1').waitFor();
  const dialog = a.page.getByTestId('conflict-dialog');
  await dialog.waitFor({ timeout: 15000 });
  await dialog.getByRole('button', { name: 'Keep mine as a new revision' }).click();
  await expect.poll(() => saveState(a.page), { timeout: 15000 }).toBe('saved');

  await b.page.reload();
  await node(b.page, 'R1').waitFor();
  expect(await node(b.page, 'H1').count()).toBe(1);
  expect(await b.page.getByTestId('revision').textContent()).toMatch(/Revision [4-9]/);
});

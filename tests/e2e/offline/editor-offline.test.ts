/**
 * The editor without signal: a change made offline is kept on the device (IndexedDB), survives a
 * reload served by the worker, and is saved when the connection returns.
 */
import { expect, it } from 'vitest';
import { BASE_URL } from '../../helpers/api';
import { useBrowser } from '../../helpers/e2e';

const browser = useBrowser();

it('draws offline, reloads, and saves the plan when back online', async () => {
  const { context, page } = await browser.signIn('lead@demo.test');
  await page.goto(`${BASE_URL}/plans/new`);
  await page.getByLabel('Title').fill(`Offline drawing ${Date.now()}`);
  await page.getByLabel(/Climber on a wood pole/).check();
  await page.getByRole('button', { name: 'Create plan' }).click();
  await page.waitForURL(/\/plans\/\d+$/);
  const id = new URL(page.url()).pathname.split('/').pop();
  // What the saves answered, for the failure message: a save that fails here says why.
  const saves: string[] = [];
  page.on('requestfailed', (r) => r.method() === 'PUT' && saves.push(`PUT failed: ${r.failure()?.errorText}`));
  page.on('response', (r) => r.request().method() === 'PUT' && saves.push(`PUT ${r.status()}`));
  const node = (nodeId: string) => page.locator(`.react-flow__node[data-id="${nodeId}"]`);
  const saveState = () => page.getByTestId('save-state').getAttribute('data-state');
  await node('W1').waitFor();
  await expect.poll(saveState, { timeout: 15_000 }).toBe('saved');
  await expect.poll(() => page.evaluate(async () => Boolean(navigator.serviceWorker.controller) && Boolean(await caches.match(location.href))), { timeout: 20_000 }).toBe(true);

  await context.setOffline(true);
  await page.getByRole('button', { name: 'Add hardware' }).click();
  await node('H1').waitFor();
  await expect.poll(saveState, { timeout: 15_000 }).toBe('offline');
  // The copy on the device is in IndexedDB, not localStorage.
  await expect.poll(() => page.evaluate(() => Object.keys(localStorage).filter((k) => k.startsWith('bondmap:draft:')).length)).toBe(0);
  await page.reload();
  await node('H1').waitFor();

  await context.setOffline(false);
  try {
    await expect.poll(saveState, { timeout: 20_000 }).toBe('saved');
  } catch (e) {
    throw new Error(`${(e as Error).message}; the saves: ${saves.join(', ') || 'none'}`);
  }
  const saved = await (await context.request.get(`${BASE_URL}/api/plans/${id}`)).json();
  expect(saved.plan.document.nodes.map((n: { id: string }) => n.id)).toContain('H1');
});

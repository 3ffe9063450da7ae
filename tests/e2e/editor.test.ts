import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { extractText, getDocumentProxy } from 'unpdf';
import { expect, it } from 'vitest';
import { pdfText } from '@/components/editor/export';
import { programNames } from '../helpers/words';
import { BASE_URL } from '../helpers/api';
import { fillFaultData, useBrowser } from '../helpers/e2e';

const browser = useBrowser();

const node = (page: Page, id: string) => page.locator(`.react-flow__node[data-id="${id}"]`);
const saved = (page: Page) => expect.poll(() => page.getByTestId('save-state').getAttribute('data-state'), { timeout: 15000 }).toBe('saved');
const blockers = (page: Page) => page.getByTestId('drawer').locator('[data-testid="findings"] li[data-severity="blocker"]');
/** Every finding shown, as "severity:rule" (the starter's three separate phase leads get the lead-whip note). */
const shownFindings = (page: Page) =>
  page.getByTestId('drawer').locator('[data-testid="findings"] li').evaluateAll((items) => items.map((li) => `${li.getAttribute('data-severity')}:${li.getAttribute('data-rule')}`).join(' '));
const ONLY_WHIP_NOTE = 'note:lead-whip';

it('a crew lead draws from a starter, sees the check follow each change, reloads and exports', async () => {
  const { page } = await browser.signIn('lead@demo.test');
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));

  await page.goto(`${BASE_URL}/plans/new`);
  await fillFaultData(page);
  await page.getByLabel('Title').fill(`Editor flow ${Date.now()}`);
  await page.getByLabel('Structure', { exact: true }).fill('Pole 7 (wood)');
  await page.getByLabel(/Tangent pole, bucket work/).check();
  await page.getByRole('button', { name: 'Create plan' }).click();
  await page.waitForURL(/\/plans\/\d+$/);
  await node(page, 'W1').waitFor();
  await expect.poll(() => shownFindings(page)).toBe(ONLY_WHIP_NOTE);

  // A second bucket, bonded to the cluster bar by a jumper, and a worker in it reaching phase B.
  await page.getByRole('button', { name: 'Add bucket' }).click();
  await node(page, 'BK2').waitFor();
  await page.getByRole('button', { name: 'Add worker' }).click();
  await node(page, 'W2').waitFor();
  await page.getByTestId('inspector').getByLabel('Stands on').selectOption('BK2');
  await page.getByTestId('inspector').getByRole('button', { name: 'Apply' }).click();
  await page.getByRole('button', { name: 'Jumper', exact: true }).click();
  await node(page, 'BK2').click();
  await node(page, 'CB').click();
  await page.getByRole('button', { name: 'Reach', exact: true }).click();
  await node(page, 'W2').click();
  await node(page, 'B').click();
  await page.locator('[data-testid="link-j1"]').waitFor({ state: 'attached' });
  await page.locator('[data-testid="link-r1"]').waitFor({ state: 'attached' });
  await page.keyboard.press('Escape');
  await expect.poll(() => shownFindings(page), { timeout: 10000 }).toBe(ONLY_WHIP_NOTE);
  await expect.poll(() => page.getByTestId('badge-W2').count()).toBe(1);

  // Delete the new jumper: the worker in BK2 is no longer in the zone of what they touch.
  await page.getByRole('tab', { name: 'Jumpers' }).click();
  await page.getByRole('tabpanel').getByRole('cell', { name: 'j1', exact: true }).click();
  await page.getByRole('tab', { name: /Findings/ }).click();
  await page.keyboard.press('Delete');
  await expect.poll(() => page.locator('[data-testid="link-j1"]').count()).toBe(0);
  await expect.poll(() => blockers(page).count(), { timeout: 10000 }).toBeGreaterThan(0);
  expect(await blockers(page).first().textContent()).toContain('W2');
  await expect.poll(() => node(page, 'W2').locator('.bm-node').getAttribute('data-severity')).toBe('blocker');

  await page.keyboard.press('Control+z');
  await page.locator('[data-testid="link-j1"]').waitFor({ state: 'attached' });
  await expect.poll(() => shownFindings(page), { timeout: 10000 }).toBe(ONLY_WHIP_NOTE);
  await saved(page);

  await page.reload();
  await node(page, 'W2').waitFor();
  expect(await node(page, 'BK2').count()).toBe(1);
  expect(await page.locator('[data-testid="link-j1"]').count()).toBe(1);
  expect(await page.getByTestId('save-state').getAttribute('data-state')).toBe('saved');

  // A driven rod brings a note; the PDF carries it, with the approval block and the caution.
  await page.getByRole('button', { name: 'Add ground rod' }).click();
  await node(page, 'R1').waitFor({ timeout: 5000 });
  await expect.poll(() => page.getByTestId('drawer').locator('[data-testid="findings"] li[data-rule="rod-barricade"]').count(), { timeout: 10000 }).toBe(1);
  const message = (await page.getByTestId('drawer').locator('li[data-rule="rod-barricade"] p').nth(1).textContent()) ?? '';
  await saved(page);
  const downloadPromise = page.waitForEvent('download');
  await page.getByRole('button', { name: 'Export' }).click();
  await page.getByRole('menuitem', { name: 'PDF sheet' }).click();
  const download = await downloadPromise;
  expect(download.suggestedFilename()).toMatch(/^editor-flow-\d+-r\d+\.pdf$/);
  const bytes = readFileSync((await download.path())!);
  mkdirSync('artifacts', { recursive: true });
  expect(bytes.length).toBeLessThan(1024 * 1024);
  writeFileSync('artifacts/editor-sheet.pdf', bytes);
  // The drawing is vectors from the document, not a picture: no image in the file, and every
  // element's id reads back as text.
  expect(bytes.toString('latin1')).not.toMatch(/\/Subtype\s*\/Image/);
  const pdf = await getDocumentProxy(new Uint8Array(bytes));
  // US Letter by default: 8.5 × 11 in is 612 × 792 points.
  expect((await pdf.getPage(1)).view.map(Math.round)).toEqual([0, 0, 612, 792]);
  const { text } = await extractText(pdf, { mergePages: true });
  const flat = (s: string) => s.replace(/\s+/g, ' ');
  expect(flat(text)).toContain('rod-barricade');
  expect(flat(text)).toContain(flat(pdfText(message)).slice(0, 40));
  expect(flat(text)).toContain('Not approved yet');
  expect(programNames(flat(text)), 'program names in the printed words').toEqual([]);
  // The embedded font prints Ω itself, and the header names the structure.
  expect(text).toContain('Ω');
  expect(flat(text)).toContain('Structure: Pole 7 (wood)');
  expect(flat(text)).toContain('Crew sign-on');
  expect(flat(text)).toContain('test for absence of voltage');
  for (const id of ['BK2', 'W2', 'R1', 'CB']) expect(flat(text)).toContain(` ${id} `);
  expect(flat(text)).toMatch(/j1 · \d/);

  mkdirSync('artifacts', { recursive: true });
  await page.screenshot({ path: 'artifacts/editor.png' });
  expect(errors).toEqual([]);
});

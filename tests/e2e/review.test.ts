/**
 * The whole review loop in Chromium: a crew lead submits, a reviewer returns it with a comment
 * pinned to a jumper, the crew lead sees the pin, fixes the lead and resubmits, a second reviewer
 * approves with a teaching note, and an apprentice finds it in the library.
 */
import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { extractText, getDocumentProxy } from 'unpdf';
import { expect, it } from 'vitest';
import { BASE_URL } from '../helpers/api';
import { fillFaultData, useBrowser } from '../helpers/e2e';

const browser = useBrowser();
const signIn = async (email: string) => (await browser.signIn(email)).page;


const saved = (page: Page) => expect.poll(() => page.getByTestId('save-state').getAttribute('data-state'), { timeout: 15000 }).toBe('saved');
const statusOf = (page: Page) => page.getByTestId('topbar').locator('[data-status]').first().getAttribute('data-status');

it('submit, return with a pinned comment, fix, resubmit, approve, and read in the library', async () => {
  const title = `Review loop pole ${Date.now()}`;

  // Crew lead: a plan from a starter, submitted from the editor's top bar.
  const lead = await signIn('lead@demo.test');
  await lead.goto(`${BASE_URL}/plans/new`);
  await fillFaultData(lead);
  await lead.getByLabel('Title').fill(title);
  await lead.getByLabel(/Tangent pole, bucket work/).check();
  await lead.getByRole('button', { name: 'Create plan' }).click();
  await lead.waitForURL(/\/plans\/\d+$/);
  const planPath = new URL(lead.url()).pathname;
  await lead.locator('.react-flow__node[data-id="W1"]').waitFor();
  await saved(lead);
  // Submitting asks first.
  const asked: string[] = [];
  lead.on('dialog', (d) => {
    asked.push(d.message());
    void d.accept();
  });
  await lead.getByTestId('submit-plan').click();
  await expect.poll(() => statusOf(lead), { timeout: 15000 }).toBe('submitted');
  expect(asked[0]).toMatch(/^Submit revision \d+ of ".*" for review\?/);

  // Reviewer: finds it in the queue, pins a comment to the neutral jumper, returns it.
  const reviewer = await signIn('reviewer@demo.test');
  await reviewer.goto(`${BASE_URL}/review`);
  await reviewer.getByTestId('review-queue').getByRole('link', { name: title }).click();
  await reviewer.waitForURL(/\/review$/);
  await reviewer.getByLabel('Pin to').selectOption('jN');
  await reviewer.getByLabel('Comment', { exact: true }).fill('The neutral lead has slack; make it 2 m.');
  await reviewer.getByRole('button', { name: 'Add comment' }).click();
  await expect.poll(() => reviewer.getByTestId('comments').textContent()).toContain('make it 2 m');
  await reviewer.getByTestId('pin-jN').waitFor({ state: 'attached' });
  await reviewer.getByLabel('Return to the crew lead').check();
  await reviewer.getByLabel('Comment (needed to return)').fill('Fix the neutral lead, then send it back.');
  // Returning asks first: a No keeps the reviewer on the form, a Yes returns the plan.
  const reviewerAsked: string[] = [];
  let answer = false;
  reviewer.on('dialog', (d) => {
    reviewerAsked.push(d.message());
    void (answer ? d.accept() : d.dismiss());
  });
  await reviewer.getByRole('button', { name: 'Record decision' }).click();
  await expect.poll(() => reviewerAsked.length).toBe(1);
  expect(reviewerAsked[0]).toMatch(/^Return revision \d+ to the crew lead\?/);
  expect(reviewer.url()).toMatch(/\/plans\/\d+\/review$/);
  expect(await reviewer.getByTestId('decision-form').isVisible()).toBe(true);
  answer = true;
  await reviewer.getByRole('button', { name: 'Record decision' }).click();
  await reviewer.waitForURL(`${BASE_URL}/review`);

  // Crew lead: sees it returned with the pin on the jumper, shortens the lead, resolves, resubmits.
  await lead.goto(`${BASE_URL}${planPath}`);
  await expect.poll(() => statusOf(lead)).toBe('returned');
  await lead.getByTestId('pin-jN').waitFor({ state: 'attached' });
  expect(await lead.getByTestId('workflow').textContent()).toContain('2 open');
  const inspector = lead.getByTestId('inspector');
  await inspector.getByRole('radio', { name: 'Metres' }).click();
  await lead.getByRole('tab', { name: 'Jumpers' }).click();
  await lead.getByRole('tabpanel').getByRole('cell', { name: 'jN', exact: true }).click();
  await lead.getByRole('tab', { name: /Findings/ }).click();
  await inspector.getByLabel('Lead length').fill('2');
  await inspector.getByRole('button', { name: 'Apply' }).click();
  await saved(lead);
  for (const n of [1, 2]) {
    await lead.getByRole('button', { name: `Resolve comment ${n}` }).click();
    await lead.waitForURL(/notice=resolved/);
  }
  expect(await lead.getByTestId('workflow').textContent()).not.toContain('open)');
  await lead.locator('.react-flow__node[data-id="W1"]').waitFor();
  await lead.getByTestId('submit-plan').click();
  await expect.poll(() => statusOf(lead), { timeout: 15000 }).toBe('submitted');
  expect(asked).toHaveLength(2);

  // A second reviewer approves with a teaching note; the first one had returned it.
  const second = await signIn('reviewer2@demo.test');
  await second.goto(`${BASE_URL}${planPath}/review`);
  await second.getByLabel('Approve').check();
  await second.getByLabel(/Teaching note/).fill('Bucket, phases and neutral on one bar, leads cut to length.');
  await second.getByRole('button', { name: 'Record decision' }).click();
  await second.waitForURL(`${BASE_URL}${planPath}`);
  const block = (await second.getByTestId('workflow').getByTestId('approval-block').textContent()) ?? '';
  const hash = block.match(/SHA-256 ([0-9a-f]{64})/)?.[1];
  expect(block).toContain('approved by Priya Vantongeren');
  expect(hash).toBeTruthy();

  // The PDF of the approved plan carries the approval block with that hash.
  await second.locator('.react-flow__node[data-id="W1"]').waitFor();
  const downloadPromise = second.waitForEvent('download');
  await second.getByRole('button', { name: 'Export' }).click();
  await second.getByRole('menuitem', { name: 'PDF sheet' }).click();
  const pdf = await getDocumentProxy(new Uint8Array(readFileSync((await (await downloadPromise).path())!)));
  const text = (await extractText(pdf, { mergePages: true })).text.replace(/\s+/g, '');
  expect(text).toContain('ApprovedbyPriyaVantongeren');
  expect(text).toContain(hash);

  // Apprentice: the library shows it with its note, and explains the jumper that was fixed.
  const apprentice = await signIn('apprentice@demo.test');
  await apprentice.goto(`${BASE_URL}/library`);
  const card = apprentice.getByTestId('library').locator('li', { hasText: title });
  await expect.poll(() => card.textContent()).toContain('Bucket, phases and neutral on one bar');
  await card.getByRole('link', { name: title }).click();
  // On the read-only drawing, selecting an element explains it.
  await apprentice.locator('.react-flow__node[data-id="CB"]').click();
  await expect.poll(() => apprentice.getByTestId('explain').textContent()).toContain('The common point');
  await apprentice.getByRole('link', { name: 'jumper jN' }).click();
  const explain = apprentice.locator('#explain-jN');
  await expect.poll(() => explain.textContent()).toMatch(/Temporary protective ground between Cluster bar and Neutral/);
  expect(await explain.textContent()).toMatch(/Impedance [\d.]+ mΩ/);
});

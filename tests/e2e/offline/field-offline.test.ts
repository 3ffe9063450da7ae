/**
 * The field record without signal (Chromium, network cut with setOffline): the page reloads from
 * the worker's cache, entries and a photo wait on the device, and reach the server once each, in
 * order, when the connection returns; also across a browser closed and reopened while offline.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { BASE_URL, signedIn } from '../../helpers/api';
import { CHROMIUM_PATH } from '../../helpers/browser';
import { DEMO_PASSWORD, nextStepHeading, startRecordOnDemoPlan, useBrowser } from '../../helpers/e2e';
import { setBody } from '../../helpers/equipment';

const PHONE = { viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true };
const browser = useBrowser();
const heading = nextStepHeading;
const waiting = async (page: Page) => [await page.getByTestId('waiting-entries').textContent(), await page.getByTestId('waiting-photos').textContent()].join('/');

/** Opens a new record on the approved demo plan and waits until the worker holds the page. */
async function openRecordOnline(page: Page): Promise<string> {
  await startRecordOnDemoPlan(page);
  await expect.poll(() => page.evaluate(async () => Boolean(navigator.serviceWorker.controller) && Boolean(await caches.match(location.href))), { timeout: 20_000 }).toBe(true);
  return page.url();
}

/** Signs on, ticks the briefing and records a passing test, from the screen. */
async function upToTheTest(page: Page) {
  await page.getByRole('button', { name: 'Sign on' }).click();
  for (let i = 0; i < 5; i += 1) {
    await expect.poll(() => page.getByTestId('record-log').locator('li').count().catch(() => 0)).toBe(1 + i);
    await page.getByRole('button', { name: 'Tick' }).click();
  }
  await expect.poll(() => heading(page)).toBe('Test for voltage');
  await page.getByLabel('Detector', { exact: true }).fill('Invented detector 7');
  await page.getByLabel('Detector proved before').check();
  for (const phase of ['A', 'B', 'C']) await page.getByRole('group', { name: `Phase ${phase}` }).getByRole('button', { name: 'Absent' }).click();
  await page.getByLabel('Detector proved after').check();
  await page.getByRole('button', { name: 'Record test' }).click();
}

async function putOn(page: Page, tag: string): Promise<string> {
  await expect.poll(() => heading(page)).toMatch(/^Set on: /);
  const link = (await heading(page))!.slice('Set on: '.length);
  await page.getByLabel('Find a set by tag').fill(tag);
  await page.getByRole('radio', { name: new RegExp(`^${tag}(?!\\d)`) }).check();
  await page.getByLabel(/Ground end on first/).check();
  await page.getByRole('button', { name: 'Set on' }).click();
  await expect.poll(() => heading(page)).not.toBe(`Set on: ${link}`);
  return link;
}

async function attachPhoto(page: Page, caption: string) {
  const jpeg = await sharp({ create: { width: 640, height: 480, channels: 3, background: '#6f8a96' } }).jpeg().toBuffer();
  await page.getByText('Add a photo', { exact: true }).click();
  await page.getByLabel('Photo', { exact: true }).setInputFiles({ name: 'offline.jpg', mimeType: 'image/jpeg', buffer: jpeg });
  await page.getByLabel('Caption').fill(caption);
  await page.getByRole('button', { name: 'Upload photo' }).click();
}

/** What the server holds, read with the context's own session (not subject to the page's network cut). */
async function serverRecord(context: BrowserContext, url: string) {
  const id = url.split('/').pop();
  const response = await context.request.get(`${BASE_URL}/api/records/${id}`);
  expect(response.status()).toBe(200);
  return (await response.json()).record as { entries: { type: string; clientId: string; setTag?: string; link?: string }[]; photos: { caption: string }[] };
}

function expectOnceInOrder(record: Awaited<ReturnType<typeof serverRecord>>, tags: string[]) {
  expect(record.entries.map((e) => e.type)).toEqual(['sign-on', 'briefing', 'briefing', 'briefing', 'briefing', 'briefing', 'voltage-test', 'install', 'install']);
  expect(new Set(record.entries.map((e) => e.clientId)).size).toBe(record.entries.length);
  expect(record.entries.filter((e) => e.type === 'install').map((e) => e.setTag)).toEqual(tags);
}

describe('the field record offline', () => {
  it('reloads offline, keeps entries and a photo on the device, and sends each once, in order, when back online', async () => {
    const { context, page } = await browser.signIn('lead@demo.test', PHONE);
    const url = await openRecordOnline(page);
    await context.setOffline(true);
    await page.reload();
    await expect.poll(() => heading(page)).toBe('Sign on the crew');
    // The page came from the worker; the island has run once it reads the device's copy.
    await expect.poll(() => page.getByTestId('in-step').textContent()).toMatch(/^In step with the server at/);
    await upToTheTest(page);
    await putOn(page, 'LV-101');
    await putOn(page, 'LV-102');
    await attachPhoto(page, 'Two sets on, offline');
    await expect.poll(() => waiting(page)).toBe('9/1');
    await expect.poll(() => page.getByTestId('count-on').textContent()).toBe('2');
    expect((await serverRecord(context, url)).entries).toEqual([]);

    await context.setOffline(false);
    await expect.poll(() => waiting(page), { timeout: 20_000 }).toBe('0/0');
    const record = await serverRecord(context, url);
    expectOnceInOrder(record, ['LV-101', 'LV-102']);
    expect(record.photos.map((p) => p.caption)).toEqual(['Two sets on, offline']);
    await expect.poll(() => page.getByTestId('in-step').textContent()).toMatch(/^In step with the server at/);
  });

  it('keeps the queue when the browser is closed and reopened while offline', async () => {
    const profile = mkdtempSync(join(tmpdir(), 'bondmap-offline-'));
    const launch = (offline: boolean) => chromium.launchPersistentContext(profile, { executablePath: CHROMIUM_PATH, headless: true, offline, args: ['--no-sandbox', '--disable-gpu', '--no-first-run'], ...PHONE });
    try {
      let context = await launch(false);
      let page = context.pages()[0] ?? (await context.newPage());
      await page.goto(`${BASE_URL}/login`);
      await page.getByLabel('E-mail').fill('lead@demo.test');
      await page.getByLabel('Password').fill(DEMO_PASSWORD);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.waitForURL((u) => u.pathname !== '/login');
      const url = await openRecordOnline(page);
      await context.setOffline(true);
      await upToTheTest(page);
      await putOn(page, 'LV-103');
      await putOn(page, 'LV-104');
      await expect.poll(() => waiting(page)).toBe('9/0');
      await context.close();

      context = await launch(true);
      page = context.pages()[0] ?? (await context.newPage());
      await page.goto(url);
      await expect.poll(() => waiting(page)).toBe('9/0');
      await expect.poll(() => page.getByTestId('count-on').textContent()).toBe('2');
      await context.setOffline(false);
      await expect.poll(() => waiting(page), { timeout: 20_000 }).toBe('0/0');
      expectOnceInOrder(await serverRecord(context, url), ['LV-103', 'LV-104']);
      await context.close();
    } finally {
      rmSync(profile, { recursive: true, force: true });
    }
  });
});


describe('signing out', () => {
  it("empties the person's page cache and record copies on the device", async () => {
    const { page } = await browser.signIn('lead@demo.test');
    await openRecordOnline(page);
    const held = () => page.evaluate(async () => {
      const pages = (await caches.keys()).includes('bondmap-person-pages');
      const copies = await new Promise<number>((resolve) => {
        const open = indexedDB.open('bondmap-field');
        open.onsuccess = () => {
          const request = open.result.transaction('records').objectStore('records').count();
          request.onsuccess = () => resolve(request.result);
        };
      });
      return `${pages}/${copies}`;
    });
    await expect.poll(held).toBe('true/1');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/login$/);
    await expect.poll(held).toBe('false/0');
  });
});

describe('two devices on one record', () => {
  it('merges the entries of a device that was offline, and keeps a refusal beside its entry', async () => {
    const tablet = await browser.signIn('lead@demo.test');
    const url = await openRecordOnline(tablet.page);
    await upToTheTest(tablet.page);
    await expect.poll(() => heading(tablet.page)).toMatch(/^Set on: /);

    const phone = await browser.signIn('admin@demo.test', PHONE);
    await phone.page.goto(url);
    await expect.poll(() => heading(phone.page)).toMatch(/^Set on: /);
    // In step is said only by the island once it runs: what is pressed before would be lost.
    await expect.poll(() => phone.page.getByTestId('in-step').textContent()).toMatch(/^In step with the server at/);
    await phone.context.setOffline(true);
    const first = await putOn(phone.page, 'LV-108');
    await phone.page.getByText('Deviation or note', { exact: true }).click();
    await phone.page.getByLabel('What is different, or what to note').fill('Phone: crossarm brace cracked');
    await phone.page.getByRole('button', { name: 'Note', exact: true }).click();
    await expect.poll(() => waiting(phone.page)).toBe('2/0');

    // Meanwhile the tablet, online, puts a set on the same jumper first.
    expect(await putOn(tablet.page, 'LV-110')).toBe(first);
    await expect.poll(() => waiting(tablet.page), { timeout: 20_000 }).toBe('0/0');
    await phone.context.setOffline(false);
    await expect.poll(() => waiting(phone.page), { timeout: 20_000 }).toBe('0/0');
    const refused = phone.page.getByTestId('entry-refused');
    await expect.poll(() => refused.textContent()).toContain('A set is already on that jumper.');

    const entries = (await serverRecord(tablet.context, url)).entries;
    expect(entries.filter((e) => e.type === 'install').map((e) => [e.link, e.setTag])).toEqual([[first, 'LV-110']]);
    expect(entries.filter((e) => e.type === 'note')).toHaveLength(1);
    await tablet.page.reload();
    await expect.poll(() => tablet.page.getByTestId('record-log').textContent()).toContain('Phone: crossarm brace cracked');
    // The phone's note was made before the tablet's set went on: the log shows it first.
    const log = await tablet.page.getByTestId('record-log').locator('li').evaluateAll((items) => items.map((li) => li.getAttribute('data-type')));
    expect(log.slice(-2)).toEqual(['note', 'install']);
    expect(entries.slice(-2).map((e) => e.type)).toEqual(['install', 'note']);
    await expect.poll(() => phone.page.getByTestId('count-on').textContent()).toBe('1');
  });
});

describe('a set the server refused after it went on offline', () => {
  it('keeps close-out from saying every set is off while the refused set may still be on', async () => {
    const admin = await signedIn('admin@demo.test', DEMO_PASSWORD);
    const made = await admin.post('/api/equipment', setBody({ description: 'Invented set for the refusal test' }));
    expect(made.status, made.text).toBe(201);
    const tag = made.body.set.tag as string;

    const { page, context } = await browser.signIn('lead@demo.test', { viewport: { width: 1024, height: 768 }, hasTouch: true });
    const url = await openRecordOnline(page);
    await upToTheTest(page);
    const first = await putOn(page, 'LV-101');
    await expect.poll(() => waiting(page), { timeout: 20_000 }).toBe('0/0');

    // No signal: the set goes on (the device knows it in service), and the office takes it out of service.
    await context.setOffline(true);
    const second = await putOn(page, tag);
    const patched = await admin.patch(`/api/equipment/${made.body.set.id}`, { status: 'out-of-service', statusReason: 'Invented: jacket cut' });
    expect(patched.status, patched.text).toBe(200);
    // Still without signal, the first set comes off; the device shows the second as on.
    await page.getByRole('button', { name: `Set off ${first} (LV-101)` }).click();
    await expect.poll(() => waiting(page)).toBe('2/0');
    expect(await page.getByTestId('count-on').textContent()).toBe('1');

    await context.setOffline(false);
    await expect.poll(() => waiting(page), { timeout: 20_000 }).toBe('0/0');
    await expect.poll(() => page.getByTestId('entry-refused').first().textContent()).toContain('out of service');
    // The server never took the second set's "on": the screen now counts nothing on, yet that set
    // went on the line and nothing says it came off. Close-out must not go through on that.
    await expect.poll(() => heading(page)).toBe('Close out');
    await page.getByRole('button', { name: 'Close out' }).click();
    await expect.poll(() => page.getByTestId('problem').textContent()).toContain(second);
    expect((await serverRecord(context, url) as unknown as { status: string }).status).toBe('open');
    expect(await page.getByTestId('field-record').getAttribute('data-status')).toBe('open');
  });
});

/**
 * A crew lead keeps a field record on a phone: opens a record on a demo plan, signs on, ticks the
 * briefing, records the voltage test, puts every set on, uploads a photo, takes every set off,
 * closes out, downloads the PDF and reads it back.
 */
import { readFileSync } from 'node:fs';
import sharp from 'sharp';
import { extractText, getDocumentProxy } from 'unpdf';
import { describe, expect, it } from 'vitest';
import { programNames } from '../helpers/words';
import { BASE_URL } from '../helpers/api';
import { nextStepHeading, startRecordOnDemoPlan, useBrowser } from '../helpers/e2e';

const PHONE = { viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true };
const browser = useBrowser();

describe('the field record on a phone', () => {
  it('goes from an approved plan to a closed record and its PDF', async () => {
    const { page } = await browser.signIn('lead@demo.test', PHONE);
    await startRecordOnDemoPlan(page);
    const next = page.getByTestId('next-step');
    const heading = () => nextStepHeading(page);
    const signOn = page.getByRole('button', { name: 'Sign on' });
    expect((await signOn.boundingBox())!.height).toBeGreaterThanOrEqual(44);
    await signOn.click();

    for (let i = 0; i < 5; i += 1) {
      await expect.poll(heading).toBe('Briefing');
      const count = await page.getByTestId('record-log').locator('li').count().catch(() => 0);
      await page.getByRole('button', { name: 'Tick' }).click();
      await expect.poll(() => page.getByTestId('record-log').locator('li').count()).toBe(count + 1);
    }

    await expect.poll(heading).toBe('Test for voltage');
    await page.getByLabel('Detector', { exact: true }).fill('Invented detector 7');
    await page.getByLabel('Detector proved before').check();
    for (const phase of ['A', 'B', 'C']) await page.getByRole('group', { name: `Phase ${phase}` }).getByRole('button', { name: 'Absent' }).click();
    await page.getByLabel('Detector proved after').check();
    await page.getByRole('button', { name: 'Record test' }).click();

    let on = 0;
    // Sets come from the demo inventory: in-date ones are offered, the overdue LV-117 and the
    // faulted LV-118 are not.
    const tags = ['LV-101', 'LV-102', 'LV-103', 'LV-104', 'LV-107'];
    const used: Record<string, string> = {};
    await expect.poll(heading).toMatch(/^Set on: /);
    for (const unfit of ['LV-117', 'LV-118']) {
      await page.getByLabel('Find a set by tag').fill(unfit);
      await expect.poll(() => next.getByRole('radio').count()).toBe(0);
    }
    while ((await heading())?.startsWith('Set on: ')) {
      const link = (await heading())!.slice('Set on: '.length);
      used[link] = tags[on];
      await page.getByLabel('Find a set by tag').fill(tags[on]);
      const choice = next.getByRole('radio', { name: new RegExp(`^${tags[on]}(?!\\d)`) });
      expect((await choice.locator('xpath=..').boundingBox())!.height).toBeGreaterThanOrEqual(44);
      await choice.check();
      await page.getByLabel(/Ground end on first/).check();
      await page.getByRole('button', { name: 'Set on' }).click();
      on += 1;
      await expect.poll(() => page.getByTestId('count-on').textContent()).toBe(String(on));
    }
    expect(on).toBe(5);

    const jpeg = await sharp({ create: { width: 800, height: 600, channels: 3, background: '#7a8f99' } }).jpeg().toBuffer();
    await page.getByText('Add a photo', { exact: true }).click();
    await page.getByLabel('Photo', { exact: true }).setInputFiles({ name: 'sets-on.jpg', mimeType: 'image/jpeg', buffer: jpeg });
    await page.getByLabel('Caption').fill('Every set on');
    await page.getByRole('button', { name: 'Upload photo' }).click();
    await expect.poll(() => page.getByRole('img', { name: 'Every set on' }).count()).toBe(1);

    let off = 0;
    while (off < on) {
      await expect.poll(heading).toMatch(/^Take off: /);
      await page.getByRole('button', { name: 'Set off', exact: true }).click();
      off += 1;
      await expect.poll(() => page.getByTestId('count-off').textContent()).toBe(String(off));
    }
    await expect.poll(() => page.getByTestId('count-on').textContent()).toBe('0');
    await expect.poll(heading).toBe('Close out');
    await page.getByRole('button', { name: 'Close out' }).click();
    await expect.poll(() => page.getByTestId('field-record').getAttribute('data-status')).toBe('closed');

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('pdf-link').click()]);
    const bytes = new Uint8Array(readFileSync((await download.path())!));
    const { text } = await extractText(await getDocumentProxy(bytes), { mergePages: true });
    const flat = text.replace(/\s+/g, ' ');
    for (const part of ['Pole 14 on Wren Hollow Road', 'Invented detector 7', `ON jA with set ${used.jA}`, 'OFF jA', 'Photos', 'Every set on', 'Closed by Casimir Abernethy', 'approved detector']) expect(flat).toContain(part);
    expect(programNames(flat), 'program names in the record sheet').toEqual([]);
  });
});

describe('the demo records', () => {
  it('lists the open demo record with sets on first and shows its drawing on a tablet; the closed one has a drawn photo', async () => {
    const { page } = await browser.signIn('reviewer@demo.test', { viewport: { width: 820, height: 1180 }, hasTouch: true });
    const list = (await (await page.request.get(`${BASE_URL}/api/records?pageSize=100`)).json()).items as { id: number; status: string; setsOn: number; clearanceRef: string }[];
    const demoOpen = list.find((r) => r.clearanceRef === 'HOLD-DEMO-0123')!;
    const demoClosed = list.find((r) => r.clearanceRef === 'HOLD-DEMO-0117')!;
    expect(demoOpen).toMatchObject({ status: 'open', setsOn: 3 });
    expect(demoClosed).toMatchObject({ status: 'closed', setsOn: 0 });
    // Closed out on its own work day, after the last set came off (not when the demo was seeded).
    const closedDetail = (await (await page.request.get(`${BASE_URL}/api/records/${demoClosed.id}`)).json()).record as { workDate: string; closedAt: string; entries: { at: string }[] };
    expect(closedDetail.closedAt.slice(0, 10)).toBe(closedDetail.workDate);
    expect(Date.parse(closedDetail.closedAt)).toBeGreaterThan(Math.max(...closedDetail.entries.map((e) => Date.parse(e.at))));
    const rank = (r: { status: string; setsOn: number }) => (r.status === 'open' ? (r.setsOn > 0 ? 0 : 1) : 2);
    expect(list.map(rank)).toEqual(list.map(rank).sort());
    await page.goto(`${BASE_URL}/records`);
    await expect.poll(() => page.getByTestId('record-table').locator('tbody tr').first().textContent()).toContain('Pole 14');
    await page.goto(`${BASE_URL}/records/${demoOpen.id}`);
    await expect.poll(() => page.getByTestId('count-on').textContent()).toBe('3');
    await expect.poll(() => page.getByTestId('field-drawing').getAttribute('data-on')).toBe('jN,jA,jB');
    await expect.poll(() => page.getByTestId('field-drawing').locator('[data-testid^="link-"]').count()).toBeGreaterThan(4);
    await page.screenshot({ path: 'artifacts/test-results/field-record-tablet.png', fullPage: true });
    const closed = (await (await page.request.get(`${BASE_URL}/api/records/${demoClosed.id}`)).json()).record;
    expect(closed.photos).toHaveLength(1);
    const thumb = await page.request.get(`${BASE_URL}${closed.photos[0].url}?size=thumb`);
    expect(thumb.headers()['content-type']).toBe('image/jpeg');
    expect(closed.entries.flatMap((e: { flags: { code: string }[] }) => e.flags.map((f) => f.code))).toContain('removed-out-of-order');
  });
});

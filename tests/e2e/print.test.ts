/**
 * The plan's outputs in the browser: the PNG export is drawn from the document (right size, not
 * blank), and the browser's own print of the plan page is the sheet — title first, then the
 * drawing, findings, figures, sign-on and caution, without the editor around it, on the
 * organisation's paper (Letter, or A4 when it chose A4).
 */
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { extractText, getDocumentProxy } from 'unpdf';
import { afterAll, expect, it } from 'vitest';
import { programNames } from '../helpers/words';
import { BASE_URL, signedIn } from '../helpers/api';
import { useBrowser } from '../helpers/e2e';
import { closeTestDb, makeTeam, PASSWORD, planDocument } from '../helpers/factories';

const browser = useBrowser();
afterAll(closeTestDb);
const TITLE = 'Pole 14 on Wren Hollow Road';

async function openDemoPlan(page: Page): Promise<void> {
  await page.goto(`${BASE_URL}/plans?q=${encodeURIComponent(TITLE)}`);
  const href = await page.locator('a[href^="/plans/"]').evaluateAll((as) => as.map((a) => a.getAttribute('href')).find((h) => /^\/plans\/\d+$/.test(h ?? '')));
  expect(href).toBeTruthy();
  await page.goto(`${BASE_URL}${href}`);
  await page.locator('.react-flow__node').first().waitFor();
}

it('exports a PNG of the plan drawn from the document: 1600 px wide, with ink on it', async () => {
  const { page } = await browser.signIn('lead@demo.test', { acceptDownloads: true });
  await openDemoPlan(page);
  const download = page.waitForEvent('download');
  await page.getByRole('button', { name: 'Export' }).click();
  await page.getByRole('menuitem', { name: 'PNG picture' }).click();
  const bytes = readFileSync((await (await download).path())!);
  mkdirSync('artifacts', { recursive: true });
  writeFileSync('artifacts/plan-export.png', bytes);
  expect(bytes.subarray(1, 4).toString('latin1')).toBe('PNG');
  const [width, height] = [bytes.readUInt32BE(16), bytes.readUInt32BE(20)];
  expect(width).toBe(1600);
  expect(height).toBeGreaterThanOrEqual(1240);
  // Decoded in the browser: a good share of the drawing's pixels are ink, not all white.
  const dark = await page.evaluate(async (b64) => {
    const img = new Image();
    img.src = `data:image/png;base64,${b64}`;
    await img.decode();
    const c = document.createElement('canvas');
    [c.width, c.height] = [img.width, img.height];
    const ctx = c.getContext('2d')!;
    ctx.drawImage(img, 0, 0);
    const px = ctx.getImageData(0, 120, img.width, 1000).data;
    let n = 0;
    for (let i = 0; i < px.length; i += 4) if (px[i] < 128 && px[i + 1] < 128 && px[i + 2] < 128) n++;
    return n / (px.length / 4);
  }, bytes.toString('base64'));
  expect(dark).toBeGreaterThan(0.002);
  expect(dark).toBeLessThan(0.5);
});

it('prints the plan page as the sheet: Letter, title above the drawing, no editor around it', async () => {
  const { page } = await browser.signIn('lead@demo.test');
  await openDemoPlan(page);
  await page.emulateMedia({ media: 'print' });
  await page.evaluate(() => window.dispatchEvent(new Event('beforeprint')));
  const drawing = page.getByTestId('print-drawing');
  await drawing.waitFor();
  const title = (await page.getByTestId('print-sheet').locator('h1').boundingBox())!;
  const box = (await drawing.boundingBox())!;
  expect(box.y).toBeGreaterThanOrEqual(title.y + title.height);
  expect(box.width).toBeGreaterThan(300);
  expect(await page.locator('.bm-editor').isVisible()).toBe(false);
  const ids = await page.locator('.react-flow__node').evaluateAll((els) => els.map((el) => el.getAttribute('data-id') ?? ''));

  const printed = await page.pdf({ preferCSSPageSize: true });
  writeFileSync('artifacts/plan-print.pdf', printed);
  const pdf = await getDocumentProxy(new Uint8Array(printed));
  expect((await pdf.getPage(1)).view.map(Math.round)).toEqual([0, 0, 612, 792]);
  const { text } = await extractText(pdf, { mergePages: true });
  const flat = text.replace(/\s+/g, ' ');
  expect(flat.indexOf(TITLE)).toBeGreaterThanOrEqual(0);
  expect(flat.indexOf(TITLE)).toBeLessThan(flat.indexOf('System data'));
  for (const id of ids) expect(flat, `element ${id} on the printed drawing`).toContain(id);
  for (const words of ['Structure:', 'Prepared by', 'Findings', 'Jumpers', 'Crew sign-on', 'test for absence of voltage']) expect(flat).toContain(words);
  for (const chrome of ['Fold tools', 'Export', 'Undo']) expect(flat).not.toContain(chrome);
  expect(programNames(flat), 'program names in the printed words').toEqual([]);
});

it('prints on A4 for an organisation that chose A4, as its PDF does', async () => {
  const team = await makeTeam();
  const admin = await signedIn(team.admin.email, PASSWORD);
  expect((await admin.put('/api/organisation/settings', { timeZone: 'UTC', paperSize: 'a4', units: 'metric' })).status).toBe(200);
  const lead = await signedIn(team.lead.email, PASSWORD);
  const base = planDocument();
  // Jumper jA names its grounding set: the sheet carries the number beside the jumper.
  const document = { ...base, links: base.links.map((l) => (l.id === 'jA' ? { ...l, equipmentId: 'QX-417' } : l)) };
  const id = (await lead.post('/api/plans', { title: 'A4 print pole', structure: 'Invented pole 4', document })).body.plan.id;
  // On each page the plan can be printed from: the plan itself, and (reviewer) its review.
  for (const [who, path] of [[team.lead.email, `/plans/${id}`], [team.reviewer.email, `/plans/${id}/review`]] as const) {
    const { page } = await browser.signIn(who, {}, PASSWORD);
    await page.goto(`${BASE_URL}${path}`);
    await page.locator('.react-flow__node').first().waitFor();
    // The exported PDF sheet is on A4 too.
    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Export' }).click();
    await page.getByRole('menuitem', { name: 'PDF sheet' }).click();
    const sheet = await getDocumentProxy(new Uint8Array(readFileSync((await (await download).path())!)));
    expect((await sheet.getPage(1)).view.map(Math.round), `${path} exported PDF`).toEqual([0, 0, 595, 842]);
    const sheetText = (await extractText(sheet, { mergePages: true })).text.replace(/\s+/g, ' ');
    expect(sheetText).toMatch(/jA \([^)]*\) · set no\. QX-417/);
    expect(sheetText).toMatch(/jB \([^)]*\) · set no\. _+/);
    await page.emulateMedia({ media: 'print' });
    await page.evaluate(() => window.dispatchEvent(new Event('beforeprint')));
    const pdf = await getDocumentProxy(new Uint8Array(await page.pdf({ preferCSSPageSize: true })));
    // A4 is 210 × 297 mm = 595.3 × 841.9 pt.
    for (let n = 1; n <= pdf.numPages; n++) expect((await pdf.getPage(n)).view.map(Math.round), `${path} page ${n}`).toEqual([0, 0, 595, 842]);
    expect((await extractText(pdf, { mergePages: true })).text).toContain('A4 print pole');
  }
});

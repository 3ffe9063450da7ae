/**
 * An organisation in feet reads the findings on the read-only drawing (the drawer's list and
 * Explain) in feet on the library, review and plan pages, as the server-rendered lists do: the
 * stored report says metres, the drawing must not. Its PDF and print sheet say feet, pounds of
 * body weight and pounds-force per foot too.
 */
import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { extractText, getDocumentProxy } from 'unpdf';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { BASE_URL, signedIn } from '../helpers/api';
import { useBrowser } from '../helpers/e2e';
import { closeTestDb, makeTeam, PASSWORD, planDocument } from '../helpers/factories';

const browser = useBrowser();
let team: Awaited<ReturnType<typeof makeTeam>>;
let planId: number;

beforeAll(async () => {
  team = await makeTeam();
  const admin = await signedIn(team.admin.email, PASSWORD);
  expect((await admin.put('/api/organisation/settings', { timeZone: 'UTC', paperSize: 'letter', units: 'imperial' })).status).toBe(200);
  const lead = await signedIn(team.lead.email, PASSWORD);
  const base = planDocument();
  // An 8 ft rod (2.4384 m) on the cluster bar: its barricade finding carries a length.
  const document = {
    ...base,
    nodes: [...base.nodes, { id: 'R9', kind: 'ground-rod', lengthM: 2.4384, diameterMm: 15.875, soilOhmM: 100, position: { x: 400, y: 300 } }],
    links: [...base.links, { id: 'jR9', kind: 'jumper', from: 'CB', to: 'R9', cable: '2/0', lengthM: 3, spanM: 2.5 }],
  };
  const plan = (await lead.post('/api/plans', { title: 'Feet drawing pole', structure: 'Invented pole 9', document })).body.plan;
  expect(plan.report.findings.find((f: { rule: string }) => f.rule === 'rod-barricade').message).toMatch(/\d m\b/);
  planId = plan.id;
  expect((await lead.post(`/api/plans/${planId}/submit`)).status).toBe(200);
});
afterAll(closeTestDb);

/** The barricade sentence (not its basis, which names the standard's 1 m step) says feet and inches. */
function expectFeetIn(text: string, where: string) {
  const sentence = text.replace(/\s+/g, ' ').match(/Barricade [^.;]*/)?.[0] ?? '';
  expect(sentence, where).toMatch(/out to \d+ ft \d+ in/);
  expect(sentence, where).not.toMatch(/\d m\b/);
}

async function expectFeet(page: Page, where: string) {
  await page.locator('.react-flow__node').first().waitFor();
  const finding = page.locator('[data-testid="findings"] [data-rule="rod-barricade"]');
  await finding.waitFor();
  expectFeetIn(await finding.innerText(), `${where}: the drawer's finding`);
  await page.locator('.react-flow__node[data-id="R9"]').click();
  const explain = page.getByTestId('explain');
  await explain.waitFor();
  expectFeetIn(await explain.innerText(), `${where}: Explain`);
}

it('words the findings on the read-only drawing in feet on the review, plan and library pages', async () => {
  const { page } = await browser.signIn(team.reviewer.email, {}, PASSWORD);
  await page.goto(`${BASE_URL}/plans/${planId}/review`);
  await expectFeet(page, 'review');

  // "Show" on a finding brings its element back into view and flashes it, after the drawing was panned away.
  const flow = (await page.locator('.react-flow').first().boundingBox())!;
  const inView = async () => {
    const r = await page.locator('.react-flow__node[data-id="R9"]').boundingBox();
    return !!r && r.x >= flow.x && r.x + r.width <= flow.x + flow.width && r.y >= flow.y && r.y + r.height <= flow.y + flow.height;
  };
  await page.mouse.move(flow.x + 20, flow.y + 20);
  await page.mouse.down();
  await page.mouse.move(flow.x - 1500, flow.y - 1500, { steps: 8 });
  await page.mouse.up();
  expect(await inView()).toBe(false);
  await page.getByRole('button', { name: 'Show R9', exact: true }).click();
  await expect.poll(inView).toBe(true);
  expect(await page.locator('.react-flow__node[data-id="R9"] .bm-node').getAttribute('class')).toMatch(/\bbm-flash\b/);
  await page.goto(`${BASE_URL}/plans/${planId}`);
  await page.locator('.react-flow__node').first().waitFor();
  expectFeetIn(await page.locator('[data-testid="findings"] [data-rule="rod-barricade"]').innerText(), 'plan: the drawer\'s finding');

  const reviewer = await signedIn(team.reviewer.email, PASSWORD);
  expect((await reviewer.post(`/api/plans/${planId}/review`, { decision: 'approve' })).status).toBe(200);
  await page.goto(`${BASE_URL}/library/${planId}`);
  await expectFeet(page, 'library');

  const download = page.waitForEvent('download');
  await page.getByRole('button', { name: 'Export' }).click();
  await page.getByRole('menuitem', { name: 'PDF sheet' }).click();
  const pdf = await getDocumentProxy(new Uint8Array(readFileSync((await (await download).path())!)));
  const text = (await extractText(pdf, { mergePages: true })).text.replace(/\s+/g, ' ');
  expectFeetIn(text, 'PDF');
  // 50 kg is 110 lb (0.45359237 kg a pound, NIST SP 811); the force per length in lbf/ft.
  expect(text).toContain('body criteria 110 lb');
  expect(text).toMatch(/peak force \d+(\.\d)? lbf\/ft/);
  // Sentences and figures only: a basis keeps its standard's own SI wording ("threshold 100 N/m").
  const withoutBasis = (t: string) => t.replace(/Basis: .*?(?=\[(NOTE|WARNING|BLOCKER)\]|Workers)/g, '');
  expect(withoutBasis(text)).not.toMatch(/ N\/m|\d kg/);
  expect(text).not.toContain('?');

  await page.emulateMedia({ media: 'print' });
  await page.evaluate(() => window.dispatchEvent(new Event('beforeprint')));
  const sheetLines = (await page.getByTestId('print-sheet').innerText()).split('\n');
  const sheet = sheetLines.join(' ').replace(/\s+/g, ' ');
  expectFeetIn(sheet, 'print sheet');
  expect(sheet).toContain('body criteria 110 lb');
  expect(sheetLines.filter((l) => !l.startsWith('Basis:')).join(' ')).not.toMatch(/ N\/m|\d kg/);
});

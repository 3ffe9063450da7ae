/**
 * Every page, signed out and as each role (the editor included), loaded in Chromium with the
 * server's Content-Security-Policy in force: no policy violation, and axe-core finds no serious or
 * critical accessibility problem. axe is evaluated through the DevTools protocol, which the page's
 * CSP does not govern, so the audit itself needs no exception in the policy. The words a person
 * reads carry no program names: no camelCase or snake_case field name outside a code label.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, signedIn } from '../helpers/api';
import { launchBrowser } from '../helpers/browser';
import { DEMO_PASSWORD } from '../helpers/e2e';
import { PROGRAM_NAME } from '../helpers/words';

const axeSource = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

let browser: Browser;
let planIds: { draft: number; approved: number; submitted: number };
let otherIds: { set: number; record: number; exercise: number };
beforeAll(async () => {
  browser = await launchBrowser();
  const admin = await signedIn('admin@demo.test', DEMO_PASSWORD);
  const byStatus = async (status: string) => (await admin.get(`/api/plans?status=${status}`)).body.items[0].id as number;
  planIds = { draft: await byStatus('draft'), approved: await byStatus('approved'), submitted: await byStatus('submitted') };
  otherIds = {
    set: (await admin.get('/api/equipment')).body.items[0].id,
    record: (await admin.get('/api/records?status=closed')).body.items[0].id,
    exercise: (await admin.get('/api/exercises')).body.items[0].id,
  };
});
afterAll(async () => {
  await browser?.close();
});

interface Finding {
  page: string;
  kind: 'csp' | 'axe' | 'status' | 'words';
  detail: string;
}

/** Loads `path`, then reports CSP violations and serious or critical axe findings. */
async function audit(page: Page, path: string, waitFor?: string): Promise<Finding[]> {
  const findings: Finding[] = [];
  const response = await page.goto(BASE_URL + path, { waitUntil: 'networkidle' });
  if (!response || response.status() >= 500) findings.push({ page: path, kind: 'status', detail: String(response?.status()) });
  if (waitFor) await page.waitForSelector(waitFor, { timeout: 20_000 });
  const violations = await page.evaluate(() => (window as unknown as { __cspViolations?: string[] }).__cspViolations ?? []);
  for (const v of violations) findings.push({ page: path, kind: 'csp', detail: v });
  // Program names in the text a person reads (rule ids and tags shown as <code> labels, and what
  // people typed into fields, are not words of ours).
  const names = await page.evaluate((pattern) => {
    const found = new Set<string>();
    const walker = document.createTreeWalker(document.body, NodeFilter.SHOW_TEXT);
    for (let node = walker.nextNode(); node; node = walker.nextNode()) {
      const parent = node.parentElement;
      if (!parent || parent.closest('code, script, style, textarea, [data-user-text]') || !parent.getClientRects().length) continue;
      for (const m of node.textContent?.matchAll(new RegExp(pattern, 'g')) ?? []) found.add(m[0]);
    }
    return [...found];
  }, PROGRAM_NAME);
  for (const n of names) findings.push({ page: path, kind: 'words', detail: n });
  await page.evaluate(axeSource);
  const results = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, opts: object) => Promise<{ violations: Array<{ id: string; impact: string; nodes: Array<{ target: string[] }> }> }> } }).axe;
    const r = await axe.run(document, { resultTypes: ['violations'] });
    return r.violations.map((v) => ({ id: v.id, impact: v.impact, targets: v.nodes.slice(0, 3).map((n) => n.target.join(' ')) }));
  });
  for (const v of results) {
    if (v.impact === 'serious' || v.impact === 'critical') findings.push({ page: path, kind: 'axe', detail: `${v.impact} ${v.id}: ${v.targets.join(', ')}` });
  }
  return findings;
}

async function newPage(email?: string): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1366, height: 900 } });
  await context.addInitScript(() => {
    const list: string[] = [];
    (window as unknown as { __cspViolations: string[] }).__cspViolations = list;
    document.addEventListener('securitypolicyviolation', (e) => list.push(`${e.violatedDirective} ${e.blockedURI} ${e.sourceFile}:${e.lineNumber}`));
  });
  const page = await context.newPage();
  page.on('console', (m) => {
    if (/Content Security Policy/i.test(m.text())) void page.evaluate((t) => (window as unknown as { __cspViolations: string[] }).__cspViolations.push(t), m.text()).catch(() => undefined);
  });
  if (email) {
    await page.goto(`${BASE_URL}/login`);
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname !== '/login');
  }
  return page;
}

const signedInPages = (): Array<[string, string?]> => [
  ['/'],
  ['/plans'],
  ['/plans/new'],
  [`/plans/${planIds.draft}`, '.react-flow__node'],
  [`/plans/${planIds.approved}`, '.react-flow__node'],
  [`/plans/${planIds.submitted}/history`],
  [`/plans/${planIds.submitted}/review`],
  ['/review'],
  ['/library'],
  [`/library/${planIds.approved}`],
  ['/admin/users'],
  ['/admin/mail'],
  ['/settings'],
  ['/equipment'],
  [`/equipment/${otherIds.set}`],
  ['/equipment/settings'],
  ['/records'],
  [`/records/${otherIds.record}`],
  ['/practice'],
  [`/practice/${otherIds.exercise}`],
  ['/practice/new'],
  ['/practice/progress'],
];

describe('every page under its CSP, with axe', () => {
  it('signed out', async () => {
    const page = await newPage();
    const findings: Finding[] = [];
    for (const path of ['/login', '/forgot-password', '/set-password/not-a-valid-link-000000']) findings.push(...(await audit(page, path)));
    expect(findings).toEqual([]);
    await page.context().close();
  });

  for (const email of ['admin@demo.test', 'reviewer@demo.test', 'lead@demo.test', 'apprentice@demo.test']) {
    it(`as ${email}`, async () => {
      const page = await newPage(email);
      const findings: Finding[] = [];
      for (const [path, waitFor] of signedInPages()) {
        // Pages a role may not open answer 403 pages; they are audited too, without waiting for the canvas.
        findings.push(...(await audit(page, path, email === 'apprentice@demo.test' && path.endsWith(String(planIds.draft)) ? undefined : waitFor)));
      }
      expect(findings).toEqual([]);
      await page.context().close();
    });
  }
});

/**
 * Editor benchmark: opens a generated 1,000-element plan in headless Chromium and prints the time
 * to the first interactive canvas, the p95 frame time while dragging a node for 2 s, and the
 * gzip size of the JavaScript the editor page ships; checks that a page without islands (/plans)
 * ships no island JavaScript. Prints figures only; targets are for reading, never asserted.
 *
 *   BONDMAP_TEST_URL=http://127.0.0.1:4395 npx tsx bench/editor.ts
 */
import { gzipSync } from 'node:zlib';
import type { Page } from 'playwright-core';
import { launchBrowser } from '../tests/helpers/browser';
import { generatePlan } from './generate-plan';

export interface EditorBenchResult {
  elements: number;
  interactiveMs: number;
  dragFrames: number;
  p95FrameMs: number;
  editorJsGzipBytes: number;
  plansPageJsGzipBytes: number;
  plansPageScripts: string[];
}

async function collectScripts(page: Page, url: string): Promise<{ files: string[]; gzipBytes: number }> {
  const bodies: Promise<{ url: string; size: number }>[] = [];
  const onResponse = (res: import('playwright-core').Response) => {
    if (res.request().resourceType() === 'script') bodies.push(res.body().then((b) => ({ url: res.url(), size: gzipSync(b).length })).catch(() => ({ url: res.url(), size: 0 })));
  };
  page.on('response', onResponse);
  await page.goto(url, { waitUntil: 'networkidle' });
  page.off('response', onResponse);
  const all = await Promise.all(bodies);
  return { files: all.map((b) => new URL(b.url).pathname), gzipBytes: all.reduce((s, b) => s + b.size, 0) };
}

const p95 = (xs: number[]) => {
  const sorted = [...xs].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor(sorted.length * 0.95))] ?? NaN;
};

export async function runEditorBench(baseUrl: string, elements = 1000): Promise<EditorBenchResult> {
  const browser = await launchBrowser();
  try {
    const context = await browser.newContext({ viewport: { width: 1366, height: 900 } });
    const page = await context.newPage();
    await page.goto(`${baseUrl}/login`);
    await page.getByLabel('E-mail').fill(process.env.BONDMAP_BENCH_USER ?? 'lead@demo.test');
    await page.getByLabel('Password').fill(process.env.BONDMAP_BENCH_PASSWORD ?? 'bondmap-demo');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((u) => u.pathname !== '/login');

    const planDoc = generatePlan({ elements, seed: 20240611 });
    const count = planDoc.nodes.length + planDoc.links.length;
    const created = await page.evaluate(async (doc) => {
      const res = await fetch('/api/plans', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ title: `Bench ${doc.nodes.length + doc.links.length} elements`, document: doc }) });
      return { status: res.status, body: await res.json() };
    }, { ...planDoc, title: 'Editor bench plan' });
    if (created.status !== 201) throw new Error(`creating the bench plan failed: ${created.status} ${JSON.stringify(created.body).slice(0, 300)}`);
    const planUrl = `${baseUrl}/plans/${created.body.plan.id}`;

    // Time to the first interactive canvas: from navigation start until the nodes are drawn and
    // the canvas answers a pointer (React Flow has measured them, so they are draggable).
    await page.goto(planUrl);
    await page.waitForFunction(() => document.querySelectorAll('.react-flow__node').length > 0 && !!document.querySelector('.react-flow__node[style*="visibility: visible"], .react-flow__node:not([style*="visibility: hidden"])'));
    const interactiveMs = await page.evaluate(() => performance.now());

    // Frame times while dragging one node for 2 s.
    await page.getByTestId('topbar').getByRole('button', { name: 'Fit', exact: true }).click();
    const target = page.locator('.react-flow__node').first();
    const box = (await target.boundingBox())!;
    // A string, not a function: tsx's name helper does not exist inside the page.
    await page.evaluate(`(() => {
      window.__frames = []; window.__on = true; window.__last = performance.now();
      const tick = (t) => { window.__frames.push(t - window.__last); window.__last = t; if (window.__on) requestAnimationFrame(tick); };
      requestAnimationFrame(tick);
    })()`);
    const x0 = box.x + box.width / 2;
    const y0 = box.y + 20;
    await page.mouse.move(x0, y0);
    await page.mouse.down();
    const start = Date.now();
    let i = 0;
    while (Date.now() - start < 2000) {
      i++;
      await page.mouse.move(x0 + 120 * Math.sin(i / 10), y0 + 80 * Math.cos(i / 13));
    }
    await page.mouse.up();
    const frames = (await page.evaluate('(() => { window.__on = false; return window.__frames.slice(1); })()')) as number[];

    const editorJs = await collectScripts(page, planUrl);
    const plansJs = await collectScripts(page, `${baseUrl}/plans`);
    await context.close();
    return {
      elements: count,
      interactiveMs: Math.round(interactiveMs),
      dragFrames: frames.length,
      p95FrameMs: Math.round(p95(frames) * 10) / 10,
      editorJsGzipBytes: editorJs.gzipBytes,
      plansPageJsGzipBytes: plansJs.gzipBytes,
      plansPageScripts: plansJs.files,
    };
  } finally {
    await browser.close();
  }
}

export function printEditorBench(r: EditorBenchResult): void {
  const kb = (b: number) => `${(b / 1024).toFixed(1)} KB`;
  console.log(`editor bench — ${r.elements} elements`);
  console.log(`  first interactive canvas   ${r.interactiveMs} ms   (target < 1500 ms)`);
  console.log(`  p95 frame while dragging   ${r.p95FrameMs} ms over ${r.dragFrames} frames   (target < 16.7 ms)`);
  console.log(`  editor page JavaScript     ${kb(r.editorJsGzipBytes)} gzip   (target < 250 KB)`);
  console.log(`  /plans page JavaScript     ${kb(r.plansPageJsGzipBytes)} gzip, ${r.plansPageScripts.length} file(s)${r.plansPageScripts.length ? `: ${r.plansPageScripts.join(', ')}` : ' (no island code)'}`);
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const base = process.env.BONDMAP_TEST_URL;
  if (!base) {
    console.error('Set BONDMAP_TEST_URL to a running Bondmap server (e.g. http://127.0.0.1:4395).');
    process.exit(2);
  }
  runEditorBench(base).then(printEditorBench, (err) => {
    console.error(err);
    process.exit(1);
  });
}

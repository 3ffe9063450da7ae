/**
 * The browser half of `npm run bench`: the 1,000-element editor (bench/editor.ts), then the
 * tablet and export figures (bench/editor-tablet.ts). Prints both; with BONDMAP_BENCH_OUT set,
 * writes the figures (and why any is missing) there for `npm run bench -- --json`.
 *
 *   BONDMAP_TEST_URL=http://127.0.0.1:4395 npx tsx bench/browser.ts
 */
import { writeFileSync } from 'node:fs';
import { printEditorBench, runEditorBench } from './editor';
import { printTabletBench, runTabletBench } from './editor-tablet';

const base = process.env.BONDMAP_TEST_URL;
if (!base) {
  console.error('Set BONDMAP_TEST_URL to a running Bondmap server (e.g. http://127.0.0.1:4395).');
  process.exit(2);
}
const figures: Record<string, unknown> = { reasons: {} as Record<string, string> };
const reasons = figures.reasons as Record<string, string>;
let failed = false;
try {
  const r = await runEditorBench(base);
  printEditorBench(r);
  Object.assign(figures, { dragP95Ms: r.p95FrameMs, dragP95CpuMs: r.p95FrameCpuMs, editorJsKb: Math.round((r.editorJsGzipBytes / 1024) * 10) / 10 });
} catch (err) {
  console.error(err);
  failed = true;
  for (const k of ['dragP95Ms', 'editorJsKb']) reasons[k] = `the 1,000-element editor bench failed: ${(err as Error).message}`;
}
try {
  const t = await runTabletBench(base);
  printTabletBench(t);
  Object.assign(figures, t.figures);
  Object.assign(reasons, t.reasons);
} catch (err) {
  console.error(err);
  failed = true;
  for (const k of ['tabletFirstInteractiveMs', 'tabletCheckRoundTripMs', 'tabletDragP95Ms', 'pngExportMs', 'pdfExportMs']) reasons[k] = `the tablet editor bench failed: ${(err as Error).message}`;
}
if (process.env.BONDMAP_BENCH_OUT) writeFileSync(process.env.BONDMAP_BENCH_OUT, JSON.stringify(figures));
process.exit(failed ? 1 : 0);


/**
 * Output of a plan: a PNG painted from the document (title, drawing, findings, caution), a PDF
 * (jspdf) with the drawing, system data, findings, contact and jumper figures, revision,
 * approval block and caution, and the plan JSON. The PDF is written as text, not a picture, so
 * it can be searched and read back.
 */
import { CAUTION, type CheckReport } from '@/lib/domain/report';
import { formatFigure, formatForcePerLength, formatLength, formatWeight, type UnitSystem } from '@/lib/domain/units';
import type { PlanDocument } from '@/lib/schemas/plan';
import type { Shape } from './drawing-scene';

export type PaperSize = 'letter' | 'a4';

export interface SheetMeta {
  planId: number;
  revision: number;
  status: string;
  structure?: string;
  /** Who prepared the plan (its author). */
  preparer?: string;
  /** The date the sheet speaks for, already formatted for the reader. */
  date?: string;
  /** US Letter unless the organisation chose A4. */
  paper?: PaperSize;
  /** Filled by the review workflow later; until then the block reads "Not approved yet". */
  approval?: { by: string; at: string; hash?: string } | null;
}

export const slug = (title: string) => title.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 60) || 'plan';
export const fileBase = (doc: PlanDocument, meta: SheetMeta) => `${slug(doc.title)}-r${meta.revision}`;

export function downloadBlob(blob: Blob, name: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 5000);
}

export const planJsonText = (doc: PlanDocument): string => `${JSON.stringify(doc, null, 2)}\n`;

/** The nodes' rendered widths when the canvas is on screen (a long label widens a node). */
export function nodeWidths(root: HTMLElement | null): Record<string, number> {
  const out: Record<string, number> = {};
  for (const el of root?.querySelectorAll<HTMLElement>('.react-flow__node') ?? []) if (el.dataset.id) out[el.dataset.id] = el.offsetWidth;
  return out;
}

/**
 * The PNG: title, header line, the drawing from the document, the findings one to a line and
 * the caution, painted straight onto a canvas (no copy of the page, so it takes milliseconds).
 */
export async function renderPlanPng(doc: PlanDocument, report: CheckReport | null, meta: SheetMeta, widths: Record<string, number>): Promise<Blob> {
  const { drawingScene } = await import('./drawing-scene');
  const { paintCanvas, CANVAS_FONT } = await import('./drawing-paint');
  await document.fonts?.ready;
  const W = 1600;
  const findings = report?.findings ?? [];
  const H = 1000 + 150 + 26 * Math.min(findings.length, 30) + 90;
  const canvas = document.createElement('canvas');
  canvas.width = W;
  canvas.height = H;
  const ctx = canvas.getContext('2d', { alpha: false });
  if (!ctx) throw new Error('This browser cannot draw the picture.');
  ctx.fillStyle = '#ffffff';
  ctx.fillRect(0, 0, W, H);
  ctx.fillStyle = '#1b2330';
  const write = (text: string, y: number, size: number, bold = false) => {
    ctx.font = `${bold ? 700 : 400} ${size}px ${CANVAS_FONT}`;
    ctx.textAlign = 'left';
    ctx.fillStyle = '#1b2330';
    ctx.fillText(text, 40, y, W - 80);
  };
  write(doc.title, 56, 34, true);
  write(`Structure: ${meta.structure?.trim() || '—'} · Date: ${meta.date ?? '—'} · Prepared by ${meta.preparer || '—'} · Plan ${meta.planId} · revision ${meta.revision} · status ${meta.status}`, 96, 20);
  ctx.save();
  ctx.translate(0, 120);
  paintCanvas(ctx, drawingScene(doc, report, W, 1000, widths));
  ctx.restore();
  let y = 1160;
  write(!report ? 'Findings: not checked.' : findings.length ? 'Findings' : 'Findings: clear - the check found nothing to fix.', y, 24, true);
  const word = { blocker: 'BLOCKER', warning: 'WARNING', note: 'NOTE' } as const;
  for (const fd of findings.slice(0, 30)) write(`[${word[fd.severity]}] ${fd.message} (${fd.elements.join(', ')})`, (y += 26), 18);
  if (findings.length > 30) write(`… and ${findings.length - 30} more in the PDF sheet.`, (y += 26), 18);
  write(CAUTION.slice(0, CAUTION.indexOf('. ') + 1), (y += 44), 16, true);
  write(CAUTION.slice(CAUTION.indexOf('. ') + 2), (y += 24), 16);
  // toDataURL, not toBlob: Chromium encodes toBlob in idle time, which on a busy page waits ~1 s.
  const bytes = Uint8Array.from(atob(canvas.toDataURL('image/png').split(',')[1]), (c) => c.charCodeAt(0));
  return new Blob([bytes], { type: 'image/png' });
}

const SUPERSCRIPT: Record<string, string> = { '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9', '⁺': '+', '⁻': '-', '⁼': '=', '⁽': '(', '⁾': ')', 'ⁿ': 'n', 'ⁱ': 'i' };

/**
 * The embedded Source Sans 3 subsets print Latin-1, general punctuation, − and Greek (Ω ρ π µ ²):
 * spell out the few other symbols our sentences use.
 */
export function pdfText(text: string): string {
  return text
    // Superscripts beyond Latin-1 (10⁻⁷) are not in the embedded subsets: written as a power (10^-7).
    .replace(/[¹²³\u2070-\u207f]*[\u2070-\u207f][¹²³\u2070-\u207f]*/g, (run) => `^${[...run].map((c) => SUPERSCRIPT[c] ?? '?').join('')}`)
    .replace(/≤/g, '<=').replace(/≥/g, '>=').replace(/√/g, 'sqrt ')
    .replace(/[^\x20-\xff\n\u2000-\u206f\u2212\u0370-\u03ff]/g, '?');
}

/** Paper sizes in mm. */
export const PAPER: Record<PaperSize, { w: number; h: number }> = { letter: { w: 215.9, h: 279.4 }, a4: { w: 210, h: 297 } };

const shift = (s: Shape, dx: number, dy: number): Shape =>
  s.t === 'poly' ? { ...s, pts: s.pts.map((v, i) => v + (i % 2 ? dy : dx)) } : { ...s, x: s.x + dx, y: s.y + dy };

const f = (v: number | null | undefined, d = 2) => formatFigure(v, d, '-');

/**
 * Builds the PDF sheet. The drawing is drawn as vectors from the document; `widths` are the
 * nodes' rendered widths when the canvas is on screen (see `nodeWidths`).
 */
export async function buildPdf(doc: PlanDocument, report: CheckReport | null, meta: SheetMeta, widths: Record<string, number>, units: UnitSystem): Promise<Blob> {
  const { jsPDF } = await import('jspdf');
  const { embedFonts, fontRuns, LATIN } = await import('./pdf-font');
  const paper = meta.paper ?? 'letter';
  const pdf = new jsPDF({ unit: 'mm', format: paper, compress: true });
  await embedFonts(pdf);
  const { w: W, h: H } = PAPER[paper];
  const M = 14;
  let y = 16;
  const ensure = (h: number) => {
    if (y + h > H - 12) {
      pdf.addPage();
      y = 16;
    }
  };
  const line = (text: string, size = 10, bold = false, indent = 0) => {
    pdf.setFont(LATIN, bold ? 'bold' : 'normal');
    pdf.setFontSize(size);
    const rows = pdf.splitTextToSize(pdfText(text), W - 2 * M - indent) as string[];
    for (const row of rows) {
      ensure(size * 0.45);
      let x = M + indent;
      for (const [run, family] of fontRuns(row)) {
        pdf.setFont(family, bold ? 'bold' : 'normal');
        pdf.text(run, x, y);
        x += pdf.getTextWidth(run);
      }
      y += size * 0.45;
    }
  };
  const gap = (h = 3) => (y += h);

  line(doc.title, 16, true);
  line(`Structure: ${meta.structure?.trim() || '—'} · Location: ______________________ · Date: ${meta.date ?? '—'}`, 10);
  line(`Prepared by ${meta.preparer || '—'} · Plan ${meta.planId} · revision ${meta.revision} · status ${meta.status}`, 10);
  gap(2);
  // Approval block: always drawn, empty until the review workflow fills it.
  pdf.setDrawColor(27, 35, 48);
  pdf.rect(M, y, W - 2 * M, 14);
  y += 5;
  line('Approval', 10, true, 3);
  line(meta.approval ? `Approved by ${meta.approval.by} on ${meta.approval.at}${meta.approval.hash ? ` - document ${meta.approval.hash}` : ''}` : 'Not approved yet', 10, false, 3);
  y += 4;
  gap();
  if (doc.nodes.length) {
    const { drawingScene } = await import('./drawing-scene');
    const { paintPdf } = await import('./drawing-paint');
    const h = (W - 2 * M) * 0.625;
    ensure(h);
    pdf.setDrawColor(208, 213, 221);
    pdf.setLineWidth(0.2);
    pdf.rect(M, y, W - 2 * M, h);
    const shapes = drawingScene(doc, report, W - 2 * M, h, widths).map((sh) => shift(sh, M, y));
    paintPdf(pdf, shapes, LATIN, pdfText);
    y += h + 4;
  } else line('(Nothing drawn yet)', 10);

  const s = doc.system;
  line('System data', 12, true);
  line(`Fault current ${f(s.faultKa)} kA · clearing time ${f(s.clearingCycles)} cycles at ${s.frequencyHz} Hz · X/R ${f(s.xOverR)} · nominal ${f(s.nominalKv)} kV · phase spacing ${s.phaseSpacingM === undefined ? '-' : formatLength(s.phaseSpacingM, units)} · body criteria ${formatWeight(doc.criteria?.bodyKg ?? 50, units)}, ${doc.criteria?.bodyOhms ?? 1000} Ω`);
  gap();
  line('Findings', 12, true);
  if (!report) line('Not checked.');
  else if (!report.findings.length) line('Clear - the check found nothing to fix.');
  else {
    const word = { blocker: 'BLOCKER', warning: 'WARNING', note: 'NOTE' } as const;
    for (const fd of report.findings) {
      line(`[${word[fd.severity]}] ${fd.rule} (${fd.elements.join(', ')})`, 10, true);
      line(fd.message, 10, false, 4);
      line(`Basis: ${fd.basis}`, 9, false, 4);
      gap(1);
    }
  }
  if (report) {
    gap();
    line('Workers - contacts', 12, true);
    if (!report.contacts.length) line('No contacts.');
    for (const c of report.contacts) line(`${c.worker} touching ${c.surface}: ${f(c.touchVolts, 1)} V, body current ${c.bodyAmps === null ? '-' : Math.round(c.bodyAmps * 1000)} mA, limit ${c.limitAmps === null ? '-' : Math.round(c.limitAmps * 1000)} mA`);
    gap();
    line('Jumpers', 12, true);
    if (!report.jumpers.length) line('No jumpers.');
    for (const j of report.jumpers) {
      const link = doc.links.find((l) => l.id === j.link);
      const set = link && link.kind === 'jumper' && link.equipmentId ? ` · set no. ${link.equipmentId}` : ' · set no. ______';
      line(`${j.link}${link && link.kind === 'jumper' ? ` (${link.cable}, ${formatLength(link.lengthM, units)})` : ''}${set}: ${f(j.ohms, 5)} Ω, duty ${f(j.dutyKa)} kA, cable rating ${f(j.cableRatingKa)} kA, clamp rating ${f(j.clampRatingKa)} kA`);
    }
    if (report.rods.length) {
      gap();
      line('Rods', 12, true);
      for (const r of report.rods) line(`${r.node}: ${f(r.ohms, 1)} Ω${r.barricadeRadiusM ? `, barricade radius ${formatLength(r.barricadeRadiusM, units)}` : ''}`);
    }
    gap();
    line('Fault', 12, true);
    line(`Duration ${f(report.fault.durationS, 3)} s, asymmetrical ${f(report.fault.asymmetricalKa)} kA, peak ${f(report.fault.peakKa)} kA, peak force ${report.fault.peakForceNPerM === null ? '- (no phase spacing)' : formatForcePerLength(report.fault.peakForceNPerM, units)}, tolerable body current ${report.tolerableBodyAmps === null ? '-' : Math.round(report.tolerableBodyAmps * 1000)} mA`);
  }
  gap(4);
  line('Crew sign-on', 12, true);
  line('Each worker signs before the grounds go on: I have seen this plan and where I will stand.', 9);
  for (let i = 0; i < 6; i++) {
    ensure(8);
    y += 6;
    pdf.setDrawColor(27, 35, 48);
    pdf.line(M, y, M + 70, y);
    pdf.line(M + 76, y, M + 146, y);
    pdf.line(M + 152, y, W - M, y);
  }
  y += 4;
  line('Name · Signature · Time', 8);
  gap(4);
  line('Caution', 11, true);
  line(CAUTION, 10);
  return pdf.output('blob');
}

/**
 * The field record as a PDF (Letter by default): the plan drawn from its positions, the crew and
 * briefing with names and times, the voltage tests, the on/off log in order with its flags, photo
 * thumbnails, deviations and notes, the close-out, and the caution. Made on the server with jsPDF
 * so the thumbnails come straight from the object store.
 */
import { jsPDF } from 'jspdf';
import type { RecordDetail } from '@db/repositories/field-records';
import { BRIEFING_LABELS, recordPlanFrom, replay, type FieldEntry } from '@/lib/domain/field-record';
import { CAUTION } from '@/lib/domain/report';
import type { PlanDocument } from '@/lib/schemas/plan';
import { formatDateTime } from '@/lib/time-format';

export type Paper = 'letter' | 'a4';
const M = 48;

class Sheet {
  readonly pdf: jsPDF;
  y = M;
  constructor(paper: Paper) {
    this.pdf = new jsPDF({ unit: 'pt', format: paper });
  }
  get width() {
    return this.pdf.internal.pageSize.getWidth();
  }
  get bottom() {
    return this.pdf.internal.pageSize.getHeight() - M;
  }
  room(h: number) {
    if (this.y + h > this.bottom) {
      this.pdf.addPage();
      this.y = M;
    }
  }
  heading(text: string) {
    this.room(40);
    this.y += 10;
    this.pdf.setFont('helvetica', 'bold').setFontSize(13).text(text, M, this.y);
    this.y += 18;
  }
  line(text: string, opts: { bold?: boolean; size?: number; indent?: number } = {}) {
    const size = opts.size ?? 10;
    this.pdf.setFont('helvetica', opts.bold ? 'bold' : 'normal').setFontSize(size);
    const lines = this.pdf.splitTextToSize(text, this.width - 2 * M - (opts.indent ?? 0)) as string[];
    for (const l of lines) {
      this.room(size + 4);
      this.pdf.text(l, M + (opts.indent ?? 0), this.y);
      this.y += size + 4;
    }
  }
}

/** The plan's nodes and links scaled into a box; jumpers with a set recorded carry its tag. */
function drawPlan(sheet: Sheet, doc: PlanDocument, tags: Map<string, string>) {
  const pdf = sheet.pdf;
  const pos = new Map(doc.nodes.map((n, i) => [n.id, n.position ?? { x: (i % 5) * 160, y: Math.floor(i / 5) * 140 }]));
  const xs = [...pos.values()].map((p) => p.x);
  const ys = [...pos.values()].map((p) => p.y);
  const [minX, maxX, minY, maxY] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
  const boxW = sheet.width - 2 * M - 40;
  const boxH = 240;
  sheet.room(boxH + 40);
  const scale = Math.min(boxW / Math.max(1, maxX - minX), boxH / Math.max(1, maxY - minY), 1);
  const at = (id: string) => {
    const p = pos.get(id) ?? { x: minX, y: minY };
    return { x: M + 20 + (p.x - minX) * scale, y: sheet.y + 20 + (p.y - minY) * scale };
  };
  pdf.setDrawColor(27, 35, 48);
  for (const link of doc.links) {
    const a = at(link.from);
    const b = at(link.to);
    pdf.setLineWidth(link.kind === 'jumper' ? 2.5 : link.kind === 'bond' ? 0.8 : 0.6);
    pdf.setLineDashPattern(link.kind === 'reach' ? [1, 3] : [], 0);
    pdf.line(a.x, a.y, b.x, b.y);
    pdf.setLineDashPattern([], 0);
    if (link.kind === 'jumper') {
      const label = tags.has(link.id) ? `${link.id} · ${tags.get(link.id)}` : link.id;
      pdf.setFont('helvetica', 'bold').setFontSize(8).text(label, (a.x + b.x) / 2 + 4, (a.y + b.y) / 2 - 3);
    }
  }
  for (const node of doc.nodes) {
    const p = at(node.id);
    pdf.setLineWidth(1).setFillColor(255, 255, 255).circle(p.x, p.y, 9, 'FD');
    pdf.setFont('helvetica', 'normal').setFontSize(8).text(node.label ?? node.id, p.x + 12, p.y + 3);
  }
  sheet.y += boxH + 40;
}

export interface PdfInput {
  record: RecordDetail;
  names: Map<string, string>;
  thumbs: { caption: string; jpeg: Uint8Array; width: number; height: number }[];
  paper: Paper;
  /** The organisation's time zone: every time on the sheet is read in it. */
  timeZone: string;
}

export function recordPdf({ record, names, thumbs, paper, timeZone }: PdfInput): ArrayBuffer {
  const stamp = (iso: string) => formatDateTime(new Date(iso), timeZone);
  const sheet = new Sheet(paper);
  const plan = recordPlanFrom(record.document);
  const entries = record.entries.map((e) => e.entry);
  const state = replay(plan, entries, record.status === 'closed');
  const who = (id: string) => names.get(id) ?? id;
  const of = <T extends FieldEntry['type']>(type: T) => record.entries.filter((e) => e.entry.type === type) as (RecordDetail['entries'][number] & { entry: Extract<FieldEntry, { type: T }> })[];

  sheet.line(`Field record: ${record.planTitle}`, { bold: true, size: 16 });
  sheet.line(`${record.structure || 'Structure not given'}${record.location ? ` · ${record.location}` : ''} · ${record.workDate} · plan revision ${record.revision}`);
  sheet.line(`Crew lead ${record.leadName} · clearance or hold ${record.clearanceRef || 'not given'} · ${record.status === 'closed' ? 'closed' : 'OPEN'} · sets on ${state.installed}, off ${state.removed}`);

  sheet.heading('Plan');
  drawPlan(sheet, record.document, new Map(of('install').map((e) => [e.entry.link, e.entry.setTag])));

  sheet.heading('Crew signed on');
  sheet.line(state.people.map(who).concat(state.visitors.map((v) => `${v} (visitor)`)).join(', ') || 'Nobody signed on.');

  sheet.heading('Briefing');
  for (const [item, label] of Object.entries(BRIEFING_LABELS)) {
    const tick = state.briefing[item as keyof typeof BRIEFING_LABELS];
    sheet.line(`${tick ? '[x]' : '[ ]'} ${label}${tick ? ` — ${who(tick.by)}, ${stamp(tick.at)}` : ' — not ticked'}`);
  }

  sheet.heading('Absence-of-voltage test');
  const tests = of('voltage-test');
  if (!tests.length) sheet.line('No test recorded.');
  for (const t of tests) {
    const phases = Object.entries(t.entry.phases).map(([p, r]) => `${p} ${r}`).join(', ');
    sheet.line(`${stamp(t.entry.at)} · ${t.entry.detector} · proved before: ${t.entry.detectorCheckedBefore ? 'yes' : 'NO'}, after: ${t.entry.detectorCheckedAfter ? 'yes' : 'NO'} · ${phases} · by ${t.actorName}`);
    if (Object.values(t.entry.phases).includes('present')) sheet.line('VOLTAGE FOUND: work stopped; the system operator is to be called.', { bold: true, indent: 12 });
  }

  sheet.heading('Sets on and off, in order');
  const log = record.entries.filter((e) => e.entry.type === 'install' || e.entry.type === 'remove');
  if (!log.length) sheet.line('No set went on.');
  for (const e of log) {
    // "Ground end first" is confirmed by the crew for each set that goes on; nothing records which end came off first.
    const text = e.entry.type === 'install' ? `ON  ${e.entry.link} with set ${e.entry.setTag} (ground end first)` : `OFF ${'link' in e.entry ? e.entry.link : ''}`;
    sheet.line(`${stamp(e.entry.at)} · ${text} · ${e.actorName}`);
    for (const f of e.flags) sheet.line(`FLAG: ${f.message}`, { bold: true, indent: 12 });
  }

  if (thumbs.length) {
    sheet.heading('Photos');
    // Three to a row, each 150 pt wide; a row starts a new page when it does not fit.
    const w = 150;
    const heightOf = (t: PdfInput['thumbs'][number]) => Math.round((t.height / Math.max(1, t.width)) * w);
    for (let i = 0; i < thumbs.length; i += 3) {
      const row = thumbs.slice(i, i + 3);
      const rowH = Math.max(...row.map(heightOf)) + 24;
      sheet.room(rowH);
      row.forEach((t, j) => {
        const x = M + j * (w + 12);
        sheet.pdf.addImage(t.jpeg, 'JPEG', x, sheet.y, w, heightOf(t));
        sheet.pdf.setFont('helvetica', 'normal').setFontSize(8).text((sheet.pdf.splitTextToSize(t.caption || 'No caption', w) as string[])[0], x, sheet.y + heightOf(t) + 10);
      });
      sheet.y += rowH;
    }
  }

  sheet.heading('Deviations and notes');
  const notes = record.entries.filter((e) => e.entry.type === 'deviation' || e.entry.type === 'note');
  if (!notes.length) sheet.line('None recorded.');
  for (const n of notes) sheet.line(`${stamp(n.entry.at)} · ${n.entry.type === 'deviation' ? 'DEVIATION' : 'Note'} · ${'text' in n.entry ? n.entry.text : ''} · ${n.actorName}`);

  sheet.heading('Close-out');
  sheet.line(record.status === 'closed' && record.closedAt
    ? `Closed by ${record.closedByName} at ${formatDateTime(record.closedAt, timeZone)}. Every set that went on came off; the clearance can be released.`
    : `Not closed: ${state.on.length} set(s) still on (${state.on.map((s) => s.link).join(', ') || 'none'}).`);

  sheet.heading('Caution');
  sheet.line(CAUTION);
  return sheet.pdf.output('arraybuffer');
}

/**
 * The print view of the plan (browser print): header with structure, date, preparer, revision and
 * the approval block, the drawing (drawn from the document), system data, findings, contact and
 * jumper figures, crew sign-on and the caution — the same sheet as the PDF.
 */
import { forwardRef } from 'react';
import { CAUTION, type CheckReport } from '@/lib/domain/report';
import { formatLength, formatWeight, type UnitSystem } from '@/lib/domain/units';
import type { PlanDocument } from '@/lib/schemas/plan';
import { drawingScene } from '@/components/editor/drawing-scene';
import type { SheetMeta } from '@/components/editor/export';
import { FaultTable, JumpersTable, RodsTable, WorkersTable, fmt } from './FigureTables';
import { FindingsList } from './FindingsList';
import { ScenePicture } from './ScenePicture';

export interface PrintSheetProps { doc: PlanDocument; report: CheckReport | null; meta: SheetMeta; units: UnitSystem; widths?: Record<string, number> }

export const PrintSheet = forwardRef<HTMLDivElement, PrintSheetProps>(function PrintSheet({ doc, report, meta, units, widths }, ref) {
  const s = doc.system;
  return (
    <div ref={ref} className="bm-sheet space-y-4 bg-white p-6 text-ink" data-testid="print-sheet">
      <header className="flex flex-wrap items-start justify-between gap-4 border-b border-ink pb-3">
        <div>
          <h1 className="text-2xl font-bold">{doc.title}</h1>
          <p>Structure: {meta.structure?.trim() || '—'} · Location: ______________ · Date: {meta.date ?? '—'}</p>
          <p className="num">Prepared by {meta.preparer || '—'} · Plan {meta.planId} · revision {meta.revision} · {meta.status}</p>
        </div>
        <div className="min-w-[16rem] border border-ink p-2 text-sm" data-testid="approval-block">
          <p className="font-bold">Approval</p>
          <p>{meta.approval ? `Approved by ${meta.approval.by}, ${meta.approval.at}` : 'Not approved yet'}</p>
          {meta.approval?.hash && <p className="break-all text-xs">Document SHA-256 {meta.approval.hash}</p>}
        </div>
      </header>
      {doc.nodes.length ? <ScenePicture shapes={drawingScene(doc, report, 1000, 625, widths)} width={1000} height={625} title={`Drawing of ${doc.title}`} /> : <p>(Nothing drawn yet)</p>}
      <section>
        <h2 className="text-lg font-semibold">System data</h2>
        <p className="num">
          Fault current {fmt(s.faultKa)} kA · clearing time {fmt(s.clearingCycles)} cycles at {s.frequencyHz} Hz · X/R {fmt(s.xOverR)} · nominal {fmt(s.nominalKv)} kV ·
          phase spacing {s.phaseSpacingM === undefined ? '—' : formatLength(s.phaseSpacingM, units)} · body criteria {formatWeight(doc.criteria?.bodyKg ?? 50, units)}, {doc.criteria?.bodyOhms ?? 1000} Ω
        </p>
      </section>
      <section>
        <h2 className="text-lg font-semibold">Findings</h2>
        {report ? <FindingsList findings={report.findings} /> : <p>Not checked.</p>}
      </section>
      {report && (
        <section className="grid gap-4 md:grid-cols-2">
          <div><h2 className="text-lg font-semibold">Workers</h2><WorkersTable report={report} /></div>
          <div><h2 className="text-lg font-semibold">Jumpers</h2><JumpersTable report={report} doc={doc} /></div>
          <div><h2 className="text-lg font-semibold">Rods</h2><RodsTable report={report} units={units} /></div>
          <div><h2 className="text-lg font-semibold">Fault</h2><FaultTable report={report} units={units} /></div>
        </section>
      )}
      <section className="break-inside-avoid">
        <h2 className="text-lg font-semibold">Crew sign-on</h2>
        <p className="text-sm">Each worker signs before the grounds go on: I have seen this plan and where I will stand.</p>
        {[0, 1, 2, 3, 4, 5].map((i) => <div key={i} className="mt-6 grid grid-cols-3 gap-4"><span className="border-b border-ink" /><span className="border-b border-ink" /><span className="border-b border-ink" /></div>)}
        <p className="mt-1 text-xs">Name · Signature · Time</p>
      </section>
      <p className="border border-ink p-2 text-sm"><strong>Caution.</strong> {CAUTION}</p>
    </div>
  );
});

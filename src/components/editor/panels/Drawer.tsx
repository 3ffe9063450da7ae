/**
 * The bottom drawer: tabs Findings / Workers / Jumpers / Rods / Fault with the live check, and
 * the caution at its foot, always visible.
 */
import { useState } from 'react';
import { CAUTION, type Finding } from '@/lib/domain/report';
import { SeverityGlyph } from '@/components/ui/SeverityMark';
import { useEditor } from '@/components/editor/selectors';
import { FaultTable, JumpersTable, RodsTable, WorkersTable } from './FigureTables';
import { FindingsList } from './FindingsList';

const TABS = ['Findings', 'Workers', 'Jumpers', 'Rods', 'Fault'] as const;
type Tab = (typeof TABS)[number];

export function CautionLine() {
  return (
    <p className="border-t border-line bg-white px-4 py-2 text-sm" role="note" data-testid="caution">
      <strong>Caution.</strong> {CAUTION}
    </p>
  );
}

export function Drawer({ onShow }: { onShow: (ids: string[]) => void }) {
  const [tab, setTab] = useState<Tab>('Findings');
  // Folded to its strip on a phone or a short tablet screen, so the drawing keeps the room.
  const [open, setOpen] = useState(() => typeof window === 'undefined' || (window.innerWidth >= 768 && window.innerHeight >= 820));
  const report = useEditor((s) => s.report);
  const doc = useEditor((s) => (tab === 'Jumpers' ? s.doc : null));
  const units = useEditor((s) => s.units);
  const checkState = useEditor((s) => s.checkState);
  const checkIssues = useEditor((s) => s.checkIssues);
  const summary = report?.summary;
  const showFinding = (f: Finding) => onShow(f.elements);

  let body: React.ReactNode;
  if (checkState === 'invalid') {
    body = (
      <div role="alert">
        <p className="font-semibold text-blocker">The plan cannot be checked until these are fixed:</p>
        <ul className="list-disc pl-6">{checkIssues.map((i) => <li key={i.path + i.message}><code>{i.path}</code>: {i.message}</li>)}</ul>
      </div>
    );
  } else if (!report) body = <p className="text-note">{checkState === 'offline' ? 'The check needs a connection; it runs again when the connection returns.' : 'Checking…'}</p>;
  else if (tab === 'Findings') body = <FindingsList findings={report.findings} onShow={showFinding} />;
  else if (tab === 'Workers') body = <WorkersTable report={report} onSelect={onShow} />;
  else if (tab === 'Jumpers') body = <JumpersTable report={report} doc={doc!} onSelect={onShow} />;
  else if (tab === 'Rods') body = <RodsTable report={report} units={units} onSelect={onShow} />;
  else body = <FaultTable report={report} units={units} />;

  return (
    <section aria-label="Check results" className="flex min-h-0 flex-col border-t border-line bg-paper" data-testid="drawer">
      <div className="flex flex-wrap items-center gap-1 border-b border-line bg-white px-2">
        <div className="flex flex-wrap items-center gap-1" role="tablist" aria-label="Check results">
        {TABS.map((t) => (
          <button key={t} type="button" role="tab" aria-selected={tab === t} onClick={() => { setTab(t); setOpen(true); }}
            className={`min-h-touch px-3 font-semibold ${tab === t ? 'border-b-4 border-accent text-ink' : 'border-b-4 border-transparent text-note'}`}>
            {t}
            {t === 'Findings' && summary ? <span className="ml-1 text-sm font-normal num">({summary.blockers + summary.warnings + summary.notes})</span> : null}
          </button>
        ))}
        </div>
        <span className="ml-auto flex items-center gap-3 pr-2 text-sm num" aria-live="polite" data-testid="check-summary">
          {checkState === 'checking' && <span className="text-note">Checking…</span>}
          {summary && (
            <>
              <span className="inline-flex items-center gap-1"><SeverityGlyph severity="blocker" /> {summary.blockers} blocker{summary.blockers === 1 ? '' : 's'}</span>
              <span className="inline-flex items-center gap-1"><SeverityGlyph severity="warning" /> {summary.warnings} warning{summary.warnings === 1 ? '' : 's'}</span>
              <span className="inline-flex items-center gap-1"><SeverityGlyph severity="note" /> {summary.notes} note{summary.notes === 1 ? '' : 's'}</span>
            </>
          )}
          <button type="button" className="btn" onClick={() => setOpen(!open)} aria-expanded={open}>{open ? 'Hide' : 'Show'}</button>
        </span>
      </div>
      {open && <div className="max-h-56 min-h-[6rem] overflow-y-auto px-4 py-2" role="tabpanel" aria-label={tab} tabIndex={0}>{body}</div>}
      <CautionLine />
    </section>
  );
}

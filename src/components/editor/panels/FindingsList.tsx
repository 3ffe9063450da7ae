/** Findings grouped by severity, each told apart by word and glyph, with its basis and a "Show" action. */
import type { Finding, Severity } from '../../../lib/domain/report';
import { SeverityMark } from '../../ui/SeverityMark';

const GROUPS: { severity: Severity; title: string }[] = [
  { severity: 'blocker', title: 'Blockers' },
  { severity: 'warning', title: 'Warnings' },
  { severity: 'note', title: 'Notes' },
];
const BORDER: Record<Severity, string> = { blocker: 'border-blocker', warning: 'border-warning', note: 'border-note' };

export function FindingsList({ findings, onShow }: { findings: readonly Finding[]; onShow?: (f: Finding) => void }) {
  if (findings.length === 0) {
    return <p className="py-2" data-testid="findings-clear"><SeverityMark severity="clear">Clear</SeverityMark> — the check found nothing to fix.</p>;
  }
  return (
    <div className="space-y-3" data-testid="findings">
      {GROUPS.map(({ severity, title }) => {
        const list = findings.filter((f) => f.severity === severity);
        if (!list.length) return null;
        return (
          <section key={severity} aria-label={title}>
            <h4 className="mb-1 text-sm font-bold">{title} ({list.length})</h4>
            <ul className="space-y-2">
              {list.map((f, i) => (
                <li key={`${f.rule}-${f.elements.join('-')}-${i}`} className={`flex items-start gap-3 border-l-4 bg-white py-1 pl-3 ${severity === 'warning' ? 'border-dashed' : ''} ${BORDER[severity]}`} data-rule={f.rule} data-severity={severity}>
                  <div className="flex-1">
                    <p><SeverityMark severity={severity} /> <span className="text-sm text-note">{f.rule}</span></p>
                    <p>{f.message}</p>
                    <p className="text-sm text-note">Basis: {f.basis} · Elements: {f.elements.join(', ')}</p>
                  </div>
                  {onShow && f.elements.length > 0 && (
                    <button type="button" className="btn shrink-0" onClick={() => onShow(f)} aria-label={`Show ${f.elements.join(', ')}`}>Show</button>
                  )}
                </li>
              ))}
            </ul>
          </section>
        );
      })}
    </div>
  );
}

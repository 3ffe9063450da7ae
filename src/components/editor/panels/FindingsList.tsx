/** Findings grouped by severity, each told apart by word and glyph, with its basis and a "Show" action. */
import type { Finding, Severity } from '@/lib/domain/report';
import { RuleId } from '@/components/ui/RuleId';
import { SeverityMark } from '@/components/ui/SeverityMark';

const GROUPS: { severity: Severity; title: string }[] = [
  { severity: 'blocker', title: 'Blockers' },
  { severity: 'warning', title: 'Warnings' },
  { severity: 'note', title: 'Notes' },
];
/** Findings that say the same thing about different elements, as one group. */
export interface FindingGroup { finding: Finding; elements: string[]; count: number }

const escape = (t: string) => t.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

/**
 * Groups findings of one rule whose sentences are the same once their own element ids are taken
 * out ("Jumper j1 is underrated…" and "Jumper j2 is underrated…"): six identical clamp blockers
 * read as one finding listing the six leads.
 */
export function groupFindings(findings: readonly Finding[]): FindingGroup[] {
  const groups = new Map<string, FindingGroup>();
  for (const f of findings) {
    const masked = f.elements.reduce((m, id) => m.replace(new RegExp(`\\b${escape(id)}\\b`, 'g'), '\u0000'), f.message);
    const key = JSON.stringify([f.rule, f.severity, f.elements.length, masked]);
    const group = groups.get(key);
    if (group) {
      group.count += 1;
      for (const id of f.elements) if (!group.elements.includes(id)) group.elements.push(id);
    } else groups.set(key, { finding: f, elements: [...f.elements], count: 1 });
  }
  return [...groups.values()];
}

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
              {groupFindings(list).map(({ finding: f, elements, count }, i) => (
                <li key={`${f.rule}-${f.elements.join('-')}-${i}`} className={`flex items-start gap-3 border-l-4 bg-white py-1 pl-3 ${severity === 'warning' ? 'border-dashed' : ''} ${BORDER[severity]}`} data-rule={f.rule} data-severity={severity}>
                  <div className="flex-1">
                    <p><SeverityMark severity={severity} /> <RuleId rule={f.rule} /></p>
                    <p>{f.message}</p>
                    {count > 1 && <p className="text-sm font-semibold" data-testid="finding-group">The same for {count} places: {elements.join(', ')}</p>}
                    <p className="text-sm text-note">Basis: {f.basis} · Elements: {elements.join(', ')}</p>
                  </div>
                  {onShow && elements.length > 0 && (
                    <button type="button" className="btn shrink-0" onClick={() => onShow({ ...f, elements })} aria-label={`Show ${elements.join(', ')}`}>Show</button>
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

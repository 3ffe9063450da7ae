/** Severity as glyph + word + colour (screens.md); SeverityMark.astro renders this one for pages. */
export type MarkSeverity = 'blocker' | 'warning' | 'note' | 'clear';

const WORD: Record<MarkSeverity, string> = { blocker: 'Blocker', warning: 'Warning', note: 'Note', clear: 'Clear' };
export const SEVERITY_COLOUR: Record<MarkSeverity, string> = { blocker: '#b42318', warning: '#b54708', note: '#475467', clear: '#067647' };

export function SeverityGlyph({ severity, size = 16 }: { severity: MarkSeverity; size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 16 16" aria-hidden="true" style={{ color: SEVERITY_COLOUR[severity], flex: 'none' }}>
      {severity === 'blocker' && (<><path d="M5 1h6l4 4v6l-4 4H5l-4-4V5z" fill="currentColor" /><path d="M5.5 5.5l5 5M10.5 5.5l-5 5" stroke="white" strokeWidth="1.6" strokeLinecap="round" /></>)}
      {severity === 'warning' && (<><path d="M8 1.2L15 14H1z" fill="currentColor" /><path d="M8 6v4" stroke="white" strokeWidth="1.6" strokeLinecap="round" /><circle cx="8" cy="12" r="0.9" fill="white" /></>)}
      {severity === 'note' && (<><circle cx="8" cy="8" r="7" fill="currentColor" /><path d="M8 7v4.5" stroke="white" strokeWidth="1.6" strokeLinecap="round" /><circle cx="8" cy="4.6" r="0.9" fill="white" /></>)}
      {severity === 'clear' && (<><circle cx="8" cy="8" r="7" fill="currentColor" /><path d="M4.8 8.2l2.2 2.2 4.2-4.4" fill="none" stroke="white" strokeWidth="1.6" strokeLinecap="round" strokeLinejoin="round" /></>)}
    </svg>
  );
}

export function SeverityMark({ severity, children }: { severity: MarkSeverity; children?: React.ReactNode }) {
  return (
    <span className="inline-flex items-center gap-1 font-semibold" style={{ color: SEVERITY_COLOUR[severity] }} data-severity={severity}>
      <SeverityGlyph severity={severity} />
      {children ?? WORD[severity]}
    </span>
  );
}

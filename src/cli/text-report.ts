/**
 * The check report as a plain-text table for a terminal (`npm run check -- --text FILE`). The
 * JSON report is the contract; this is only a way to read it.
 */
import type { CheckReport, Figure } from '@/lib/domain/report';

const num = (value: Figure | undefined, digits: number) => (typeof value === 'number' ? value.toFixed(digits) : '—');

/** Left-aligned columns separated by two spaces, with a header row and a rule under it. */
export function formatTable(header: string[], rows: string[][]): string[] {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((row) => (row[i] ?? '').length)));
  const line = (cells: string[]) => cells.map((cell, i) => cell.padEnd(widths[i])).join('  ').trimEnd();
  return [line(header), line(widths.map((w) => '-'.repeat(w))), ...rows.map(line)];
}

const indent = (lines: string[]) => lines.map((l) => `  ${l}`);

/** Renders every part of the report: result, findings, fault, contacts, jumpers, rods, sets (when checked against an inventory), caution. */
export function formatTextReport(report: CheckReport, title?: string): string {
  const { blockers, warnings, notes } = report.summary;
  const out: string[] = [];
  if (title) out.push(`Plan: ${title}`);
  out.push(`Result: ${report.ok ? 'OK' : 'NOT OK'} (${blockers} blocker(s), ${warnings} warning(s), ${notes} note(s))`, '');

  out.push('Findings');
  if (report.findings.length === 0) out.push('  none');
  for (const f of report.findings) {
    out.push(`  [${f.severity.toUpperCase()}] ${f.rule}${f.elements.length ? ` (${f.elements.join(', ')})` : ''}`);
    out.push(`      ${f.message}`, `      basis: ${f.basis}`);
  }
  out.push('');

  const fault = report.fault;
  out.push(
    'Fault',
    `  ${num(fault.symmetricalKa, 2)} kA symmetrical for ${num(fault.durationS, 3)} s; decrement factor ${num(fault.decrementFactor, 3)} -> ${num(fault.asymmetricalKa, 2)} kA`,
    `  peak factor ${num(fault.peakFactor, 3)} -> ${num(fault.peakKa, 2)} kA peak; force between adjacent leads ${num(fault.peakForceNPerM, 1)} N/m`,
    `  injected for contacts and rods (Df x If) ${num(fault.injectedKa, 2)} kA; contact voltages capped at ${fault.lineToNeutralVolts == null ? '— (no nominal voltage)' : `${num(fault.lineToNeutralVolts, 0)} V line-to-neutral`}`,
    `  tolerable body current ${num(report.tolerableBodyAmps, 3)} A`,
    '',
  );

  out.push('Contacts');
  out.push(
    ...indent(
      formatTable(
        ['worker', 'surface', 'touch V', 'body A', 'limit A', 'status'],
        report.contacts.map((c) => [c.worker, c.surface, `${num(c.touchVolts, 1)}${c.systemVoltageLimited ? ' (capped)' : ''}`, num(c.bodyAmps, 4), num(c.limitAmps, 3), c.status ?? '']),
      ),
    ),
    '',
  );
  out.push('Jumpers');
  out.push(
    ...indent(
      formatTable(
        ['link', 'ohms', 'duty kA', 'cable kA', 'clamp kA'],
        report.jumpers.map((j) => [j.link, num(j.ohms, 5), num(j.dutyKa, 2), num(j.cableRatingKa, 1), num(j.clampRatingKa, 1)]),
      ),
    ),
    '',
  );
  out.push('Rods');
  out.push(
    ...indent(formatTable(['node', 'ohms', 'barricade m'], report.rods.map((r) => [r.node, num(r.ohms, 2), num(r.barricadeRadiusM, 1)]))),
    '',
  );
  if (report.sets) {
    out.push('Grounding sets');
    out.push(
      ...indent(
        formatTable(
          ['tag', 'jumpers', 'status', 'last test', 'test due', 'due'],
          report.sets.map((set) => [set.tag, set.jumpers.join(', '), set.known ? (set.status ?? '') : 'not on record', set.lastTestedOn ?? '—', set.testDueOn ?? '—', set.due ?? '—']),
        ),
      ),
      '',
    );
  }
  out.push('Caution', `  ${report.caution}`);
  return `${out.join('\n')}\n`;
}

/** The drawer's figure tabs: contacts per worker, jumpers, rods and the fault. */
import type { CheckReport, Figure } from '@/lib/domain/report';
import { formatFigure, formatForcePerLength, formatLength, milliampsNumber, type UnitSystem } from '@/lib/domain/units';
import type { PlanDocument } from '@/lib/schemas/plan';

export const fmt = (v: Figure | undefined, digits = 2): string => formatFigure(v, digits);
const ma = milliampsNumber;

function Table({ head, rows, empty, onRow }: { head: string[]; rows: (string | number)[][]; empty: string; onRow?: (i: number) => void }) {
  if (!rows.length) return <p className="py-2 text-note">{empty}</p>;
  return (
    <table className="w-full text-left num">
      <thead><tr>{head.map((h) => <th key={h} className="pr-4 font-semibold">{h}</th>)}</tr></thead>
      <tbody>
        {rows.map((r, i) => (
          <tr key={i} className={`border-t border-line ${onRow ? 'cursor-pointer hover:bg-paper' : ''}`} onClick={onRow ? () => onRow(i) : undefined}>
            {r.map((c, j) => <td key={j} className="py-1 pr-4">{c}</td>)}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export function WorkersTable({ report, onSelect }: { report: CheckReport; onSelect?: (ids: string[]) => void }) {
  const rows = report.contacts.map((c) => {
    const over = c.bodyAmps !== null && c.limitAmps !== null && c.bodyAmps > c.limitAmps;
    return [c.worker, c.surface, fmt(c.touchVolts, 1), ma(c.bodyAmps), ma(c.limitAmps), c.status === 'floating' ? 'Not solved (floating)' : over ? 'Over the limit' : 'Within the limit'];
  });
  return <Table head={['Worker', 'Touches', 'Touch volts (V)', 'Body current (mA)', 'Limit (mA)', '']} rows={rows} empty="No worker reaches a surface yet." onRow={onSelect ? (i) => onSelect([report.contacts[i].worker, report.contacts[i].surface]) : undefined} />;
}

export function JumpersTable({ report, doc, onSelect }: { report: CheckReport; doc: PlanDocument; onSelect?: (ids: string[]) => void }) {
  const cable = (id: string) => {
    const l = doc.links.find((x) => x.id === id);
    return l && l.kind === 'jumper' ? l.cable : '—';
  };
  const rows = report.jumpers.map((j) => [j.link, cable(j.link), fmt(j.ohms, 5), fmt(j.dutyKa), fmt(j.cableRatingKa), fmt(j.clampRatingKa)]);
  return <Table head={['Jumper', 'Cable', 'Impedance (Ω)', 'Duty (kA)', 'Cable rating (kA)', 'Clamp rating (kA)']} rows={rows} empty="No jumpers in the plan." onRow={onSelect ? (i) => onSelect([report.jumpers[i].link]) : undefined} />;
}

export function RodsTable({ report, units, onSelect }: { report: CheckReport; units: UnitSystem; onSelect?: (ids: string[]) => void }) {
  const rows = report.rods.map((r) => [r.node, fmt(r.ohms, 1), r.barricadeRadiusM === null || r.barricadeRadiusM === undefined ? '—' : formatLength(r.barricadeRadiusM, units)]);
  return <Table head={['Rod', 'Resistance (Ω)', 'Barricade radius']} rows={rows} empty="No driven rods in the plan." onRow={onSelect ? (i) => onSelect([report.rods[i].node]) : undefined} />;
}

export function FaultTable({ report, units = 'metric' }: { report: CheckReport; units?: UnitSystem }) {
  const f = report.fault;
  return (
    <dl className="grid max-w-xl grid-cols-2 gap-x-6 gap-y-1 num">
      <dt>Duration</dt><dd>{fmt(f.durationS, 3)} s</dd>
      <dt>Decrement factor</dt><dd>{fmt(f.decrementFactor, 3)}</dd>
      <dt>Asymmetrical current</dt><dd>{fmt(f.asymmetricalKa)} kA</dd>
      <dt>Peak factor</dt><dd>{fmt(f.peakFactor, 3)}</dd>
      <dt>Peak current</dt><dd>{fmt(f.peakKa)} kA</dd>
      <dt>Peak force on leads</dt><dd>{f.peakForceNPerM === null ? '— (no phase spacing)' : formatForcePerLength(f.peakForceNPerM, units)}</dd>
      <dt>Tolerable body current</dt><dd>{ma(report.tolerableBodyAmps)} mA</dd>
    </dl>
  );
}

/**
 * One canvas node for every kind: its glyph, id and label, a finding outline in the severity
 * colour with its glyph, and for a worker the badge with the worst body current against the
 * limit. `data` is the plan node; everything else is read from the store.
 */
import { memo } from 'react';
import { Handle, Position, type NodeProps, type NodeTypes } from 'reactflow';
import { NODE_KINDS, type PlanNode } from '@/lib/schemas/plan';
import { SEVERITY_COLOUR, SeverityGlyph } from '@/components/ui/SeverityMark';
import { selectSeverityOf, useEditor, worstContact } from '@/components/editor/selectors';
import { Glyph } from './Glyph';

const WORD = { blocker: 'Blocker', warning: 'Warning', note: 'Note' } as const;

function WorkerBadge({ id }: { id: string }) {
  const contact = useEditor((s) => worstContact(s.report, id));
  if (!contact || contact.bodyAmps === null || contact.limitAmps === null) return null;
  const over = contact.bodyAmps > contact.limitAmps;
  const ma = (a: number) => `${Math.round(a * 1000)}`;
  return (
    <span
      className={`absolute -top-4 left-1/2 -translate-x-1/2 whitespace-nowrap rounded-full border px-1.5 text-xs font-semibold num ${over ? 'border-blocker bg-blocker text-white' : 'border-line bg-white text-ink'}`}
      data-testid={`badge-${id}`}
      title={`Worst body current ${ma(contact.bodyAmps)} mA against a limit of ${ma(contact.limitAmps)} mA`}
    >
      {over ? '! ' : ''}{ma(contact.bodyAmps)}/{ma(contact.limitAmps)} mA
    </span>
  );
}

/** The numbers of review comments pinned to this element, as round ink markers. */
export function PinMarkers({ id, className }: { id: string; className: string }) {
  const numbers = useEditor((s) => s.pins[id]);
  if (!numbers?.length) return null;
  return (
    <span className={`flex gap-0.5 ${className}`} data-testid={`pin-${id}`} title={`Review comment${numbers.length > 1 ? 's' : ''} ${numbers.join(', ')}`}>
      {numbers.map((n) => (
        <span key={n} className="bm-pin flex h-6 min-w-6 items-center justify-center rounded-full bg-ink px-1 text-xs font-bold text-white num" data-pin={n}>{n}</span>
      ))}
    </span>
  );
}

export const PlanNodeView = memo(function PlanNodeView({ id, data, selected }: NodeProps<PlanNode>) {
  const severity = useEditor(selectSeverityOf(id));
  const linkFrom = useEditor((s) => s.linkFrom === id);
  // A new key per "Show" restarts the flash animation.
  const flash = useEditor((s) => (s.flashing.ids.includes(id) ? s.flashing.seq : 0));
  const material = data.kind === 'structure' || data.kind === 'crossarm' ? data.material : undefined;
  const phase = data.kind === 'phase' ? data.phase : undefined;
  const ring = severity ? SEVERITY_COLOUR[severity] : selected || linkFrom ? '#0f766e' : 'transparent';
  return (
    <div
      key={flash || undefined}
      className={`bm-node relative flex flex-col items-center${flash ? ' bm-flash' : ''}`}
      data-kind={data.kind}
      data-severity={severity ?? undefined}
      aria-label={`${data.label ?? data.kind} (${id})${severity ? `, ${WORD[severity]}` : ''}`}
    >
      <div
        className="bm-glyph-box relative flex h-14 w-14 items-center justify-center rounded-lg bg-white"
        style={{ outline: `${severity ? 3 : 2}px ${severity === 'warning' ? 'dashed' : 'solid'} ${ring}`, outlineOffset: 2, boxShadow: selected ? '0 0 0 6px rgba(15,118,110,.18)' : undefined }}
      >
        <Glyph kind={data.kind} material={material} phase={phase} />
        {severity && (
          <span className="absolute -left-3 -top-3 rounded-full bg-white" title={WORD[severity]}>
            <SeverityGlyph severity={severity} size={20} />
          </span>
        )}
        {data.kind === 'worker' && <WorkerBadge id={id} />}
        <PinMarkers id={id} className="absolute -right-3 -top-3" />
      </div>
      <div className="bm-label mt-1 max-w-[8rem] text-center text-xs leading-tight">
        <span className="font-semibold">{id}</span>
        {data.label && data.label !== id ? <span className="bm-label-detail block truncate text-note">{data.label}</span> : null}
      </div>
      <Handle type="source" position={Position.Top} className="bm-centre-handle" isConnectable={false} />
      <Handle type="target" position={Position.Top} className="bm-centre-handle" />
      <Handle type="source" id="nub" position={Position.Right} className="bm-nub" title="Drag to another element to draw a link" />
    </div>
  );
});

/** One entry per node kind, at module scope so React Flow never sees a new object. */
export const nodeTypes: NodeTypes = Object.fromEntries(NODE_KINDS.map((k) => [k, PlanNodeView]));

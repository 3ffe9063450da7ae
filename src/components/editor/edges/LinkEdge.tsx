/**
 * Links told apart by line and label, never colour alone (screens.md): jumper thick solid with
 * its cable-size tag, bond thin solid, reach dotted ending in an open-hand mark. A finding adds
 * an underlay in the severity colour and the severity glyph at the middle.
 */
import { memo } from 'react';
import { BaseEdge, type EdgeProps, type EdgeTypes } from 'reactflow';
import type { PlanLink } from '@/lib/schemas/plan';
import { cableTag } from '@/lib/domain/units';
import { SEVERITY_COLOUR } from '@/components/ui/SeverityMark';
import { selectSeverityOf, useEditor } from '@/components/editor/selectors';

const INK = '#1b2330';
const NODE_RADIUS = 46;

/** The open hand drawn where a reach ends, pointing along the reach. */
function HandMark({ x, y, angle }: { x: number; y: number; angle: number }) {
  return (
    <g transform={`translate(${x} ${y}) rotate(${angle})`} fill="white" stroke={INK} strokeWidth={1.6} strokeLinejoin="round" strokeLinecap="round">
      <path d="M-7 -6 h7 a3 3 0 0 1 0 6 h-7z" />
      <path d="M0 -6 h6 M0 -2 h8 M0 2 h8 M0 6 h6 M-4 -6 l3 -5" fill="none" />
    </g>
  );
}

function SeverityBadge({ x, y, severity }: { x: number; y: number; severity: 'blocker' | 'warning' | 'note' }) {
  const c = SEVERITY_COLOUR[severity];
  return (
    <g transform={`translate(${x - 9} ${y - 26})`}>
      {severity === 'blocker' && <path d="M6 0h6l6 6v6l-6 6H6l-6-6V6z" fill={c} />}
      {severity === 'warning' && <path d="M9 0l9 17H0z" fill={c} />}
      {severity === 'note' && <circle cx="9" cy="9" r="8.5" fill={c} />}
      <text x="9" y="13.5" textAnchor="middle" fontSize="12" fontWeight="700" fill="white">{severity === 'note' ? 'i' : '!'}</text>
    </g>
  );
}

export const LinkEdge = memo(function LinkEdge({ id, sourceX, sourceY, targetX, targetY, data, selected }: EdgeProps<PlanLink>) {
  const severity = useEditor(selectSeverityOf(id));
  const pins = useEditor((s) => s.pins[id]);
  const flash = useEditor((s) => (s.flashing.ids.includes(id) ? s.flashing.seq : 0));
  if (!data) return null;
  const dx = targetX - sourceX;
  const dy = targetY - sourceY;
  const len = Math.hypot(dx, dy) || 1;
  const ux = dx / len;
  const uy = dy / len;
  const isReach = data.kind === 'reach';
  const endX = isReach ? targetX - ux * NODE_RADIUS : targetX;
  const endY = isReach ? targetY - uy * NODE_RADIUS : targetY;
  const path = `M${sourceX},${sourceY} L${endX},${endY}`;
  const midX = (sourceX + targetX) / 2;
  const midY = (sourceY + targetY) / 2;
  const style =
    data.kind === 'jumper' ? { stroke: INK, strokeWidth: 5 } : data.kind === 'bond' ? { stroke: INK, strokeWidth: 1.5 } : { stroke: INK, strokeWidth: 2.5, strokeDasharray: '0.5 6', strokeLinecap: 'round' as const };
  const halo = severity ? SEVERITY_COLOUR[severity] : selected ? '#0f766e' : null;
  // The name the findings use (label, else id) is on the drawing, beside the cable size.
  const name = data.label?.trim() || id;
  const tag = data.kind === 'jumper' ? `${name} · ${cableTag(data.cable)}` : data.kind === 'bond' ? `${name} bond` : null;
  return (
    <g key={flash || undefined} data-testid={`link-${id}`} data-kind={data.kind} data-severity={severity ?? undefined} className={flash ? 'bm-flash' : undefined}>
      {halo && <path d={path} fill="none" stroke={halo} strokeOpacity={0.4} strokeWidth={style.strokeWidth + 8} strokeLinecap="round" />}
      <BaseEdge id={id} path={path} style={style} interactionWidth={28} />
      {isReach && <HandMark x={endX} y={endY} angle={(Math.atan2(uy, ux) * 180) / Math.PI} />}
      {tag && (
        <g transform={`translate(${midX} ${midY})`}>
          <rect x={-tag.length * 4 - 6} y={-10} width={tag.length * 8 + 12} height={20} rx={4} fill="white" stroke={INK} strokeWidth={data.kind === 'jumper' ? 1.5 : 1} />
          <text y={4.5} textAnchor="middle" fontSize={data.kind === 'jumper' ? 13 : 11} fontWeight={data.kind === 'jumper' ? 700 : 400} fill={INK}>{tag}</text>
        </g>
      )}
      {severity && <SeverityBadge x={midX + (tag ? tag.length * 4 + 18 : 0)} y={midY + 18} severity={severity} />}
      {pins?.length ? (
        <g data-testid={`pin-${id}`} transform={`translate(${midX - (tag ? tag.length * 4 + 20 : 0)} ${midY - 18})`}>
          {pins.map((n, i) => (
            <g key={n} transform={`translate(${-i * 26} 0)`}>
              <circle r={11} fill={INK} />
              <text y={4} textAnchor="middle" fontSize={11} fontWeight={700} fill="white">{n}</text>
            </g>
          ))}
        </g>
      ) : null}
    </g>
  );
});

export const edgeTypes: EdgeTypes = { jumper: LinkEdge, bond: LinkEdge, reach: LinkEdge };

/**
 * Our canvas glyphs (screens.md, "Canvas glyphs"): plain geometric SVG in ink, 40×40 units.
 * Materials: wood hatched, steel solid, concrete dotted, fiberglass outlined.
 */
import { memo } from 'react';
import type { Material, NodeKind } from '@/lib/schemas/plan';

const INK = '#1b2330';
const s = { fill: 'none', stroke: INK, strokeWidth: 2, strokeLinecap: 'round' as const, strokeLinejoin: 'round' as const };

function MaterialDefs() {
  return (
    <defs>
      <pattern id="bm-hatch" width="5" height="5" patternUnits="userSpaceOnUse" patternTransform="rotate(45)"><path d="M0 0v5" stroke={INK} strokeWidth="1.4" /></pattern>
      <pattern id="bm-dots" width="5" height="5" patternUnits="userSpaceOnUse"><circle cx="2.5" cy="2.5" r="1" fill={INK} /></pattern>
    </defs>
  );
}
const materialFill = (m: Material | undefined) => (m === 'steel' ? INK : m === 'concrete' ? 'url(#bm-dots)' : m === 'fiberglass' ? 'white' : 'url(#bm-hatch)');

function Letter({ text }: { text: string }) {
  return (
    <>
      <circle cx="20" cy="20" r="15" {...s} fill="white" />
      <text x="20" y="25.5" textAnchor="middle" fontSize={text.length > 1 ? 12 : 16} fontWeight="700" fill={INK} fontFamily="inherit">{text}</text>
    </>
  );
}

function GroundSymbol({ dashed = false, y = 14 }: { dashed?: boolean; y?: number }) {
  const d = dashed ? { strokeDasharray: '3 2.5' } : {};
  return (
    <>
      <path d={`M20 4V${y}`} {...s} {...d} />
      <path d={`M9 ${y}h22M13 ${y + 6}h14M17 ${y + 12}h6`} {...s} {...d} />
    </>
  );
}

export interface GlyphProps { kind: NodeKind; material?: Material; phase?: string; size?: number }

export const Glyph = memo(function Glyph({ kind, material, phase, size = 40 }: GlyphProps) {
  let body: React.ReactNode;
  switch (kind) {
    case 'phase': body = <Letter text={(phase ?? '?').slice(0, 2)} />; break;
    case 'neutral': body = <Letter text="N" />; break;
    case 'shield-wire': body = <Letter text="S" />; break;
    case 'structure': body = <rect x="14" y="3" width="12" height="34" rx="1" {...s} fill={materialFill(material)} />; break;
    case 'crossarm': body = <rect x="3" y="15" width="34" height="10" rx="1" {...s} fill={materialFill(material)} />; break;
    case 'hardware': body = <rect x="13" y="13" width="14" height="14" rx="1.5" {...s} fill="white" />; break;
    case 'cluster-bar': body = (<><rect x="4" y="16" width="32" height="8" rx="2" {...s} fill={INK} /><path d="M11 16v-6M20 16v-6M29 16v-6" {...s} strokeWidth={3} /></>); break;
    case 'ground-rod': body = (<><path d="M20 3v22l-2-3M20 25l2-3" {...s} strokeWidth={2.5} /><path d="M6 26h28M10 31h20M14 36h12" {...s} /></>); break;
    case 'earth': body = <GroundSymbol />; break;
    case 'pole-ground': body = <GroundSymbol dashed />; break;
    case 'mat': body = (<><rect x="6" y="10" width="28" height="20" {...s} fill="white" /><path d="M6 20h28M15.3 10v20M24.6 10v20" {...s} strokeWidth={1.4} /></>); break;
    case 'bucket': body = <path d="M8 10h24l-3 22H11z M8 10h24" {...s} fill="white" />; break;
    case 'truck': body = (<><path d="M3 12h22v14H3zM25 17h7l5 5v4H25z" {...s} fill="white" /><circle cx="10" cy="30" r="3.5" {...s} fill="white" /><circle cx="30" cy="30" r="3.5" {...s} fill="white" /></>); break;
    case 'supply-end': body = <path d="M4 20h24M20 12l8 8-8 8M32 8v24" {...s} strokeWidth={2.5} />; break;
    case 'worker': body = (<><circle cx="20" cy="8" r="4.5" {...s} fill="white" /><path d="M20 13v13M11 18l9-2 9 2M20 26l-6 10M20 26l6 10" {...s} /></>); break;
  }
  return (
    <svg width={size} height={size} viewBox="0 0 40 40" aria-hidden="true" focusable="false">
      {(kind === 'structure' || kind === 'crossarm') && <MaterialDefs />}
      {body}
    </svg>
  );
});

/**
 * The palette: every node kind in four groups, tap to place at the middle of the view or drag
 * onto the canvas; below it the three link tools (tap the two ends, or drag from a node's nub).
 */
import { memo } from 'react';
import type { LinkKind, NodeKind } from '@/lib/schemas/plan';
import { Glyph } from '@/components/editor/nodes/Glyph';
import { KIND_LABELS, LINK_LABELS } from '@/components/editor/plan-ops';
import { useEditor } from '@/components/editor/selectors';

export const PALETTE_GROUPS: { name: string; kinds: NodeKind[] }[] = [
  { name: 'Conductors', kinds: ['phase', 'neutral', 'shield-wire', 'supply-end'] },
  { name: 'Structure', kinds: ['structure', 'crossarm', 'hardware'] },
  { name: 'Grounding', kinds: ['cluster-bar', 'ground-rod', 'earth', 'pole-ground', 'mat'] },
  { name: 'People and equipment', kinds: ['worker', 'bucket', 'truck'] },
];

/** One line each on what the three links are, shown under their tools. */
export const LINK_HINTS: Record<LinkKind, string> = {
  jumper: 'A temporary grounding lead you install; rated against the fault current.',
  bond: 'A permanent connection already in place; never use it to ground a phase.',
  reach: 'What a worker can touch from where they stand; carries no current.',
};

export const DRAG_TYPE = 'application/x-bondmap-kind';

export function LineSample({ kind }: { kind: LinkKind }) {
  return (
    <svg width="36" height="16" viewBox="0 0 36 16" aria-hidden="true">
      {kind === 'jumper' && <path d="M2 8h32" stroke="#1b2330" strokeWidth="5" />}
      {kind === 'bond' && <path d="M2 8h32" stroke="#1b2330" strokeWidth="1.5" />}
      {kind === 'reach' && (<><path d="M2 8h24" stroke="#1b2330" strokeWidth="2.5" strokeDasharray="0.5 5" strokeLinecap="round" /><path d="M26 4h5a3 3 0 010 8h-5z" fill="white" stroke="#1b2330" strokeWidth="1.4" /></>)}
    </svg>
  );
}

export const Palette = memo(function Palette({ onPlace }: { onPlace: (kind: NodeKind) => void }) {
  const linkTool = useEditor((s) => s.linkTool);
  const armLinkTool = useEditor((s) => s.armLinkTool);
  return (
    <nav aria-label="Palette" className="h-full overflow-y-auto border-r border-line bg-white p-3" data-testid="palette">
      {PALETTE_GROUPS.map((g) => (
        <section key={g.name} className="mb-4">
          <h3 className="mb-1 text-xs font-bold uppercase tracking-wide text-note">{g.name}</h3>
          <ul className="grid grid-cols-1 gap-1">
            {g.kinds.map((kind) => (
              <li key={kind}>
                <button
                  type="button"
                  className="flex min-h-touch w-full items-center gap-2 rounded-md px-2 text-left text-sm font-semibold hover:bg-paper"
                  draggable
                  onDragStart={(e) => {
                    e.dataTransfer.setData(DRAG_TYPE, kind);
                    e.dataTransfer.effectAllowed = 'copy';
                  }}
                  onClick={() => onPlace(kind)}
                >
                  <Glyph kind={kind} size={30} material={kind === 'structure' || kind === 'crossarm' ? 'wood' : undefined} phase="A" />
                  {/* The name is the visible text with "Add" before it (no aria-label: a glyph's letter would not be in it). */}
                  <span className="sr-only">Add </span>
                  {KIND_LABELS[kind]}
                </button>
              </li>
            ))}
          </ul>
        </section>
      ))}
      <section>
        <h3 className="mb-1 text-xs font-bold uppercase tracking-wide text-note">Draw a link</h3>
        <ul className="grid gap-1">
          {(['jumper', 'bond', 'reach'] as const).map((kind) => (
            <li key={kind}>
              <button
                type="button"
                aria-pressed={linkTool === kind}
                onClick={() => armLinkTool(linkTool === kind ? null : kind)}
                className={`flex min-h-touch w-full items-center gap-2 rounded-md border px-2 text-sm font-semibold ${linkTool === kind ? 'border-accent bg-accent text-white' : 'border-transparent hover:bg-paper'}`}
              >
                <span className={linkTool === kind ? 'rounded bg-white px-0.5' : ''}><LineSample kind={kind} /></span>
                {LINK_LABELS[kind]}
              </button>
              <p className="px-2 pb-1 text-xs leading-snug text-note" data-testid={`tool-hint-${kind}`}>{LINK_HINTS[kind]}</p>
            </li>
          ))}
        </ul>
      </section>
    </nav>
  );
});

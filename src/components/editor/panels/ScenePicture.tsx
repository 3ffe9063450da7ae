/** The export drawing (drawing-scene.ts) as an inline SVG, for the print sheet: vector, no copy of the canvas. */
import type { Shape } from '@/components/editor/drawing-scene';
import { INK } from '@/components/editor/drawing-scene';

export function ScenePicture({ shapes, width, height, title }: { shapes: Shape[]; width: number; height: number; title: string }) {
  return (
    <svg viewBox={`0 0 ${width} ${height}`} className="w-full border border-line bg-white" role="img" aria-label={title} data-testid="print-drawing" strokeLinecap="round" strokeLinejoin="round">
      {shapes.map((s, i) =>
        s.t === 'text' ? (
          <text key={i} x={s.x} y={s.y} fontSize={s.size} fontWeight={s.bold ? 700 : 400} fill={s.colour ?? INK} textAnchor="middle">{s.text}</text>
        ) : s.t === 'circle' ? (
          <circle key={i} cx={s.x} cy={s.y} r={s.r} fill={s.fill ?? 'none'} stroke={s.stroke} strokeWidth={s.width} />
        ) : s.close ? (
          <polygon key={i} points={s.pts.join(' ')} fill={s.fill ?? 'none'} stroke={s.stroke} strokeWidth={s.width} strokeDasharray={s.dash?.join(' ')} />
        ) : (
          <polyline key={i} points={s.pts.join(' ')} fill="none" stroke={s.stroke} strokeWidth={s.width} strokeDasharray={s.dash?.join(' ')} />
        ),
      )}
    </svg>
  );
}

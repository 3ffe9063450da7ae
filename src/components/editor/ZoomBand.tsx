/**
 * Keeps the canvas legible when zoomed out (Fit on a tablet with the drawer open): writes the
 * inverse zoom as `--bm-inv-zoom` on the canvas, which editor.css uses to keep labels and
 * comment markers at a minimum size on screen, and a zoom band as `data-zoom` ("far" below
 * 0.55: the second label line is hidden so the enlarged ids do not pile up). Renders nothing,
 * so zooming does not re-render the canvas.
 */
import { useEffect, type RefObject } from 'react';
import { useStore } from 'reactflow';

export const FAR_ZOOM = 0.55;

export function ZoomBand({ target }: { target: RefObject<HTMLElement | null> }) {
  const zoom = useStore((s) => s.transform[2]);
  useEffect(() => {
    const el = target.current;
    if (!el) return;
    el.style.setProperty('--bm-inv-zoom', String(1 / zoom));
    el.dataset.zoom = zoom < FAR_ZOOM ? 'far' : 'near';
  }, [zoom, target]);
  return null;
}

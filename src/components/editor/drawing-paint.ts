/** Painters for the export drawing (drawing-scene.ts): a 2D canvas for the PNG, jsPDF vectors for the PDF. */
import type { jsPDF } from 'jspdf';
import { INK, type Shape } from './drawing-scene';

export const CANVAS_FONT = '"Source Sans 3", "Source Sans 3 Variable", system-ui, sans-serif';

export function paintCanvas(ctx: CanvasRenderingContext2D, shapes: Shape[]): void {
  ctx.lineCap = 'round';
  ctx.lineJoin = 'round';
  ctx.textAlign = 'center';
  for (const s of shapes) {
    ctx.beginPath();
    if (s.t === 'text') {
      ctx.fillStyle = s.colour ?? INK;
      ctx.font = `${s.bold ? 700 : 400} ${s.size}px ${CANVAS_FONT}`;
      ctx.fillText(s.text, s.x, s.y);
      continue;
    }
    if (s.t === 'circle') ctx.arc(s.x, s.y, s.r, 0, Math.PI * 2);
    else {
      ctx.moveTo(s.pts[0], s.pts[1]);
      for (let i = 2; i < s.pts.length; i += 2) ctx.lineTo(s.pts[i], s.pts[i + 1]);
      if (s.close) ctx.closePath();
    }
    ctx.setLineDash(s.t === 'poly' && s.dash ? s.dash : []);
    if (s.fill) {
      ctx.fillStyle = s.fill;
      ctx.fill();
    }
    if (s.stroke && s.width > 0) {
      ctx.strokeStyle = s.stroke;
      ctx.lineWidth = s.width;
      ctx.stroke();
    }
  }
  ctx.setLineDash([]);
}

const rgb = (hex: string): [number, number, number] => (hex === 'white' ? [255, 255, 255] : [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16)) as [number, number, number]);

/** Shapes in mm, already placed on the page; `font` is the embedded family. */
export function paintPdf(pdf: jsPDF, shapes: Shape[], font: string, clean: (t: string) => string): void {
  pdf.setLineCap('round');
  pdf.setLineJoin('round');
  for (const s of shapes) {
    if (s.t === 'text') {
      pdf.setFont(font, s.bold ? 'bold' : 'normal');
      pdf.setFontSize(s.size / 0.3528);
      pdf.setTextColor(...rgb(s.colour ?? INK));
      pdf.text(clean(s.text), s.x, s.y, { align: 'center' });
      continue;
    }
    const style = s.fill && s.stroke && s.width > 0 ? 'FD' : s.fill ? 'F' : 'S';
    if (s.fill) pdf.setFillColor(...rgb(s.fill));
    if (s.stroke) pdf.setDrawColor(...rgb(s.stroke));
    pdf.setLineWidth(Math.max(s.width, 0.01));
    if (s.t === 'circle') {
      pdf.circle(s.x, s.y, s.r, style);
      continue;
    }
    pdf.setLineDashPattern(s.dash ?? [], 0);
    const deltas: number[][] = [];
    for (let i = 2; i < s.pts.length; i += 2) deltas.push([s.pts[i] - s.pts[i - 2], s.pts[i + 1] - s.pts[i - 1]]);
    pdf.lines(deltas, s.pts[0], s.pts[1], [1, 1], s.close ? style : 'S', !!s.close);
  }
  pdf.setLineDashPattern([], 0);
  pdf.setTextColor(0, 0, 0);
}

// Trend charts drawn straight into the PDF as vector paths (rectangles and lines): no canvas
// package, nothing rasterised, sharp at any zoom. Each bar carries its value as text, and the
// survey of the report is marked in words as well as by its fuller colour.

export type BarPoint = { label: string; value: number | null; current: boolean };

export type BarChart = {
  x: number; y: number; width: number; height: number;
  title: string;
  points: BarPoint[];
  color: string;
  /** How a value is printed on its bar and on the axis. */
  format: (v: number) => string;
  fonts: { regular: string; bold: string };
};

/** A round upper bound for the axis: 1, 2, 2.5 or 5 times a power of ten, at least `max`. */
export function niceCeiling(max: number): number {
  if (!(max > 0)) return 1;
  const power = 10 ** Math.floor(Math.log10(max));
  for (const step of [1, 2, 2.5, 5, 10]) if (step * power >= max) return step * power;
  return 10 * power;
}

export function drawBarChart(doc: PDFKit.PDFDocument, c: BarChart): void {
  const titleH = 16;
  const labelH = 26;
  const axisW = 40;
  const plot = { x: c.x + axisW, y: c.y + titleH + 10, w: c.width - axisW, h: c.height - titleH - 10 - labelH };
  doc.font(c.fonts.bold).fontSize(9).fillColor('#1f2623').text(c.title, c.x, c.y, { width: c.width, lineBreak: false });

  const values = c.points.map((p) => p.value ?? 0);
  const top = niceCeiling(Math.max(...values, 0));
  const ticks = 4;
  doc.font(c.fonts.regular).fontSize(7);
  for (let i = 0; i <= ticks; i++) {
    const v = (top * i) / ticks;
    const gy = plot.y + plot.h - (plot.h * i) / ticks;
    doc.moveTo(plot.x, gy).lineTo(plot.x + plot.w, gy).lineWidth(0.5).strokeColor(i === 0 ? '#4d5652' : '#dfe3dd').stroke();
    doc.fillColor('#4d5652').text(c.format(v), c.x, gy - 3.5, { width: axisW - 4, align: 'right', lineBreak: false });
  }

  const n = Math.max(c.points.length, 1);
  const slot = plot.w / n;
  const barW = Math.min(38, slot * 0.6);
  c.points.forEach((p, i) => {
    const cx = plot.x + slot * i + slot / 2;
    if (p.value !== null) {
      const h = top > 0 ? (plot.h * p.value) / top : 0;
      doc.rect(cx - barW / 2, plot.y + plot.h - h, barW, Math.max(h, 0.5)).fillOpacity(p.current ? 1 : 0.45).fill(c.color);
      doc.fillOpacity(1).font(c.fonts.bold).fontSize(7).fillColor('#1f2623')
        .text(c.format(p.value), cx - slot / 2, plot.y + plot.h - h - 10, { width: slot, align: 'center', lineBreak: false });
    } else {
      doc.fillOpacity(1).font(c.fonts.regular).fontSize(7).fillColor('#4d5652')
        .text('not tested', cx - slot / 2, plot.y + plot.h - 10, { width: slot, align: 'center', lineBreak: false });
    }
    doc.font(p.current ? c.fonts.bold : c.fonts.regular).fontSize(7).fillColor('#1f2623')
      .text(p.label, cx - slot / 2, plot.y + plot.h + 4, { width: slot, align: 'center', lineBreak: false });
    if (p.current) {
      doc.font(c.fonts.regular).fontSize(6.5).fillColor('#4d5652')
        .text('this survey', cx - slot / 2, plot.y + plot.h + 13, { width: slot, align: 'center', lineBreak: false });
    }
  });
  doc.fillOpacity(1).fillColor('#1f2623');
}

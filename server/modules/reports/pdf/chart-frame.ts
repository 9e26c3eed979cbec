// The frame both charts share: rounded tick steps, data-to-page mapping, light grid lines, tick
// labels in the figures face and axis titles. Everything is drawn as vector paths.
import { FONT } from './fonts';
import { place, textWidth } from './layout';
import { INK } from './theme';

export interface Plot {
  left: number;
  top: number;
  width: number;
  height: number;
  xMin: number;
  xMax: number;
  yMin: number;
  yMax: number;
  /** Larger x values to the left (months before a date read best with the date on the right). */
  xReversed?: boolean;
}

export interface Ticks {
  min: number;
  max: number;
  values: number[];
}

/** Tick values on a 1–2–2.5–5 step (or the steps given) that cover [min, max] with about `target` intervals. */
export function niceTicks(min: number, max: number, target = 5, steps: readonly number[] = [1, 2, 2.5, 5, 10]): Ticks {
  if (!Number.isFinite(min) || !Number.isFinite(max)) return { min: 0, max: 1, values: [0, 1] };
  if (max - min < 1e-9) {
    const pad = Math.abs(min) * 0.1 || 1;
    return niceTicks(min - pad, max + pad, target, steps);
  }
  const raw = (max - min) / target;
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  const step = (steps.find((m) => m * magnitude >= raw) ?? 10) * magnitude;
  const lo = Math.floor(min / step) * step;
  const hi = Math.ceil(max / step) * step;
  const values: number[] = [];
  for (let v = lo; v <= hi + step / 2; v += step) values.push(Number(v.toPrecision(12)));
  return { min: lo, max: hi, values };
}

export function toPageX(plot: Plot, v: number): number {
  const t = (v - plot.xMin) / (plot.xMax - plot.xMin);
  return plot.left + (plot.xReversed ? 1 - t : t) * plot.width;
}

export function toPageY(plot: Plot, v: number): number {
  return plot.top + plot.height - ((v - plot.yMin) / (plot.yMax - plot.yMin)) * plot.height;
}

export interface FrameLabels {
  xTicks: readonly number[];
  yTicks: readonly number[];
  xFormat: (v: number) => string;
  yFormat: (v: number) => string;
  xTitle: string;
  yTitle: string;
}

export function drawFrame(doc: PDFKit.PDFDocument, plot: Plot, labels: FrameLabels): void {
  const right = plot.left + plot.width;
  const bottom = plot.top + plot.height;
  doc.save().lineWidth(0.4).strokeColor(INK.rule);
  for (const v of labels.yTicks) doc.moveTo(plot.left, toPageY(plot, v)).lineTo(right, toPageY(plot, v)).stroke();
  for (const v of labels.xTicks) doc.moveTo(toPageX(plot, v), plot.top).lineTo(toPageX(plot, v), bottom).stroke();
  doc.restore();
  doc.save().lineWidth(0.8).strokeColor(INK.soft).moveTo(plot.left, plot.top).lineTo(plot.left, bottom).lineTo(right, bottom).stroke().restore();

  const tickStyle = { font: FONT.figures, size: 6.8, colour: INK.soft } as const;
  for (const v of labels.yTicks) {
    const text = labels.yFormat(v);
    const w = textWidth(doc, text, tickStyle);
    place(doc, text, plot.left - 5 - w, toPageY(plot, v) - 3.6, { ...tickStyle, width: w + 2 });
    doc.save().lineWidth(0.8).strokeColor(INK.soft).moveTo(plot.left - 3, toPageY(plot, v)).lineTo(plot.left, toPageY(plot, v)).stroke().restore();
  }
  for (const v of labels.xTicks) {
    const text = labels.xFormat(v);
    const w = textWidth(doc, text, tickStyle);
    place(doc, text, toPageX(plot, v) - w / 2, bottom + 5, { ...tickStyle, width: w + 2 });
    doc.save().lineWidth(0.8).strokeColor(INK.soft).moveTo(toPageX(plot, v), bottom).lineTo(toPageX(plot, v), bottom + 3).stroke().restore();
  }
  const titleStyle = { font: FONT.textMedium, size: 7.6, colour: INK.ink } as const;
  const xw = textWidth(doc, labels.xTitle, titleStyle);
  place(doc, labels.xTitle, plot.left + plot.width / 2 - xw / 2, bottom + 17, { ...titleStyle, width: xw + 2 });
  // The y title reads bottom-to-top beside the tick labels.
  const yw = textWidth(doc, labels.yTitle, titleStyle);
  doc.save();
  doc.rotate(-90, { origin: [plot.left - 46, plot.top + plot.height / 2] });
  place(doc, labels.yTitle, plot.left - 46 - yw / 2, plot.top + plot.height / 2 - 4, { ...titleStyle, width: yw + 2 });
  doc.restore();
}

/** Runs `draw` with everything outside the plot area cut away. */
export function clipped(doc: PDFKit.PDFDocument, plot: Plot, draw: () => void): void {
  doc.save();
  doc.rect(plot.left, plot.top, plot.width, plot.height).clip();
  draw();
  doc.restore();
}

/** A framed note where a chart cannot be drawn. */
export function chartPlaceholder(doc: PDFKit.PDFDocument, x: number, y: number, width: number, height: number, message: string): void {
  doc.save().rect(x, y, width, height).lineWidth(0.6).dash(3, { space: 3 }).strokeColor(INK.ruleStrong).stroke().undash().restore();
  place(doc, message, x + 20, y + height / 2 - 10, { size: 8.5, colour: INK.soft, width: width - 40, align: 'center' });
}

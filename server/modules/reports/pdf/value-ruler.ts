// One horizontal money scale that sets the value figures side by side: the regression's 95%
// prediction interval, the range of the grid sales' adjusted prices, the estimate and the opinion.
import { niceTicks } from './chart-frame';
import { FONT } from './fonts';
import { compactMoney } from './format';
import { place, textWidth } from './layout';
import { ACCENT, INK, STATE } from './theme';

export interface RulerFigures {
  interval: [number, number] | null;
  estimate: number | null;
  adjustedRange: [number, number] | null;
  opinion: number | null;
  currency: string;
}

const finite = (v: number | null | undefined): v is number => typeof v === 'number' && Number.isFinite(v);

function diamond(doc: PDFKit.PDFDocument, x: number, y: number, r: number, fill: string, stroke?: string): void {
  doc.save().polygon([x, y - r], [x + r, y], [x, y + r], [x - r, y]);
  if (stroke) doc.lineWidth(1).fillAndStroke(fill, stroke);
  else doc.fill(fill);
  doc.restore();
}

export function valueRuler(doc: PDFKit.PDFDocument, box: { left: number; top: number; width: number }, f: RulerFigures): void {
  const values = [...(f.interval ?? []), ...(f.adjustedRange ?? []), f.estimate, f.opinion].filter(finite);
  if (values.length === 0) return;
  const lo = Math.min(...values);
  const hi = Math.max(...values);
  const pad = (hi - lo) * 0.08 || hi * 0.05 || 1;
  const ticks = niceTicks(lo - pad, hi + pad, 6);
  const x = (v: number) => box.left + ((v - ticks.min) / (ticks.max - ticks.min)) * box.width;
  const y = box.top;

  if (f.interval) doc.save().rect(x(f.interval[0]), y, x(f.interval[1]) - x(f.interval[0]), 10).fill('#e4dccb').restore();
  if (f.adjustedRange) doc.save().rect(x(f.adjustedRange[0]), y + 3.5, Math.max(x(f.adjustedRange[1]) - x(f.adjustedRange[0]), 1.5), 3).fill(STATE.teal).restore();
  if (finite(f.estimate)) diamond(doc, x(f.estimate), y + 5, 4.5, '#ffffff', INK.ink);
  if (finite(f.opinion)) diamond(doc, x(f.opinion), y + 5, 5, ACCENT.ochre);

  const axisY = y + 16;
  doc.save().moveTo(box.left, axisY).lineTo(box.left + box.width, axisY).lineWidth(0.6).strokeColor(INK.ruleStrong).stroke().restore();
  const style = { font: FONT.figures, size: 6.6, colour: INK.faint } as const;
  for (const v of ticks.values) {
    doc.save().moveTo(x(v), axisY).lineTo(x(v), axisY + 2.5).lineWidth(0.6).strokeColor(INK.ruleStrong).stroke().restore();
    const text = compactMoney(v, f.currency);
    const w = textWidth(doc, text, style);
    place(doc, text, x(v) - w / 2, axisY + 4, { ...style, width: w + 2 });
  }

  const legendY = axisY + 17;
  const label = { size: 6.8, colour: INK.soft } as const;
  let lx = box.left;
  const say = (text: string) => {
    const w = textWidth(doc, text, label);
    place(doc, text, lx, legendY - 3.6, { ...label, width: w + 2 });
    lx += w + 14;
  };
  if (f.interval) {
    doc.save().rect(lx, legendY - 4, 14, 8).fill('#e4dccb').restore();
    lx += 18;
    say('95% prediction interval');
  }
  if (f.adjustedRange) {
    doc.save().rect(lx, legendY - 1.5, 14, 3).fill(STATE.teal).restore();
    lx += 18;
    say('Range of adjusted grid prices');
  }
  if (finite(f.estimate)) {
    diamond(doc, lx + 4, legendY, 3.8, '#ffffff', INK.ink);
    lx += 12;
    say('Regression estimate');
  }
  if (finite(f.opinion)) {
    diamond(doc, lx + 4, legendY, 4, ACCENT.ochre);
    lx += 12;
    say('Opinion of value');
  }
}

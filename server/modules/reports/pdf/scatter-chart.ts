// Price against floor area for the subject's neighbourhood, drawn as vectors: the 95% prediction
// band, the fitted line, each sale coloured by its residual (teal below the line, rust above),
// flagged sales ringed in magenta, and the subject's estimate with its interval.
import type { FitSummary, GroupAnalysis } from '../../../contracts/analysis';
import { chartPlaceholder, clipped, drawFrame, niceTicks, toPageX, toPageY, type Plot } from './chart-frame';
import { FONT } from './fonts';
import { area, areaSymbol, compactMoney, count, decimal, money, perArea, type Units } from './format';
import { place } from './layout';
import { ACCENT, FLAG_RING, INK, PAGE, residualColour } from './theme';

export interface ScatterInput {
  group: GroupAnalysis | null;
  flaggedIds: ReadonlySet<number>;
  opinionOfValue: number | null;
  timeAdjusted: boolean;
  units: Units;
}

/** Half-width of the 95% prediction band at x: t·s·√(1 + 1/n + (x − x̄)²/Sxx), with Sxx recovered
 * from the slope's standard error (SE(b) = s/√Sxx). Null when the fit leaves no scatter to measure. */
export function predictionHalfWidth(fit: FitSummary, x: number): number | null {
  const s = fit.residualStdError;
  if (!(s > 0) || !(fit.slopeStdError > 0) || fit.n < 3) return null;
  const sxx = (s / fit.slopeStdError) ** 2;
  const half = fit.tCritical * s * Math.sqrt(1 + 1 / fit.n + (x - fit.xMean) ** 2 / sxx);
  return Number.isFinite(half) ? half : null;
}

const lineAt = (fit: FitSummary, x: number) => fit.intercept + fit.slope * x;

function ranges(input: ScatterInput, fit: FitSummary) {
  const { group } = input;
  const xs = group!.points.map((p) => p.x);
  const ys = group!.points.map((p) => p.y);
  const prediction = group!.prediction;
  if (prediction) xs.push(prediction.x0);
  const xLo = Math.min(...xs);
  const xHi = Math.max(...xs);
  for (const x of [xLo, xHi]) {
    const half = predictionHalfWidth(fit, x) ?? 0;
    ys.push(lineAt(fit, x) - half, lineAt(fit, x) + half);
  }
  if (prediction) ys.push(prediction.lower, prediction.upper);
  if (input.opinionOfValue !== null) ys.push(input.opinionOfValue);
  const xPad = (xHi - xLo) * 0.06 || xHi * 0.05 || 1;
  const yLo = Math.min(...ys);
  const yHi = Math.max(...ys);
  const yPad = (yHi - yLo) * 0.04 || 1;
  return { x: niceTicks(xLo - xPad, xHi + xPad, 6), y: niceTicks(yLo - yPad, yHi + yPad, 5) };
}

function drawBandAndLine(doc: PDFKit.PDFDocument, plot: Plot, fit: FitSummary): void {
  const steps = 60;
  const xs = Array.from({ length: steps + 1 }, (_, i) => plot.xMin + ((plot.xMax - plot.xMin) * i) / steps);
  const halves = xs.map((x) => predictionHalfWidth(fit, x));
  clipped(doc, plot, () => {
    if (halves.every((h) => h !== null)) {
      const upper = xs.map((x, i) => [toPageX(plot, x), toPageY(plot, lineAt(fit, x) + halves[i]!)] as const);
      const lower = xs.map((x, i) => [toPageX(plot, x), toPageY(plot, lineAt(fit, x) - halves[i]!)] as const);
      doc.save();
      doc.moveTo(upper[0][0], upper[0][1]);
      for (const [px, py] of upper.slice(1)) doc.lineTo(px, py);
      for (const [px, py] of [...lower].reverse()) doc.lineTo(px, py);
      doc.closePath().fillOpacity(0.55).fill(INK.tintStrong);
      doc.restore();
      for (const edge of [upper, lower]) {
        doc.save().moveTo(edge[0][0], edge[0][1]);
        for (const [px, py] of edge.slice(1)) doc.lineTo(px, py);
        doc.lineWidth(0.7).dash(2.5, { space: 2 }).strokeColor(INK.ruleStrong).stroke().undash().restore();
      }
    }
    doc.save()
      .moveTo(toPageX(plot, plot.xMin), toPageY(plot, lineAt(fit, plot.xMin)))
      .lineTo(toPageX(plot, plot.xMax), toPageY(plot, lineAt(fit, plot.xMax)))
      .lineWidth(1.4).strokeColor(INK.ink).stroke().restore();
  });
}

function drawSubject(doc: PDFKit.PDFDocument, plot: Plot, input: ScatterInput): void {
  const prediction = input.group?.prediction;
  if (!prediction) return;
  const px = toPageX(plot, prediction.x0);
  clipped(doc, plot, () => {
    doc.save().moveTo(px, plot.top).lineTo(px, plot.top + plot.height).lineWidth(0.7).dash(1.5, { space: 2.5 }).strokeColor(ACCENT.ochre).stroke().undash().restore();
    const yLo = toPageY(plot, prediction.lower);
    const yHi = toPageY(plot, prediction.upper);
    doc.save().lineWidth(1.6).strokeColor(INK.ink).moveTo(px, yLo).lineTo(px, yHi).stroke();
    doc.moveTo(px - 4, yLo).lineTo(px + 4, yLo).moveTo(px - 4, yHi).lineTo(px + 4, yHi).stroke().restore();
    const ye = toPageY(plot, prediction.estimate);
    doc.save().polygon([px, ye - 5], [px + 5, ye], [px, ye + 5], [px - 5, ye]).lineWidth(1.2).fillAndStroke('#ffffff', INK.ink).restore();
    if (input.opinionOfValue !== null) {
      const yo = toPageY(plot, input.opinionOfValue);
      doc.save().polygon([px + 10, yo - 4], [px + 14, yo], [px + 10, yo + 4], [px + 6, yo]).fill(ACCENT.ochre).restore();
    }
  });
  place(doc, 'Subject', px + 6, plot.top + 3, { font: FONT.textMedium, size: 7, colour: ACCENT.ochreDeep, width: 60 });
}

function drawPoints(doc: PDFKit.PDFDocument, plot: Plot, input: ScatterInput, s: number): void {
  clipped(doc, plot, () => {
    for (const p of input.group!.points) {
      const px = toPageX(plot, p.x);
      const py = toPageY(plot, p.y);
      doc.save().circle(px, py, 3.4).lineWidth(0.6).fillAndStroke(residualColour(p.residual, s), '#ffffff').restore();
      if (input.flaggedIds.has(p.saleId)) doc.save().circle(px, py, 6.6).lineWidth(1.5).strokeColor(FLAG_RING).stroke().restore();
    }
  });
}

/** Draws the chart at the flow position, `height` points tall with its caption; moves the flow below it. */
export function scatterChart(doc: PDFKit.PDFDocument, input: ScatterInput, height: number): void {
  const top = doc.y;
  const fit = input.group?.fit ?? null;
  if (!input.group || !fit || input.group.points.length === 0) {
    const why = input.group?.refusal?.message ?? 'There is no fit for the subject’s neighbourhood, so no chart of price against floor area.';
    chartPlaceholder(doc, PAGE.left, top, PAGE.width - PAGE.left - PAGE.right, 90, why);
    doc.y = top + 100;
    return;
  }
  const { units } = input;
  const r = ranges(input, fit);
  const plot: Plot = { left: PAGE.left + 62, top: top + 6, width: PAGE.width - PAGE.right - PAGE.left - 70, height: height - 40, xMin: r.x.min, xMax: r.x.max, yMin: r.y.min, yMax: r.y.max };
  drawFrame(doc, plot, {
    xTicks: r.x.values,
    yTicks: r.y.values,
    xFormat: (v) => count(v),
    yFormat: (v) => compactMoney(v, units.currency),
    xTitle: `Floor area (${areaSymbol(units.areaUnit)})`,
    yTitle: `${input.timeAdjusted ? 'Time-adjusted sale price' : 'Sale price'} (${units.currency})`,
  });
  drawBandAndLine(doc, plot, fit);
  drawPoints(doc, plot, input, fit.residualStdError);
  drawSubject(doc, plot, input);
  doc.y = top + height;
  const caption = `${input.group.neighbourhood}: price = ${perArea(fit.slope, units)} × floor area ${fit.intercept < 0 ? '−' : '+'} ${money(Math.abs(fit.intercept), units.currency)}; R² ${decimal(fit.rSquared)}; n = ${fit.n}; residual standard error ${money(fit.residualStdError, units.currency)}; sales range ${area(fit.xMin, units.areaUnit)} to ${area(fit.xMax, units.areaUnit)}.`;
  doc.y += place(doc, caption, PAGE.left, doc.y, { size: 7.6, colour: INK.soft }) + 4;
}

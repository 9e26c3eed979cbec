// The market-conditions trend: price per unit area against months before the effective date, with
// its fitted line. The effective date sits at the right edge, so time reads left to right.
import type { Trend } from '../../../contracts/analysis';
import { chartPlaceholder, clipped, drawFrame, niceTicks, toPageX, toPageY, type Plot } from './chart-frame';
import { FONT } from './fonts';
import { areaSymbol, decimal, perArea, signedPercent, type Units } from './format';
import { place } from './layout';
import { ACCENT, INK, PAGE } from './theme';

export interface TrendInput {
  trend: Trend | null;
  applied: boolean;
  units: Units;
}

export function trendChart(doc: PDFKit.PDFDocument, input: TrendInput, height: number): void {
  const top = doc.y;
  const { trend, units } = input;
  const fit = trend?.fit ?? null;
  if (!trend || !fit || trend.points.length === 0) {
    const why = trend?.refusal?.message ?? 'There is no market-conditions trend for the subject’s neighbourhood.';
    chartPlaceholder(doc, PAGE.left, top, PAGE.width - PAGE.left - PAGE.right, 70, why);
    doc.y = top + 80;
    return;
  }
  const months = trend.points.map((p) => p.monthsBefore);
  const values = trend.points.map((p) => p.pricePerArea);
  const xTicks = niceTicks(Math.min(0, ...months), Math.max(...months), 8, [1, 2, 5, 10]);
  const lineAt = (m: number) => fit.intercept + fit.slope * m;
  const yTicks = niceTicks(Math.min(...values, lineAt(xTicks.min), lineAt(xTicks.max)), Math.max(...values, lineAt(xTicks.min), lineAt(xTicks.max)), 4);
  const plot: Plot = {
    left: PAGE.left + 62,
    top: top + 6,
    width: PAGE.width - PAGE.right - PAGE.left - 70,
    height: height - 40,
    xMin: xTicks.min,
    xMax: xTicks.max,
    yMin: yTicks.min,
    yMax: yTicks.max,
    xReversed: true,
  };
  drawFrame(doc, plot, {
    xTicks: xTicks.values,
    yTicks: yTicks.values,
    xFormat: (v) => (v === 0 ? '0' : decimal(v, 0)),
    yFormat: (v) => perArea(v, units).replace(`/${areaSymbol(units.areaUnit)}`, ''),
    xTitle: 'Months before the effective date',
    yTitle: `Price per ${areaSymbol(units.areaUnit)} (${units.currency})`,
  });
  clipped(doc, plot, () => {
    const x0 = toPageX(plot, 0);
    doc.save().moveTo(x0, plot.top).lineTo(x0, plot.top + plot.height).lineWidth(0.7).dash(1.5, { space: 2.5 }).strokeColor(ACCENT.ochre).stroke().undash().restore();
    for (const p of trend.points) {
      doc.save().circle(toPageX(plot, p.monthsBefore), toPageY(plot, p.pricePerArea), 2.8).lineWidth(0.5).fillAndStroke(INK.faint, '#ffffff').restore();
    }
    doc.save()
      .moveTo(toPageX(plot, plot.xMin), toPageY(plot, lineAt(plot.xMin)))
      .lineTo(toPageX(plot, plot.xMax), toPageY(plot, lineAt(plot.xMax)))
      .lineWidth(1.4).strokeColor(INK.ink).stroke().restore();
  });
  place(doc, 'Effective date', toPageX(plot, 0) - 62, plot.top + 3, { font: FONT.textMedium, size: 7, colour: ACCENT.ochreDeep, width: 58, align: 'right' });
  doc.y = top + height;
  const rate = trend.monthlyRate === null ? 'no monthly rate could be measured' : `${signedPercent(trend.monthlyRate)} a month of the mean price per ${areaSymbol(units.areaUnit)}`;
  const use = input.applied ? 'applied to the sales as a time adjustment' : 'shown for information; the time adjustment is off';
  const caption = `${trend.neighbourhood}: ${rate} (n = ${trend.n}, R² ${decimal(fit.rSquared)}), ${use}.`;
  doc.y += place(doc, caption, PAGE.left, doc.y, { size: 7.6, colour: INK.soft }) + 4;
}

// The market analysis behind the figures: the fit's statistics for the subject's neighbourhood, the
// price-on-floor-area chart and the market-conditions trend, both drawn as vectors.
import { scatterLegend } from './chart-legend';
import { area, decimal, money, perArea } from './format';
import { ensureSpace, facts, list, newPage, paragraph, sectionTitle, subheading, type ReportContext } from './layout';
import { flaggedSaleIds, subjectGroup, subjectTrend } from '../../../contracts/report-facts';
import { scatterChart } from './scatter-chart';
import { INK, PAGE } from './theme';
import { trendChart } from './trend-chart';

function fitFacts(ctx: ReportContext): void {
  const { doc, units } = ctx;
  const group = subjectGroup(ctx.snapshot);
  const fit = group?.fit;
  if (!group || !fit) return;
  const pValue = fit.slopePValue === null ? '—' : fit.slopePValue < 0.0001 ? '< 0.0001' : decimal(fit.slopePValue, 4);
  facts(
    doc,
    [
      { label: 'Sales in the fit (n)', value: String(fit.n), figure: true },
      { label: 'Correlation r', value: decimal(fit.r), figure: true },
      { label: 'R²', value: decimal(fit.rSquared), figure: true },
      { label: 'Adjusted R²', value: decimal(fit.adjustedRSquared), figure: true },
      { label: 'Slope', value: perArea(fit.slope, units), figure: true },
      { label: 'Slope, 95% interval', value: `${perArea(fit.slopeInterval[0], units)} to ${perArea(fit.slopeInterval[1], units)}`, figure: true },
      { label: 'Slope p-value', value: pValue, figure: true },
      { label: 'Residual std. error', value: money(fit.residualStdError, units.currency), figure: true },
    ],
    4,
  );
  if (group.prediction) {
    const p = group.prediction;
    paragraph(
      doc,
      `At the subject’s ${area(p.x0, units.areaUnit)} the line gives ${money(p.estimate, units.currency)}; a single sale of that size would fall between ${money(p.lower, units.currency)} and ${money(p.upper, units.currency)} (95% prediction interval), and the average of many such sales between ${money(p.meanLower, units.currency)} and ${money(p.meanUpper, units.currency)}.`,
      { size: 8.6, colour: INK.soft },
    );
  }
}

export function chartsSection(ctx: ReportContext): void {
  const { doc, snapshot, units } = ctx;
  const group = subjectGroup(snapshot);
  if (doc.y > PAGE.top + 200) newPage(doc);
  sectionTitle(
    doc,
    'Market analysis',
    group?.fit
      ? `Sale price against floor area in ${group.neighbourhood}, the subject’s neighbourhood, fitted by least squares; then the trend of price per ${units.areaUnit === 'sqft' ? 'ft²' : 'm²'} over time.`
      : 'No line of price against floor area could be fitted for the subject’s neighbourhood.',
  );
  fitFacts(ctx);
  ensureSpace(doc, 270);
  scatterChart(doc, { group, flaggedIds: flaggedSaleIds(snapshot), opinionOfValue: snapshot.opinionOfValue, timeAdjusted: snapshot.analysis.timeAdjustment, units }, 240);
  if (group?.fit) scatterLegend(doc);
  if (group?.fit && group.warnings.length > 0) {
    subheading(doc, 'What weakens this fit', 30);
    list(doc, group.warnings, false, { size: 8.2, colour: INK.soft });
  }
  subheading(doc, 'Market conditions', 200);
  trendChart(doc, { trend: subjectTrend(snapshot), applied: snapshot.analysis.timeAdjustment, units }, 165);
}

import { CartesianGrid, DefaultZIndexes, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis, ZIndexLayer } from 'recharts';
import type { FitSummary, GroupAnalysis, Trend } from '@contracts/analysis';
import type { ReportSnapshot } from '@contracts/report';
import { handledSales } from '@contracts/report-facts';
import { fittedAt, niceTicks, predictionBand, predictionHalfWidth } from '../lib/prediction-band';
import type { ReportFormat } from '../lib/report-format';
import { BandLayer, SaleDot, SubjectEstimate, type ChartSale } from './chart-layers';

const tick = { fill: 'var(--color-ink-soft)', fontSize: 11, fontFamily: 'var(--font-mono)' };
const axisLine = { stroke: 'var(--color-rule-strong)' };
const axisTitle = { fill: 'var(--color-ink-faint)', fontSize: 12 };

function SaleTip({ active, payload, title, rows }: { active?: boolean; payload?: ReadonlyArray<{ payload?: unknown }>; title: (s: ChartSale) => string; rows: (s: ChartSale) => string[] }) {
  const sale = payload?.[0]?.payload as ChartSale | undefined;
  if (!active || !sale || typeof sale.saleId !== 'number') return null;
  return (
    <div className="rounded-md border border-rule-strong bg-paper-raised px-3 py-2 text-[0.8125rem] shadow-sm">
      <p className="font-semibold text-ink">{title(sale)}</p>
      {rows(sale).map((r) => (
        <p key={r} className="figures text-ink-soft">
          {r}
        </p>
      ))}
    </div>
  );
}

/** Price against floor area in the subject's neighbourhood: sales by residual, flagged ones ringed,
 * the fitted line with its 95% prediction band, and the subject with its interval. */
function FitChart({ snapshot, group, fit, format }: { snapshot: ReportSnapshot; group: GroupAnalysis; fit: FitSummary; format: ReportFormat }) {
  const flagged = new Set(handledSales(snapshot).filter((h) => h.flags.length).map((h) => h.saleId));
  const byId = new Map(snapshot.sales.map((s) => [s.id, s]));
  const points: ChartSale[] = group.points.map((p) => ({ saleId: p.saleId, x: p.x, y: p.y, studentized: p.externallyStudentized, flagged: flagged.has(p.saleId), inGrid: byId.get(p.saleId)?.inGrid ?? false }));
  const prediction = group.prediction;
  const x = niceTicks([...points.map((p) => p.x), ...(prediction ? [prediction.x0] : [])], 6);
  const band = predictionBand(fit, x.domain[0], x.domain[1]);
  const ends = [fit.xMin, fit.xMax].flatMap((at) => {
    const half = predictionHalfWidth(fit, at);
    return half === null ? [] : [fittedAt(fit, at) - half, fittedAt(fit, at) + half];
  });
  const y = niceTicks([...points.map((p) => p.y), ...ends, ...(prediction ? [prediction.lower, prediction.upper] : [])], 6);
  const adjusted = snapshot.analysis.timeAdjustment;
  return (
    <ResponsiveContainer width="100%" height={340}>
      <ScatterChart margin={{ top: 16, right: 20, bottom: 30, left: 6 }}>
        <CartesianGrid stroke="var(--color-rule)" vertical={false} />
        <XAxis type="number" dataKey="x" domain={x.domain} ticks={x.ticks} allowDataOverflow tickFormatter={(v: number) => format.areaNumber(v)} tick={tick} axisLine={axisLine} tickLine={axisLine} label={{ ...axisTitle, value: `Floor area (${format.unit})`, position: 'insideBottom', offset: -18 }} />
        <YAxis type="number" dataKey="y" domain={y.domain} ticks={y.ticks} allowDataOverflow width={70} tickFormatter={(v: number) => format.compactMoney(v)} tick={tick} axisLine={axisLine} tickLine={axisLine} label={{ ...axisTitle, value: adjusted ? 'Time-adjusted price' : 'Sale price', angle: -90, position: 'insideLeft', style: { textAnchor: 'middle' } }} />
        <ZIndexLayer zIndex={DefaultZIndexes.area}>
          <BandLayer band={band} />
        </ZIndexLayer>
        <Scatter data={points} isAnimationActive={false} shape={(props: object) => <SaleDot {...props} />} />
        {prediction && (
          <ZIndexLayer zIndex={DefaultZIndexes.scatter + 50}>
            <SubjectEstimate x0={prediction.x0} estimate={prediction.estimate} lower={prediction.lower} upper={prediction.upper} opinion={snapshot.opinionOfValue} />
          </ZIndexLayer>
        )}
        <Tooltip cursor={false} isAnimationActive={false} content={(p) => <SaleTip active={p.active} payload={p.payload} title={(s) => byId.get(s.saleId)?.address ?? `Sale ${s.saleId}`} rows={(s) => [`${format.money(s.y)} · ${format.area(s.x)}`]} />} />
      </ScatterChart>
    </ResponsiveContainer>
  );
}

/** Price per unit area against months before the effective date, time running left to right. */
function TrendChart({ snapshot, trend, format }: { snapshot: ReportSnapshot; trend: Trend; format: ReportFormat }) {
  const fit = trend.fit;
  const byId = new Map(snapshot.sales.map((s) => [s.id, s]));
  const points: ChartSale[] = trend.points.map((p) => ({ saleId: p.saleId, x: -p.monthsBefore, y: p.pricePerArea, studentized: null, flagged: false, inGrid: byId.get(p.saleId)?.inGrid ?? false }));
  const x = niceTicks([...points.map((p) => p.x), 0], 6);
  const y = niceTicks(points.map((p) => p.y), 5);
  const line = fit ? [x.domain[0], x.domain[1]].map((at) => ({ x: at, fitted: fittedAt(fit, -at), band: [0, 0] as [number, number] })) : [];
  return (
    <ResponsiveContainer width="100%" height={340}>
      <ScatterChart margin={{ top: 16, right: 20, bottom: 30, left: 6 }}>
        <CartesianGrid stroke="var(--color-rule)" vertical={false} />
        <XAxis type="number" dataKey="x" domain={x.domain} ticks={x.ticks} allowDataOverflow tickFormatter={(v: number) => String(Math.abs(v))} tick={tick} axisLine={axisLine} tickLine={axisLine} label={{ ...axisTitle, value: 'Months before the effective date', position: 'insideBottom', offset: -18 }} />
        <YAxis type="number" dataKey="y" domain={y.domain} ticks={y.ticks} allowDataOverflow width={70} tickFormatter={(v: number) => format.money(v)} tick={tick} axisLine={axisLine} tickLine={axisLine} label={{ ...axisTitle, value: `Price per ${format.unit}`, angle: -90, position: 'insideLeft', style: { textAnchor: 'middle' } }} />
        <ZIndexLayer zIndex={DefaultZIndexes.area}>
          <BandLayer band={line} showBand={false} />
        </ZIndexLayer>
        <Scatter data={points} isAnimationActive={false} shape={(props: object) => <SaleDot {...props} fill="var(--color-ink-soft)" />} />
        <Tooltip cursor={false} isAnimationActive={false} content={(p) => <SaleTip active={p.active} payload={p.payload} title={(s) => byId.get(s.saleId)?.address ?? `Sale ${s.saleId}`} rows={(s) => [`${format.perArea(s.y)} · ${Math.abs(s.x).toFixed(1)} months before`]} />} />
      </ScatterChart>
    </ResponsiveContainer>
  );
}

export interface ReportChartsProps {
  snapshot: ReportSnapshot;
  group: GroupAnalysis | null;
  trend: Trend | null;
  format: ReportFormat;
}

/** The two charts of the report; loaded on demand so that recharts stays out of the page's chunk. */
export default function ReportCharts({ snapshot, group, trend, format }: ReportChartsProps) {
  return (
    <div className="grid gap-6 lg:grid-cols-2">
      <figure className="report-card flex flex-col gap-2 rounded-lg border border-rule bg-paper-raised px-4 pt-4 pb-3">
        <figcaption className="text-[0.9375rem] font-semibold text-ink">Price against floor area{group ? `, ${group.neighbourhood}` : ''}</figcaption>
        {group?.fit ? <FitChart snapshot={snapshot} group={group} fit={group.fit} format={format} /> : <p className="py-10 text-center text-ink-soft">{group?.refusal?.message ?? 'No fit for the subject’s neighbourhood.'}</p>}
        <p className="text-[0.75rem] text-ink-faint">Line: least-squares fit. Shaded: 95% prediction band. Diamond and bar: the subject’s estimate and interval; dashed tick: the opinion of value.</p>
      </figure>
      <figure className="report-card flex flex-col gap-2 rounded-lg border border-rule bg-paper-raised px-4 pt-4 pb-3">
        <figcaption className="text-[0.9375rem] font-semibold text-ink">Market conditions{trend ? `, ${trend.neighbourhood}` : ''}</figcaption>
        {trend && trend.points.length > 0 ? <TrendChart snapshot={snapshot} trend={trend} format={format} /> : <p className="py-10 text-center text-ink-soft">{trend?.refusal?.message ?? 'No time trend for the subject’s neighbourhood.'}</p>}
        <p className="text-[0.75rem] text-ink-faint">Each sale’s price per {format.unit} by how long before the effective date it sold, with the fitted trend.</p>
      </figure>
    </div>
  );
}

import { useId, type ReactNode } from 'react';
import { usePlotArea, useXAxisScale, useYAxisScale } from 'recharts';
import type { FitSummary, GroupAnalysis } from '@contracts/analysis';
import type { FigureFormat } from '../lib/figure-format';
import type { Flag } from '../lib/flag-words';
import type { SaleLookup } from '../lib/sale-lookup';
import type { BandPoint } from '../lib/prediction-band';
import { residualColour } from '../lib/residual-scale';

/** One sale as a chart draws it. */
export interface SalePoint {
  saleId: number;
  x: number;
  y: number;
  studentized: number | null;
  flagged: boolean;
}

/** A sale of a fitted group, with its residual and its flags (the scatter and the residual plot). */
export interface FittedSalePoint extends SalePoint {
  residual: number;
  flags: readonly Flag[];
}

/** What the two charts of a fitted group take. */
export interface GroupChartProps {
  group: GroupAnalysis & { fit: FitSummary };
  flagsById: ReadonlyMap<number, readonly Flag[]>;
  format: FigureFormat;
  lookup: SaleLookup;
  onOpen: (saleId: number) => void;
  /** A floor-area range to zoom to (null shows every sale). */
  focus: [number, number] | null;
  height: number;
}

interface SaleMarkProps {
  cx?: number;
  cy?: number;
  payload?: SalePoint;
  isActive?: boolean;
  radius: number;
  /** A fixed fill instead of the residual colour (the trend chart's sales). */
  fill?: string;
  onOpen: (saleId: number) => void;
}

/** A sale: a dot coloured by its residual, ringed in magenta when flagged. Clicking opens it. */
export function SaleMark({ cx, cy, payload, isActive, radius, fill, onOpen }: SaleMarkProps) {
  if (cx === undefined || cy === undefined || !payload || !Number.isFinite(cx) || !Number.isFinite(cy)) return null;
  return (
    <g className="cursor-pointer" onClick={() => onOpen(payload.saleId)}>
      {payload.flagged && <circle cx={cx} cy={cy} r={radius + 4} fill="none" stroke="var(--color-flag-ring)" strokeWidth={2} />}
      <circle
        data-sale-id={payload.saleId}
        cx={cx}
        cy={cy}
        r={isActive ? radius + 1.5 : radius}
        fill={fill ?? residualColour(payload.studentized)}
        stroke={isActive ? 'var(--color-ink)' : 'var(--color-paper-raised)'}
        strokeWidth={isActive ? 1.75 : 1.25}
      />
    </g>
  );
}

/** Keeps the overlays inside the plot area. */
function useClip(): { clipPath: string; defs: ReactNode } | null {
  const id = useId().replace(/:/g, '');
  const plot = usePlotArea();
  if (!plot) return null;
  return {
    clipPath: `url(#clip-${id})`,
    defs: (
      <defs>
        <clipPath id={`clip-${id}`}>
          <rect x={plot.x} y={plot.y} width={plot.width} height={plot.height} />
        </clipPath>
      </defs>
    ),
  };
}

function toPath(points: Array<[number | undefined, number | undefined]>): string | null {
  if (points.some(([x, y]) => x === undefined || y === undefined || !Number.isFinite(x) || !Number.isFinite(y))) return null;
  return points.map(([x, y], i) => `${i === 0 ? 'M' : 'L'}${(x as number).toFixed(1)},${(y as number).toFixed(1)}`).join(' ');
}

/** The fitted line and, when given, its 95% prediction band (drawn under the sales). */
export function FitLayer({ band, showBand = true }: { band: readonly BandPoint[]; showBand?: boolean }) {
  const xScale = useXAxisScale();
  const yScale = useYAxisScale();
  const clip = useClip();
  if (!xScale || !yScale || !clip || band.length < 2) return null;
  const upper = band.map((p) => [xScale(p.x), yScale(p.upper)] as [number | undefined, number | undefined]);
  const lower = band.map((p) => [xScale(p.x), yScale(p.lower)] as [number | undefined, number | undefined]);
  const line = toPath(band.map((p) => [xScale(p.x), yScale(p.fitted)]));
  const upperPath = toPath(upper);
  const lowerPath = toPath(lower);
  const area = upperPath && lowerPath ? `${upperPath} ${toPath([...lower].reverse())!.replace(/^M/, 'L')} Z` : null;
  return (
    <g clipPath={clip.clipPath} data-chart-layer="fit">
      {clip.defs}
      {showBand && area && <path d={area} fill="var(--color-ink)" fillOpacity={0.055} stroke="none" />}
      {showBand && upperPath && <path d={upperPath} fill="none" stroke="var(--color-ink-faint)" strokeWidth={1} strokeDasharray="4 4" />}
      {showBand && lowerPath && <path d={lowerPath} fill="none" stroke="var(--color-ink-faint)" strokeWidth={1} strokeDasharray="4 4" />}
      {line && <path d={line} fill="none" stroke="var(--color-ink)" strokeWidth={2} strokeLinecap="round" />}
    </g>
  );
}

/** The subject: an ink diamond at its estimate with its prediction interval as a capped bar. */
export function SubjectMark({ x0, estimate, lower, upper }: { x0: number; estimate: number; lower: number; upper: number }) {
  const xScale = useXAxisScale();
  const yScale = useYAxisScale();
  const clip = useClip();
  const [x, y, top, bottom] = [xScale?.(x0), yScale?.(estimate), yScale?.(upper), yScale?.(lower)];
  if (!clip || [x, y, top, bottom].some((v) => v === undefined || !Number.isFinite(v))) return null;
  const [cx, cy, y1, y2] = [x, y, top, bottom] as number[];
  const d = 7;
  return (
    <g clipPath={clip.clipPath} data-chart-layer="subject" aria-hidden pointerEvents="none">
      {clip.defs}
      <g stroke="var(--color-paper-raised)" strokeWidth={5} strokeLinecap="round" opacity={0.9}>
        <line x1={cx} x2={cx} y1={y1} y2={y2} />
      </g>
      <g stroke="var(--color-ink)" strokeWidth={2} strokeLinecap="round">
        <line x1={cx} x2={cx} y1={y1} y2={y2} />
        <line x1={cx - 6} x2={cx + 6} y1={y1} y2={y1} />
        <line x1={cx - 6} x2={cx + 6} y1={y2} y2={y2} />
      </g>
      <path d={`M${cx},${cy - d} L${cx + d},${cy} L${cx},${cy + d} L${cx - d},${cy} Z`} fill="var(--color-ink)" stroke="var(--color-paper-raised)" strokeWidth={2} />
      <text x={cx} y={y1 - 8} textAnchor="middle" stroke="var(--color-paper-raised)" strokeWidth={3} paintOrder="stroke" className="fill-ink font-sans text-[11px] font-semibold">
        Subject
      </text>
    </g>
  );
}

/** Sales beyond the zoomed floor-area range: an arrow on the plot's right (or left) edge at the
 * sale's price, with its floor area, so that they are not lost from sight. Clicking opens the sale. */
export function OffScaleMarks({ points, label, onOpen }: { points: readonly SalePoint[]; label: (p: SalePoint) => string; onOpen: (saleId: number) => void }) {
  const xScale = useXAxisScale();
  const yScale = useYAxisScale();
  const plot = usePlotArea();
  if (!xScale || !yScale || !plot || points.length === 0) return null;
  const top = plot.y + 8;
  const bottom = plot.y + plot.height - 8;
  return (
    <g data-chart-layer="off-scale">
      {points.map((p) => {
        const right = (xScale(p.x) ?? Infinity) > plot.x + plot.width;
        const x = right ? plot.x + plot.width - 4 : plot.x + 4;
        const y = Math.min(bottom, Math.max(top, yScale(p.y) ?? top));
        const tip = right ? 6 : -6;
        return (
          <g key={p.saleId} data-off-scale-sale-id={p.saleId} className="cursor-pointer" onClick={() => onOpen(p.saleId)}>
            <title>{label(p)}</title>
            <path d={`M${x - tip},${y - 6} L${x},${y} L${x - tip},${y + 6} Z`} fill="var(--color-ink-soft)" stroke={p.flagged ? 'var(--color-flag-ring)' : 'none'} strokeWidth={2} strokeLinejoin="round" />
            <text x={x - tip * 1.6} y={y + 4} textAnchor={right ? 'end' : 'start'} stroke="var(--color-paper-raised)" strokeWidth={3} paintOrder="stroke" className="fill-ink-soft font-mono text-[11px]">
              {label(p)}
            </text>
          </g>
        );
      })}
    </g>
  );
}

/** Above this many sales in one chart, the sales that are not flagged are drawn as one layer. */
export const DENSE_CHART_SALES = 1_500;

/**
 * Splits a chart's sales: below DENSE_CHART_SALES every sale is an interactive mark; above it only
 * the flagged ones are, and the rest go to DenseSaleMarks.
 */
export function splitDense<P extends SalePoint>(points: readonly P[]): { marks: P[]; dense: P[] } {
  if (points.length <= DENSE_CHART_SALES) return { marks: [...points], dense: [] };
  return { marks: points.filter((p) => p.flagged), dense: points.filter((p) => !p.flagged) };
}

/**
 * Many sales at once: one path per colour instead of one element per sale, so that tens of
 * thousands draw in milliseconds rather than seconds. The marks are not interactive; the flagged
 * sales drawn over them are, and the Comparables table opens any sale.
 */
export function DenseSaleMarks({ points, radius, fill }: { points: readonly SalePoint[]; radius: number; fill?: string }) {
  const xScale = useXAxisScale();
  const yScale = useYAxisScale();
  const clip = useClip();
  if (!xScale || !yScale || !clip || points.length === 0) return null;
  const byColour = new Map<string, string[]>();
  const r = radius.toFixed(1);
  for (const p of points) {
    const x = xScale(p.x);
    const y = yScale(p.y);
    if (x === undefined || y === undefined || !Number.isFinite(x) || !Number.isFinite(y)) continue;
    const colour = fill ?? residualColour(p.studentized);
    let parts = byColour.get(colour);
    if (!parts) byColour.set(colour, (parts = []));
    // A circle as two arcs from its left edge.
    parts.push(`M${(x - radius).toFixed(1)},${y.toFixed(1)}a${r},${r} 0 1,0 ${(2 * radius).toFixed(1)},0a${r},${r} 0 1,0 ${(-2 * radius).toFixed(1)},0`);
  }
  return (
    <g clipPath={clip.clipPath} data-chart-layer="dense-sales" data-sale-count={points.length} aria-hidden pointerEvents="none">
      {clip.defs}
      {[...byColour].map(([colour, parts]) => (
        <path key={colour} d={parts.join('')} fill={colour} stroke="var(--color-paper-raised)" strokeWidth={0.75} />
      ))}
    </g>
  );
}

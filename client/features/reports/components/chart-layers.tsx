import { useId } from 'react';
import { usePlotArea, useXAxisScale, useYAxisScale } from 'recharts';
import type { BandPoint } from '../lib/prediction-band';
import { residualColour } from '../lib/residual-colour';

/** Marks drawn inside the report's recharts plots through the chart's own scales. */

type Pt = [number | undefined, number | undefined];

function path(points: Pt[]): string | null {
  if (points.some(([x, y]) => x === undefined || y === undefined || !Number.isFinite(x) || !Number.isFinite(y))) return null;
  return points.map(([x, y], i) => `${i === 0 ? 'M' : 'L'}${(x as number).toFixed(1)},${(y as number).toFixed(1)}`).join('');
}

function useClipRect() {
  const id = `report-clip-${useId().replace(/:/g, '')}`;
  const plot = usePlotArea();
  return plot ? { id, rect: <rect x={plot.x} y={plot.y} width={plot.width} height={plot.height} /> } : null;
}

/** The fitted line and, around it, the 95% prediction band (shaded, with dashed edges). */
export function BandLayer({ band, showBand = true }: { band: readonly BandPoint[]; showBand?: boolean }) {
  const x = useXAxisScale();
  const y = useYAxisScale();
  const clip = useClipRect();
  if (!x || !y || !clip || band.length < 2) return null;
  const upper = path(band.map((p) => [x(p.x), y(p.band[1])]));
  const lower = path(band.map((p) => [x(p.x), y(p.band[0])]));
  const back = path([...band].reverse().map((p) => [x(p.x), y(p.band[0])]));
  const line = path(band.map((p) => [x(p.x), y(p.fitted)]));
  return (
    <g clipPath={`url(#${clip.id})`}>
      <defs>
        <clipPath id={clip.id}>{clip.rect}</clipPath>
      </defs>
      {showBand && upper && back && <path d={`${upper}${back.replace(/^M/, 'L')}Z`} fill="var(--color-residual-low-soft)" fillOpacity={0.28} />}
      {showBand && upper && <path d={upper} fill="none" stroke="var(--color-residual-low)" strokeWidth={1} strokeDasharray="5 4" />}
      {showBand && lower && <path d={lower} fill="none" stroke="var(--color-residual-low)" strokeWidth={1} strokeDasharray="5 4" />}
      {line && <path d={line} fill="none" stroke="var(--color-ink)" strokeWidth={2} strokeLinecap="round" />}
    </g>
  );
}

/** The subject at its estimate, with its prediction interval as a capped bar. */
export function SubjectEstimate({ x0, estimate, lower, upper, opinion }: { x0: number; estimate: number; lower: number; upper: number; opinion: number | null }) {
  const x = useXAxisScale();
  const y = useYAxisScale();
  const values = [x?.(x0), y?.(estimate), y?.(upper), y?.(lower)];
  if (values.some((v) => v === undefined || !Number.isFinite(v))) return null;
  const [cx, cy, top, bottom] = values as number[];
  const oy = opinion === null ? undefined : y?.(opinion);
  return (
    <g aria-hidden>
      <g stroke="var(--color-ink)" strokeWidth={2} strokeLinecap="round">
        <line x1={cx} x2={cx} y1={top} y2={bottom} />
        <line x1={cx - 6} x2={cx + 6} y1={top} y2={top} />
        <line x1={cx - 6} x2={cx + 6} y1={bottom} y2={bottom} />
      </g>
      <rect x={cx - 6} y={cy - 6} width={12} height={12} transform={`rotate(45 ${cx} ${cy})`} fill="var(--color-ink)" stroke="var(--color-paper-raised)" strokeWidth={2} />
      {oy !== undefined && Number.isFinite(oy) && <line x1={cx - 14} x2={cx + 14} y1={oy} y2={oy} stroke="var(--color-ink)" strokeWidth={2.5} strokeDasharray="2 2" />}
      <text x={cx + 12} y={top - 6} stroke="var(--color-paper-raised)" strokeWidth={3} paintOrder="stroke" fontSize={11} fontWeight={600} fill="var(--color-ink)">
        Subject
      </text>
    </g>
  );
}

export interface ChartSale {
  saleId: number;
  x: number;
  y: number;
  studentized: number | null;
  flagged: boolean;
  inGrid: boolean;
}

/** A sale: coloured by its residual, ringed in magenta when flagged, outlined in ink when it is
 * one of the grid's sales. */
export function SaleDot({ cx, cy, payload, fill }: { cx?: number; cy?: number; payload?: ChartSale; fill?: string }) {
  if (cx === undefined || cy === undefined || !payload || !Number.isFinite(cx) || !Number.isFinite(cy)) return null;
  return (
    <g data-sale-id={payload.saleId}>
      {payload.flagged && <circle cx={cx} cy={cy} r={9} fill="none" stroke="var(--color-flag-ring)" strokeWidth={2} />}
      <circle cx={cx} cy={cy} r={payload.inGrid ? 5.5 : 4.5} fill={fill ?? residualColour(payload.studentized)} stroke={payload.inGrid ? 'var(--color-ink)' : 'var(--color-paper-raised)'} strokeWidth={payload.inGrid ? 2 : 1} />
    </g>
  );
}

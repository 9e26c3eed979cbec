import type { ReportFormat } from '../lib/report-format';
import { niceTicks } from '../lib/prediction-band';

interface Props {
  opinion: number | null;
  interval: { estimate: number; lower: number; upper: number } | null;
  adjustedRange: [number, number] | null;
  format: ReportFormat;
}

const W = 1000;
const H = 104;
const PAD = 28;
const AXIS = 76;

/**
 * One price scale with the three answers on it: the regression's 95% prediction interval for a
 * house of the subject's floor area (band, estimate tick), the span of the grid's adjusted prices
 * (bar) and the appraiser's opinion of value (ink pin).
 */
export function ValueScale({ opinion, interval, adjustedRange, format }: Props) {
  const values = [opinion, interval?.lower, interval?.upper, adjustedRange?.[0], adjustedRange?.[1]].filter((v): v is number => typeof v === 'number' && Number.isFinite(v));
  if (values.length < 2) return null;
  const { domain, ticks } = niceTicks(values, 6);
  const x = (v: number) => PAD + ((v - domain[0]) / (domain[1] - domain[0])) * (W - 2 * PAD);
  const label = [
    interval && `95% prediction interval ${format.money(interval.lower)} to ${format.money(interval.upper)}`,
    adjustedRange && `adjusted prices of the grid sales ${format.money(adjustedRange[0])} to ${format.money(adjustedRange[1])}`,
    opinion !== null && `opinion of value ${format.money(opinion)}`,
  ]
    .filter(Boolean)
    .join('; ');
  return (
    <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label={`Price scale: ${label}`} className="block h-auto w-full">
      {ticks.map((t) => (
        <g key={t}>
          <line x1={x(t)} x2={x(t)} y1={AXIS} y2={AXIS + 5} stroke="var(--color-rule-strong)" />
          <text x={x(t)} y={AXIS + 20} textAnchor="middle" fontSize="12" fill="var(--color-ink-faint)" fontFamily="var(--font-mono)">
            {format.compactMoney(t)}
          </text>
        </g>
      ))}
      <line x1={PAD} x2={W - PAD} y1={AXIS} y2={AXIS} stroke="var(--color-rule-strong)" />
      {interval && (
        <g>
          <rect x={x(interval.lower)} y={30} width={Math.max(2, x(interval.upper) - x(interval.lower))} height={16} rx="3" fill="var(--color-residual-low-soft)" fillOpacity="0.55" stroke="var(--color-residual-low)" strokeWidth="1" />
          <line x1={x(interval.estimate)} x2={x(interval.estimate)} y1={26} y2={50} stroke="var(--color-residual-low-strong)" strokeWidth="2" />
          <text x={x(interval.lower) + 8} y={42} fontSize="12" fill="var(--color-residual-low-strong)">
            regression, 95% prediction interval
          </text>
        </g>
      )}
      {adjustedRange && (
        <g>
          <line x1={x(adjustedRange[0])} x2={x(adjustedRange[1])} y1={62} y2={62} stroke="var(--color-ink-soft)" strokeWidth="5" strokeLinecap="round" />
          {/* Beside the bar, outside it: after its end when there is room, else before its start. */}
          {x(adjustedRange[1]) + 160 < W ? (
            <text x={x(adjustedRange[1]) + 10} y={66} fontSize="12" fill="var(--color-ink-soft)">
              grid, adjusted prices
            </text>
          ) : (
            <text x={x(adjustedRange[0]) - 10} y={66} textAnchor="end" fontSize="12" fill="var(--color-ink-soft)">
              grid, adjusted prices
            </text>
          )}
        </g>
      )}
      {opinion !== null && (
        <g>
          <line x1={x(opinion)} x2={x(opinion)} y1={20} y2={AXIS} stroke="var(--color-ink)" strokeWidth="2.5" />
          <circle cx={x(opinion)} cy={AXIS} r="5.5" fill="var(--color-ink)" stroke="var(--color-paper-raised)" strokeWidth="2" />
          <text x={x(opinion)} y={14} textAnchor="middle" fontSize="12.5" fontWeight={700} fill="var(--color-ink)">
            opinion {format.money(opinion)}
          </text>
        </g>
      )}
    </svg>
  );
}

import type { Figures } from '../lib/grid-figures';

interface ValueRulerProps {
  figures: Figures;
  adjustedPrices: readonly number[];
  regression: { estimate: number; lower: number; upper: number } | null;
  opinion: number | null;
}

/** One horizontal scale for the cross-check: each adjusted price as a tick, the regression's
 * prediction interval as a band with its estimate, the opinion of value as a diamond. */
export function ValueRuler({ figures, adjustedPrices, regression, opinion }: ValueRulerProps) {
  const values = [...adjustedPrices, ...(regression ? [regression.lower, regression.upper] : []), ...(opinion === null ? [] : [opinion])].filter(Number.isFinite);
  if (values.length < 2) return null;
  const low = Math.min(...values);
  const high = Math.max(...values);
  const pad = (high - low) * 0.06 || Math.abs(high) * 0.05 || 1;
  const x = (v: number) => 12 + ((v - (low - pad)) / (high - low + 2 * pad)) * 456;
  const label = `Adjusted prices ${adjustedPrices.map(figures.money).join(', ')}${regression ? `; regression interval ${figures.money(regression.lower)} to ${figures.money(regression.upper)}` : ''}${opinion === null ? '' : `; opinion ${figures.money(opinion)}`}`;
  return (
    <figure className="flex flex-col gap-1.5">
      <svg viewBox="0 0 480 64" role="img" aria-label={label} className="w-full">
        <line x1="12" x2="468" y1="40" y2="40" stroke="var(--color-rule-strong)" strokeWidth="1" />
        {regression && (
          <g>
            <rect x={x(regression.lower)} y="30" width={Math.max(1, x(regression.upper) - x(regression.lower))} height="20" rx="3" fill="var(--color-residual-low-soft)" fillOpacity="0.45" />
            <line x1={x(regression.estimate)} x2={x(regression.estimate)} y1="28" y2="52" stroke="var(--color-residual-low-strong)" strokeWidth="2" strokeDasharray="3 2" />
          </g>
        )}
        {adjustedPrices.map((price, i) => (
          <line key={i} x1={x(price)} x2={x(price)} y1="33" y2="47" stroke="var(--color-ink)" strokeWidth="2.5" strokeLinecap="round" />
        ))}
        {opinion !== null && (
          <g transform={`translate(${x(opinion)} 16)`}>
            <path d="M0 -7 L7 0 L0 7 L-7 0 Z" fill="var(--color-ink)" />
            <line x1="0" x2="0" y1="7" y2="24" stroke="var(--color-ink)" strokeWidth="1" />
          </g>
        )}
      </svg>
      <figcaption className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-faint">
        <span className="inline-flex items-center gap-1.5">
          <span aria-hidden className="inline-block h-3 w-0.5 bg-ink" /> adjusted price of a sale
        </span>
        {regression && (
          <span className="inline-flex items-center gap-1.5">
            <span aria-hidden className="inline-block h-2.5 w-4 rounded-sm bg-residual-low-soft/70" /> regression 95% prediction interval
          </span>
        )}
        {opinion !== null && (
          <span className="inline-flex items-center gap-1.5">
            <span aria-hidden className="inline-block size-2 rotate-45 bg-ink" /> opinion of value
          </span>
        )}
      </figcaption>
    </figure>
  );
}

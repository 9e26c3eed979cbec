import { residualBounds, residualSteps } from '../lib/residual-scale';

const half = (v: number) => (Math.abs(v) === 0.5 ? `${v < 0 ? '−' : ''}½` : v < 0 ? `−${Math.abs(v)}` : String(v));

/** The residual scale (in studentized residuals) and what the other marks of the charts mean. */
export function ChartLegend({ showSubject, showBand }: { showSubject: boolean; showBand: boolean }) {
  return (
    <div className="flex flex-wrap items-end gap-x-8 gap-y-3 text-xs text-ink-soft">
      <div>
        <p className="mb-1">Studentized residual: below the line ← → above the line</p>
        <div className="flex" role="list" aria-label="Residual colours">
          {residualSteps.map((step) => (
            <span key={step.label} role="listitem" title={step.label} aria-label={step.label} className="h-2.5 w-7 first:rounded-l-sm last:rounded-r-sm" style={{ background: step.colour }} />
          ))}
        </div>
        <div aria-hidden className="figures relative mt-0.5 h-3.5 w-[12.25rem] text-[0.6875rem] text-ink-faint">
          {residualBounds.map((bound, i) => (
            <span key={bound} className="absolute -translate-x-1/2" style={{ left: `${(i + 1) * 1.75}rem` }}>
              {half(bound)}
            </span>
          ))}
        </div>
      </div>
      <ul className="flex flex-wrap items-center gap-x-5 gap-y-1.5">
        <li className="flex items-center gap-1.5">
          <svg width="18" height="18" aria-hidden>
            <circle cx="9" cy="9" r="4" fill="var(--color-residual-mid)" />
            <circle cx="9" cy="9" r="7.5" fill="none" stroke="var(--color-flag-ring)" strokeWidth="1.75" />
          </svg>
          flagged sale
        </li>
        <li className="flex items-center gap-1.5">
          <svg width="22" height="10" aria-hidden>
            <line x1="1" x2="21" y1="5" y2="5" stroke="var(--color-ink)" strokeWidth="2" strokeLinecap="round" />
          </svg>
          fitted line
        </li>
        {showBand && (
          <li className="flex items-center gap-1.5">
            <svg width="22" height="14" aria-hidden>
              <rect x="1" y="2" width="20" height="10" fill="var(--color-ink)" fillOpacity="0.07" />
              <line x1="1" x2="21" y1="2" y2="2" stroke="var(--color-ink-faint)" strokeDasharray="3 3" />
              <line x1="1" x2="21" y1="12" y2="12" stroke="var(--color-ink-faint)" strokeDasharray="3 3" />
            </svg>
            95% prediction band
          </li>
        )}
        {showSubject && (
          <li className="flex items-center gap-1.5">
            <svg width="14" height="18" aria-hidden>
              <line x1="7" x2="7" y1="1" y2="17" stroke="var(--color-ink)" strokeWidth="1.5" />
              <path d="M7,4.5 L11.5,9 L7,13.5 L2.5,9 Z" fill="var(--color-ink)" stroke="var(--color-paper-raised)" strokeWidth="1.2" />
            </svg>
            subject, with its 95% prediction interval
          </li>
        )}
      </ul>
    </div>
  );
}

/** The key to the map's marks, in words as well as colour. No maplibre here: it renders with the page. */
import type { ReactNode } from 'react';
const scale = [
  'bg-residual-low-strong',
  'bg-residual-low',
  'bg-residual-low-soft',
  'bg-residual-mid',
  'bg-residual-high-soft',
  'bg-residual-high',
  'bg-residual-high-strong',
] as const;

function Item({ mark, children }: { mark: ReactNode; children: ReactNode }) {
  return (
    <li className="flex items-center gap-2">
      <span aria-hidden className="flex w-4 items-center justify-center">
        {mark}
      </span>
      {children}
    </li>
  );
}

export function MapLegend({ ringText, hasFit }: { ringText: string; hasFit: boolean }) {
  return (
    <div className="flex flex-wrap items-center gap-x-6 gap-y-2 text-[0.8125rem] text-ink-soft">
      <div className="flex items-center gap-2">
        <span className="text-ink-faint">Below the line</span>
        <span aria-hidden className="flex overflow-hidden rounded-sm border border-rule-strong">
          {scale.map((colour) => (
            <span key={colour} className={`h-2.5 w-4 ${colour}`} />
          ))}
        </span>
        <span className="text-ink-faint">above</span>
        <span className="sr-only">
          Sale colours show the studentized residual of each sale in its neighbourhood’s fit: teal below the fitted line, grey on it, rust above it.
        </span>
        {!hasFit && <span className="text-ink-faint">(grey until a neighbourhood has a fit)</span>}
      </div>
      <ul className="flex flex-wrap items-center gap-x-5 gap-y-2">
        <Item mark={<span className="size-2.5 rounded-full bg-residual-mid ring-2 ring-flag-ring ring-offset-1 ring-offset-paper-raised" />}>Flagged</Item>
        <Item mark={<span className="size-3 rounded-[3px] border-2 border-ink bg-residual-mid" />}>In the grid</Item>
        <Item
          mark={
            <span className="relative size-3 rounded-full border-2 border-ink-soft bg-paper-raised">
              <span className="absolute top-1/2 -left-0.5 h-0.5 w-4 -translate-y-1/2 -rotate-45 bg-ink-soft" />
            </span>
          }
        >
          Excluded
        </Item>
        <Item
          mark={
            <svg viewBox="0 0 30 32" className="h-4 w-4">
              <path d="M15 2.2 28 12.6V29.5H2V12.6Z" fill="var(--color-ink)" />
              <rect x="11.4" y="17.6" width="7.2" height="8.6" rx="1" fill="var(--color-paper-raised)" />
            </svg>
          }
        >
          Subject
        </Item>
        <Item mark={<span className="w-4 border-t-[1.5px] border-dashed border-ink/70" />}>{ringText}</Item>
      </ul>
    </div>
  );
}

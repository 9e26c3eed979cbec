import type { ReactNode } from 'react';

export interface FigureRow {
  /** A stable name for tests and for the figure's id: 'r-squared'. */
  name: string;
  label: ReactNode;
  value: string;
  detail?: ReactNode;
  /** In the narrow side panel (lg and up), the figure goes on its own line under the label. */
  stacked?: boolean;
}

/** Label and figure on one ruled line, the figure in mono with tabular digits, right-aligned. */
export function FigureList({ rows, label }: { rows: readonly FigureRow[]; label: string }) {
  return (
    <dl aria-label={label} className="divide-y divide-rule">
      {rows.map((row) => (
        <div key={row.name} className={`grid items-baseline gap-x-4 py-1.5 ${row.stacked ? 'grid-cols-[minmax(0,1fr)_auto] lg:grid-cols-1 lg:gap-y-0.5' : 'grid-cols-[minmax(0,1fr)_auto]'}`}>
          <dt className="text-[0.875rem] text-ink-soft">{row.label}</dt>
          <dd data-figure={row.name} className="figures text-right text-[0.875rem] whitespace-nowrap text-ink">
            {row.value}
          </dd>
          {row.detail && <dd className="col-span-2 -mt-0.5 text-right text-[0.8125rem] text-ink-faint">{row.detail}</dd>}
        </div>
      ))}
    </dl>
  );
}

export function FigureHeading({ children }: { children: ReactNode }) {
  return <h4 className="mt-4 mb-1 text-xs font-semibold tracking-wide text-ink-faint uppercase first:mt-0">{children}</h4>;
}

import type { TooltipContentProps } from 'recharts';

export type TooltipRows = Array<[label: string, value: string]>;

interface Props<T> {
  active?: boolean;
  payload?: TooltipContentProps['payload'];
  title: (datum: T) => string;
  rows: (datum: T) => TooltipRows;
  note?: (datum: T) => string | null;
}

/** The card shown beside a hovered sale: its address, then its figures, then what a click does. */
export function SaleTooltip<T>({ active, payload, title, rows, note }: Props<T>) {
  const datum = payload?.[0]?.payload as T | undefined;
  if (!active || !datum) return null;
  const extra = note?.(datum);
  return (
    <div className="pointer-events-none max-w-72 rounded-md border border-rule-strong bg-paper-raised px-3.5 py-2.5 shadow-[0_6px_20px_rgb(29_42_68/0.12)]">
      <p className="text-sm font-semibold text-ink">{title(datum)}</p>
      <dl className="mt-1.5 grid grid-cols-[auto_1fr] gap-x-4 gap-y-0.5 text-[0.8125rem]">
        {rows(datum).map(([label, value]) => (
          <div key={label} className="contents">
            <dt className="text-ink-faint">{label}</dt>
            <dd className="figures text-right text-ink">{value}</dd>
          </div>
        ))}
      </dl>
      {extra && <p className="mt-1.5 text-xs text-ink-soft">{extra}</p>}
      <p className="mt-1.5 border-t border-rule pt-1.5 text-xs text-ink-faint">Click to open the sale.</p>
    </div>
  );
}

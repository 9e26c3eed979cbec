import { useId, type InputHTMLAttributes } from 'react';
import { activeFilterCount, NO_NEIGHBOURHOOD, noFilters, type CompFilters } from '../lib/comp-rows';

const count = new Intl.NumberFormat(undefined, { maximumFractionDigits: 0 });

const control =
  'h-9 rounded-md border border-rule-strong bg-paper-raised px-2.5 text-sm text-ink placeholder:text-ink-faint focus:border-ink focus:ring-2 focus:ring-ink/15 focus:outline-none';

function Field({ label, className = '', ...input }: { label: string } & InputHTMLAttributes<HTMLInputElement>) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-xs font-semibold text-ink-soft">
        {label}
      </label>
      <input id={id} className={`${control} figures ${className}`} {...input} />
    </div>
  );
}

interface SalesFiltersProps {
  filters: CompFilters;
  onChange: (next: CompFilters) => void;
  neighbourhoods: readonly string[];
  areaSymbol: string;
  distanceSymbol: string;
  shown: number;
  total: number;
}

/** Neighbourhood, sale dates, distance and area limits; they narrow the table and the map alike. */
export function SalesFilters({ filters, onChange, neighbourhoods, areaSymbol, distanceSymbol, shown, total }: SalesFiltersProps) {
  const set = (key: keyof CompFilters) => (event: { target: { value: string } }) => onChange({ ...filters, [key]: event.target.value });
  const selectId = useId();
  const active = activeFilterCount(filters);
  return (
    <div role="search" aria-label="Filter the sales" className="flex flex-wrap items-end gap-x-3 gap-y-2.5">
      <div className="flex flex-col gap-1">
        <label htmlFor={selectId} className="text-xs font-semibold text-ink-soft">
          Neighbourhood
        </label>
        <select id={selectId} value={filters.neighbourhood} onChange={set('neighbourhood')} className={`${control} min-w-40 pr-8`}>
          <option value="">All</option>
          {neighbourhoods.map((name) => (
            <option key={name} value={name}>
              {name === NO_NEIGHBOURHOOD ? 'No neighbourhood' : name}
            </option>
          ))}
        </select>
      </div>
      <Field label="Sold from" type="date" value={filters.soldFrom} onChange={set('soldFrom')} className="w-[9.5rem]" />
      <Field label="Sold to" type="date" value={filters.soldTo} onChange={set('soldTo')} className="w-[9.5rem]" />
      <Field label={`Within (${distanceSymbol})`} inputMode="decimal" placeholder="any" value={filters.maxDistance} onChange={set('maxDistance')} className="w-20" />
      <Field label={`Area from (${areaSymbol})`} inputMode="decimal" placeholder="any" value={filters.minArea} onChange={set('minArea')} className="w-24" />
      <Field label={`Area to (${areaSymbol})`} inputMode="decimal" placeholder="any" value={filters.maxArea} onChange={set('maxArea')} className="w-24" />
      <div className="flex h-9 items-center gap-3 text-sm">
        <span className="figures text-ink-soft" aria-live="polite">
          {shown === total ? `${count.format(total)} sales` : `${count.format(shown)} of ${count.format(total)} sales`}
        </span>
        {active > 0 && (
          <button type="button" onClick={() => onChange(noFilters)} className="font-semibold text-ink-soft underline decoration-rule-strong underline-offset-4 hover:text-ink">
            Clear filters
          </button>
        )}
      </div>
    </div>
  );
}

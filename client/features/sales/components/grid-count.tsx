/** How many sales are in the adjustment grid, against the usual three to six. */
export function GridCount({ count }: { count: number }) {
  const usual = count >= 3 && count <= 6;
  return (
    <p className="flex items-baseline gap-2 text-[0.9375rem]" aria-live="polite" data-testid="grid-count">
      <span className="figures text-2xl leading-none font-semibold text-ink">{count}</span>
      <span className="text-ink">{count === 1 ? 'sale in the grid' : 'sales in the grid'}</span>
      <span className={usual ? 'text-teal' : 'text-ink-faint'}>· usually 3 to 6</span>
    </p>
  );
}

/** What the marks of the report map mean, in words (never colour alone). */
export function MapLegend({ unlocated }: { unlocated: number }) {
  const swatch = (colour: string) => <span aria-hidden className="inline-block size-2.5 rounded-full" style={{ background: colour }} />;
  return (
    <figcaption className="flex flex-wrap items-center gap-x-5 gap-y-2 text-[0.8125rem] text-ink-soft">
      <span className="flex items-center gap-1.5">
        <span aria-hidden className="flex size-4 items-center justify-center rounded-full bg-ink text-[0.5625rem] font-bold text-paper">A</span>
        Sale in the adjustment grid
      </span>
      <span className="flex items-center gap-1.5">
        <span className="flex gap-0.5">
          {swatch('var(--color-residual-low)')}
          {swatch('var(--color-residual-mid)')}
          {swatch('var(--color-residual-high)')}
        </span>
        Other sales: below, on, above the fitted line
      </span>
      <span className="flex items-center gap-1.5">
        <span aria-hidden className="inline-block size-3.5 rounded-full border-2 border-flag-ring" />
        Flagged by the fit
      </span>
      <span className="flex items-center gap-1.5">
        <span aria-hidden className="font-bold text-rust">×</span>
        Excluded from the analysis
      </span>
      {unlocated > 0 && <span className="text-ink-faint">{unlocated === 1 ? 'One sale has' : `${unlocated} sales have`} no location and are not drawn.</span>}
    </figcaption>
  );
}

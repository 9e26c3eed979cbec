/**
 * A ruled progress bar in ink. With a value (0…1) it fills to that share and reads out the
 * percentage; with `value={null}` it sweeps, for work whose length nobody can know (the server
 * checking and writing a file). The label says in words what is happening; screen readers hear the
 * label when it changes (a new phase), not every percent.
 */
export function ProgressBar({ value, label, detail, className = '' }: { value: number | null; label: string; detail?: string; className?: string }) {
  const percent = value === null ? null : Math.round(Math.max(0, Math.min(1, value)) * 100);
  return (
    <div className={`flex flex-col gap-1.5 ${className}`}>
      <div className="flex items-baseline justify-between gap-4 text-sm">
        <span className="font-medium text-ink" role="status">
          {label}
        </span>
        <span className="figures text-ink-soft">{percent === null ? detail : `${percent}%${detail ? ` · ${detail}` : ''}`}</span>
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent ?? undefined}
        aria-valuetext={percent === null ? label : `${percent}%`}
        className="relative h-2 overflow-hidden rounded-full border border-rule-strong/60 bg-paper-sunk"
      >
        {percent === null ? (
          <span className="animate-loading-sweep absolute inset-y-0 left-0 w-2/5 rounded-full bg-ink/70" />
        ) : (
          <span className="absolute inset-y-0 left-0 rounded-full bg-ink transition-[width] duration-150" style={{ width: `${percent}%` }} />
        )}
      </div>
    </div>
  );
}

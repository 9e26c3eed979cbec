import { pointFlagLabel } from '@contracts/analysis';
import type { PointFlag } from '../lib/comp-rows';

/** The analysis's flags on a sale, each a small chip with the magenta ring the map uses. */
export function FlagChips({ flags, reason }: { flags: readonly PointFlag[]; reason: string | null }) {
  if (flags.length === 0) return null;
  return (
    <ul className="flex flex-wrap gap-1" aria-label="Flags" title={reason ?? undefined}>
      {flags.map((flag) => (
        <li key={flag} className="inline-flex items-center gap-1 rounded-full border border-flag-ring/35 bg-paper-raised px-1.5 text-[0.6875rem] leading-[1.125rem] font-semibold text-ink-soft">
          <span aria-hidden className="size-[7px] rounded-full ring-[1.5px] ring-flag-ring" />
          {pointFlagLabel(flag)}
        </li>
      ))}
    </ul>
  );
}

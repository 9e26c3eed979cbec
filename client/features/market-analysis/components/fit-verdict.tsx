import type { GroupAnalysis } from '@contracts/analysis';
import { Badge } from '../../../components/ui/badge';
import { FigureHeading } from './figure-list';

/** The correlation check in words: the server's verdict and what the threshold is. */
export function GateVerdict({ gate }: { gate: NonNullable<GroupAnalysis['gate']> }) {
  return (
    <div data-testid="correlation-gate">
      <FigureHeading>Correlation check</FigureHeading>
      <div className="flex flex-col gap-1.5">
        <div>
          <Badge tone={gate.passes ? 'positive' : 'negative'}>{gate.passes ? 'Passes: slope usable as a rate' : 'Does not pass'}</Badge>
        </div>
        <p className="text-[0.875rem] leading-relaxed text-ink">{gate.message}</p>
        <p className="text-[0.8125rem] leading-relaxed text-ink-faint">
          |r| ≥ {gate.threshold} is a common-practice rule of thumb, not a standard: it asks whether floor area explains enough of the price for the
          slope to carry into the grid.
        </p>
      </div>
    </div>
  );
}

/** The fit's warnings (small sample, extrapolation, a falling line …), each in a sentence. */
export function WarningList({ warnings }: { warnings: readonly string[] }) {
  if (warnings.length === 0) return null;
  return (
    <div data-testid="fit-warnings">
      <FigureHeading>Warnings</FigureHeading>
      <ul className="flex flex-col gap-1.5">
        {warnings.map((warning) => (
          <li key={warning} className="relative pl-4 text-[0.875rem] leading-relaxed text-ink-soft">
            <span aria-hidden className="absolute top-[0.55em] left-0 size-1.5 rounded-full bg-rust" />
            {warning}
          </li>
        ))}
      </ul>
    </div>
  );
}

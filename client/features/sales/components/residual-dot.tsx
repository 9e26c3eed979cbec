import type { ResidualBand } from '../lib/residual-band';
import { residualBandWords } from '../lib/residual-band';

const fill: Record<ResidualBand, string> = {
  none: 'bg-paper-sunk border border-rule-strong',
  'low-strong': 'bg-residual-low-strong',
  low: 'bg-residual-low',
  'low-soft': 'bg-residual-low-soft',
  mid: 'bg-residual-mid',
  'high-soft': 'bg-residual-high-soft',
  high: 'bg-residual-high',
  'high-strong': 'bg-residual-high-strong',
};

/** The sale's residual colour, as on the map, with its meaning for screen readers and on hover. */
export function ResidualDot({ band, inGrid }: { band: ResidualBand; inGrid: boolean }) {
  const words = residualBandWords[band];
  return (
    <span
      title={`Residual: ${words}`}
      className={`mt-[5px] inline-block size-2.5 shrink-0 ${inGrid ? 'rounded-[2px] outline-[1.5px] outline-ink outline-solid' : 'rounded-full'} ${fill[band]}`}
    >
      <span className="sr-only">Residual {words}</span>
    </span>
  );
}

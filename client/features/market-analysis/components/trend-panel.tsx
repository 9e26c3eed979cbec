import type { ReactNode } from 'react';
import type { FitSummary, Trend } from '@contracts/analysis';
import type { FigureFormat } from '../lib/figure-format';
import type { SaleLookup } from '../lib/sale-lookup';
import { FigureList } from './figure-list';
import { TrendChart } from './trend-chart';

interface Props {
  trend: Trend | undefined;
  flaggedIds: ReadonlySet<number>;
  format: FigureFormat;
  lookup: SaleLookup;
  onOpen: (saleId: number) => void;
  chartHeight: number;
  /** The time-adjustment switch, set under the rate. */
  control: ReactNode;
}

/** The monthly rate in words and figures, then the trend chart; a refusal in words when there is no trend. */
export function TrendPanel({ trend, flaggedIds, format, lookup, onOpen, chartHeight, control }: Props) {
  if (!trend?.fit || trend.refusal) {
    return (
      <div className="flex flex-col gap-4">
        <p className="text-[0.9375rem] text-ink-soft" data-testid="trend-refusal">
          {trend?.refusal?.message ?? 'No market-conditions trend could be fitted to these sales.'}
        </p>
        {control}
      </div>
    );
  }
  const fit: FitSummary = trend.fit;
  // The slope is per month *before* the effective date, so a rising market has a negative slope:
  // the rate and its interval are the slope's, negated, as a fraction of the mean price per area.
  const rateLow = fit.yMean > 0 ? -fit.slopeInterval[1] / fit.yMean : null;
  const rateHigh = fit.yMean > 0 ? -fit.slopeInterval[0] / fit.yMean : null;
  const spansZero = rateLow !== null && rateHigh !== null && rateLow < 0 && rateHigh > 0;

  return (
    <div className="grid gap-x-8 gap-y-5 lg:grid-cols-[minmax(0,1fr)_minmax(0,1.4fr)]">
      <div className="flex flex-col gap-3">
        <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
          <p className="figures text-2xl leading-none text-ink" data-figure="monthly-rate">
            {trend.monthlyRate === null ? 'not defined' : format.monthlyPercent(trend.monthlyRate)}
          </p>
          <p className="text-[0.875rem] text-ink-soft">
            a month, as a share of the mean price per {format.unit} ({format.rateAmount(fit.yMean)})
          </p>
        </div>
        <FigureList
          label="Figures of the market-conditions trend"
          rows={[
            {
              name: 'rate-interval',
              label: '95% interval of the monthly rate',
              value: rateLow === null || rateHigh === null ? 'not defined' : `${format.monthlyPercent(rateLow)} to ${format.monthlyPercent(rateHigh)}`,
              detail: spansZero ? 'spans zero: cannot be told apart from no change' : undefined,
            },
            { name: 'trend-n', label: 'Sales (n)', value: format.count(fit.n) },
            { name: 'trend-r-squared', label: 'R²', value: fit.rSquared === null ? 'not defined' : format.ratio(fit.rSquared) },
          ]}
        />
        <div className="mt-2">{control}</div>
      </div>
      <figure aria-label={`Price per ${format.unit} against months before the effective date, ${fit.n} sales`} data-chart="trend" className="-mx-2 self-center">
        <TrendChart trend={{ ...trend, fit }} flaggedIds={flaggedIds} format={format} lookup={lookup} onOpen={onOpen} height={chartHeight} />
      </figure>
    </div>
  );
}

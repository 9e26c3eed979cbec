import { useState } from 'react';
import type { Analysis, FitSummary, GroupAnalysis } from '@contracts/analysis';
import type { FigureFormat } from '../lib/figure-format';
import type { flagsBySale } from '../lib/flag-words';
import { focusRange, inRange } from '../lib/focus-range';
import type { SaleLookup } from '../lib/sale-lookup';
import { AnalysisCard } from './analysis-card';
import { ChartLegend } from './chart-legend';
import { DENSE_CHART_SALES } from './chart-marks';
import { FitFigures } from './fit-figures';
import { PriceAreaChart } from './price-area-chart';
import { ResidualsChart } from './residuals-chart';

interface Props {
  analysis: Analysis;
  group: GroupAnalysis & { fit: FitSummary };
  flags: ReturnType<typeof flagsBySale>;
  format: FigureFormat;
  lookup: SaleLookup;
  onOpen: (saleId: number) => void;
}

/** The scatter and, under it, the residual plot, beside the fit's figures. Where a few floor areas lie far from
 * the rest, both charts can zoom to the main cluster; the fit itself is unchanged. */
export function FittedGroup({ analysis, group, flags, format, lookup, onOpen }: Props) {
  const [zoomed, setZoomed] = useState(false);
  const range = focusRange(group.points.map((p) => p.x));
  const focus = zoomed ? range : null;
  const beyond = range ? group.points.filter((p) => !inRange(range, p.x)) : [];
  const where = group.pooled ? 'all neighbourhoods pooled' : group.neighbourhood;

  return (
    // Reading order scatter → figures → residuals; from lg the figures move to a column of their own.
    <div className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_23rem] lg:grid-rows-[auto_1fr]">
      <AnalysisCard
        className="lg:col-start-1 lg:row-start-1"
        title="Price against floor area"
        labelId="scatter-title"
        description={`${group.n} sales, ${where}.`}
        aside={range && <ZoomToggle zoomed={zoomed} onChange={setZoomed} />}
      >
        <figure
          aria-label={`Scatter of ${group.n} sales, price against floor area, ${where}, with the fitted line and its 95% prediction band`}
          data-chart="price-area"
          className="-mx-2"
        >
          <PriceAreaChart group={group} flagsById={flags} format={format} lookup={lookup} timeAdjusted={analysis.timeAdjustment} onOpen={onOpen} focus={focus} height={410} />
        </figure>
        {zoomed && beyond.length > 0 && (
          <p className="mt-1 text-[0.8125rem] text-ink-soft">
            Zoomed to the main cluster of floor areas. Beyond it, marked on the edge and still in the fit:{' '}
            {beyond.map((p) => `${lookup(p.saleId).address} (${format.area(p.x)})`).join(', ')}.
          </p>
        )}
        <div className="mt-3 flex flex-wrap items-end justify-between gap-x-6 gap-y-2 border-t border-rule pt-3">
          <ChartLegend showSubject={group.prediction !== null} showBand />
          <p className="text-xs text-ink-faint">
            {group.points.length > DENSE_CHART_SALES
              ? `${format.count(group.points.length)} sales: those not flagged are drawn as one layer. Hover or click a flagged sale; open any other from the Comparables table.`
              : 'Hover a sale for its figures; click it to open the sale.'}
          </p>
        </div>
      </AnalysisCard>
      <AnalysisCard
        title="The fit"
        labelId="figures-title"
        description="Least squares, price on floor area."
        className="lg:col-start-2 lg:row-span-2 lg:row-start-1 lg:self-start"
      >
        <FitFigures analysis={analysis} group={group} format={format} />
      </AnalysisCard>
      <AnalysisCard
        className="lg:col-start-1 lg:row-start-2 lg:self-start"
        title="Residuals against fitted values"
        labelId="residuals-title"
        description="How far each sale lies from the line. A funnel or a curve here says the straight line misses something."
      >
        <figure aria-label={`Residuals of ${group.n} sales against their fitted prices`} data-chart="residuals" className="-mx-2">
          <ResidualsChart group={group} flagsById={flags} format={format} lookup={lookup} onOpen={onOpen} focus={focus} height={230} />
        </figure>
      </AnalysisCard>
    </div>
  );
}

function ZoomToggle({ zoomed, onChange }: { zoomed: boolean; onChange: (zoomed: boolean) => void }) {
  const option = (value: boolean, label: string) => (
    <button
      type="button"
      aria-pressed={zoomed === value}
      onClick={() => onChange(value)}
      className={`rounded-[5px] px-2.5 py-1 text-[0.8125rem] transition-colors ${zoomed === value ? 'bg-paper-raised font-semibold text-ink shadow-[0_0_0_1px_var(--color-rule-strong)]' : 'text-ink-soft hover:text-ink'}`}
    >
      {label}
    </button>
  );
  return (
    <div role="group" aria-label="Floor-area scale" className="flex items-center gap-0.5 rounded-md bg-paper-sunk p-0.5">
      {option(false, 'All sales')}
      {option(true, 'Main cluster')}
    </div>
  );
}

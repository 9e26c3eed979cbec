import { useState } from 'react';
import type { GridResponse } from '@contracts/grid';
import { Button } from '../../../components/ui/button';
import type { useGridSave } from '../hooks/use-grid-save';
import type { Figures } from '../lib/grid-figures';
import { SaveProblemNotice } from './save-problem';
import { ValueRuler } from './value-ruler';

const VALUE_INCREMENTS = [100, 500, 1_000, 2_500, 5_000, 10_000];

interface ReconciliationPanelProps {
  grid: GridResponse;
  figures: Figures;
  editable: boolean;
  saver: ReturnType<typeof useGridSave>;
}

/** The weighted indicated value, its rounding and the opinion of value; beside them the cross-check:
 * the range of adjusted prices and the neighbourhood regression's estimate with its interval. */
export function ReconciliationPanel({ grid, figures, editable, saver }: ReconciliationPanelProps) {
  const [pendingIncrement, setPendingIncrement] = useState<number | null>(null);
  const increment = pendingIncrement ?? grid.settings.valueIncrement;
  const increments = VALUE_INCREMENTS.includes(increment) ? VALUE_INCREMENTS : [...VALUE_INCREMENTS, increment].sort((a, b) => a - b);
  const weightsOk = grid.rows.length > 0 && Math.abs(grid.weightsTotalPct - 100) < 0.01;

  async function saveIncrement(value: number) {
    setPendingIncrement(value);
    const saved = await saver.save([{ kind: 'settings', change: { version: grid.settings.version, valueIncrement: value } }]);
    if (saved) setPendingIncrement(null);
  }

  return (
    <section aria-labelledby="reconciliation-title" className="grid overflow-hidden rounded-lg border border-rule bg-paper-raised lg:grid-cols-[minmax(0,1fr)_minmax(0,1.2fr)]">
      <div className="flex flex-col gap-4 px-5 py-4">
        <h3 id="reconciliation-title" className="text-base font-semibold">
          Reconciliation
        </h3>
        <dl className="grid grid-cols-[minmax(0,1fr)_auto] items-baseline gap-x-4 gap-y-2 text-[0.9375rem]">
          <dt className="text-ink-soft">Weights total</dt>
          <dd className={`figures text-right ${weightsOk ? 'text-ink' : 'font-semibold text-rust'}`}>{grid.rows.length ? figures.percent(grid.weightsTotalPct) : '—'}</dd>
          <dt className="text-ink-soft">Indicated value (weighted mean)</dt>
          <dd className="figures text-right">{figures.money(grid.indicatedValue)}</dd>
          <dt className="text-ink-soft">
            {editable ? (
              <label htmlFor="value-increment">Rounded to the nearest</label>
            ) : (
              'Rounded to the nearest'
            )}
          </dt>
          <dd className="text-right">
            {editable ? (
              <select
                id="value-increment"
                value={increment}
                disabled={saver.saving}
                onChange={(e) => void saveIncrement(Number(e.target.value))}
                className="figures h-9 rounded-md border border-rule-strong bg-paper-raised pl-3 text-[0.9375rem] focus:border-ink focus:outline-none"
              >
                {increments.map((step) => (
                  <option key={step} value={step}>
                    {figures.money(step)}
                  </option>
                ))}
              </select>
            ) : (
              <span className="figures">{figures.money(grid.settings.valueIncrement)}</span>
            )}
          </dd>
        </dl>
        <div className="border-t border-rule pt-3">
          <p className="text-sm font-semibold text-ink-soft">Opinion of value</p>
          <p className="figures mt-0.5 text-[2rem] leading-tight font-semibold text-ink" data-testid="opinion-of-value">
            {figures.money(grid.opinionOfValue)}
          </p>
          {grid.opinionOfValue === null && <p className="text-[0.8125rem] text-ink-faint">Appears once the grid has sales, a rate and weights that total 100%.</p>}
        </div>
        <SaveProblemNotice problem={saver.problem} onDismiss={saver.clearProblem} />
        {pendingIncrement !== null && !saver.saving && (
          <div>
            <Button size="sm" onClick={() => void saveIncrement(pendingIncrement)}>
              Save the rounding again
            </Button>
          </div>
        )}
      </div>

      <div className="flex flex-col gap-4 border-t border-rule bg-paper/60 px-5 py-4 lg:border-t-0 lg:border-l">
        <h4 className="text-sm font-semibold text-ink-soft">Cross-check</h4>
        <dl className="grid gap-3 text-[0.9375rem] sm:grid-cols-2">
          <div>
            <dt className="text-ink-soft">Range of adjusted prices</dt>
            <dd className="figures mt-0.5 text-ink">{grid.adjustedRange ? `${figures.money(grid.adjustedRange[0])} – ${figures.money(grid.adjustedRange[1])}` : '—'}</dd>
          </div>
          <div>
            <dt className="text-ink-soft">{grid.regression ? `Regression estimate, ${grid.regression.neighbourhood}` : 'Regression estimate'}</dt>
            <dd className="figures mt-0.5 text-ink">{grid.regression ? figures.money(grid.regression.estimate) : 'no fit for the subject'}</dd>
            {grid.regression && (
              <dd className="figures text-[0.8125rem] text-ink-faint">
                95% prediction interval {figures.money(grid.regression.lower)} – {figures.money(grid.regression.upper)}
              </dd>
            )}
          </div>
        </dl>
        <ValueRuler figures={figures} adjustedPrices={grid.rows.map((r) => r.adjustedPrice)} regression={grid.regression} opinion={grid.opinionOfValue} />
        <p className="text-[0.8125rem] leading-relaxed text-ink-faint">
          The regression describes the sales given, not the market: a wide interval or a weak fit makes it a loose check, never the value.
        </p>
      </div>
    </section>
  );
}

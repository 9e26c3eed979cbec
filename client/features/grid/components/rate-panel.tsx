import { useState } from 'react';
import type { GridResponse } from '@contracts/grid';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { TextAreaField, TextField } from '../../../components/ui/field';
import type { useGridSave } from '../hooks/use-grid-save';
import type { Figures } from '../lib/grid-figures';
import { SaveProblemNotice } from './save-problem';

const RATE_INCREMENTS = [0.5, 1, 5, 10, 25, 50, 100];

interface Draft {
  mode: 'fit' | 'typed';
  typedRate: string;
  justification: string;
  rateIncrement: number;
}

interface RatePanelProps {
  grid: GridResponse;
  figures: Figures;
  editable: boolean;
  saver: ReturnType<typeof useGridSave>;
}

function fromServer(grid: GridResponse): Draft {
  const { settings } = grid;
  return {
    mode: settings.typedRate === null ? 'fit' : 'typed',
    typedRate: settings.typedRate === null ? '' : String(settings.typedRate),
    justification: settings.rateJustification ?? '',
    rateIncrement: settings.rateIncrement,
  };
}

/** The floor-area rate: the neighbourhood fit's slope, its rounding, the correlation gate's verdict,
 * and the appraiser's typed rate with the written justification it needs. */
export function RatePanel({ grid, figures, editable, saver }: RatePanelProps) {
  const { rate, settings } = grid;
  const [draft, setDraft] = useState<Draft | null>(null);
  const [tried, setTried] = useState(false);
  const shown = draft ?? fromServer(grid);
  const update = (change: Partial<Draft>) => setDraft({ ...shown, ...change });

  const typedValue = shown.typedRate.trim() === '' ? NaN : Number(shown.typedRate);
  const needsJustification = !rate.gatePasses || shown.mode === 'typed';
  const rateError = shown.mode === 'typed' && !Number.isFinite(typedValue) ? 'Type the rate as a number.' : undefined;
  const justificationError = needsJustification && shown.justification.trim() === '' ? 'Required: say what supports this rate (paired sales, cost data, the market’s own figures).' : undefined;
  const increments = RATE_INCREMENTS.includes(shown.rateIncrement) ? RATE_INCREMENTS : [...RATE_INCREMENTS, shown.rateIncrement].sort((a, b) => a - b);

  async function save() {
    setTried(true);
    if (rateError || justificationError) return;
    const saved = await saver.save([
      {
        kind: 'settings',
        change: {
          version: settings.version,
          typedRate: shown.mode === 'typed' ? typedValue : null,
          rateJustification: shown.justification.trim() || null,
          rateIncrement: shown.rateIncrement,
        },
      },
    ]);
    if (saved) {
      setDraft(null);
      setTried(false);
    }
  }

  const fitRounded = rate.fitSlope === null ? null : Math.round(rate.fitSlope / settings.rateIncrement) * settings.rateIncrement;
  return (
    <section aria-labelledby="rate-title" className="rounded-lg border border-rule bg-paper-raised">
      <header className="flex flex-wrap items-baseline justify-between gap-2 border-b border-rule px-5 py-3">
        <h3 id="rate-title" className="text-base font-semibold">
          Floor-area rate
        </h3>
        <p className="text-[0.8125rem] text-ink-faint">Adjustment = rate × (subject area − sale area)</p>
      </header>
      <div className="grid gap-6 px-5 py-4 lg:grid-cols-[minmax(0,1fr)_minmax(0,1.25fr)]">
        <div className="flex flex-col gap-3">
          <p className="text-sm font-semibold text-ink-soft">{rate.fitNeighbourhood ? `What the ${rate.fitNeighbourhood} sales say` : 'What the sales say'}</p>
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1.5 text-[0.9375rem]">
            <dt className="text-ink-faint">Fitted slope</dt>
            <dd className="figures">{rate.fitSlope === null ? 'no fit yet' : figures.rate(rate.fitSlope)}</dd>
            <dt className="text-ink-faint">Rounded to</dt>
            <dd className="figures">
              {figures.precise(settings.rateIncrement)} → {figures.rate(fitRounded)}
            </dd>
          </dl>
          <div className="flex flex-col gap-1.5">
            <span>{rate.gatePasses ? <Badge tone="positive">Correlation gate met</Badge> : <Badge tone="negative">Correlation gate not met</Badge>}</span>
            <p className="text-[0.875rem] leading-relaxed text-ink-soft">{rate.gateMessage}</p>
          </div>
        </div>

        <div className="flex flex-col gap-4 lg:border-l lg:border-rule lg:pl-6">
          <div>
            <p className="text-sm font-semibold text-ink-soft">Rate in the grid</p>
            <p className="figures mt-1 text-2xl font-semibold text-ink" data-testid="rate-in-use">
              {figures.rate(rate.value)}
            </p>
            <p className="text-[0.8125rem] text-ink-faint">
              {rate.source === 'typed' ? 'Typed by the appraiser' : rate.source === 'fit' ? 'The fitted slope, rounded' : 'No rate yet: type one'}
            </p>
          </div>
          {editable ? (
            <RateEditor shown={shown} update={update} increments={increments} figures={figures} rateError={tried ? rateError : undefined} />
          ) : null}
          {editable ? (
            <TextAreaField
              label={needsJustification ? 'Justification of the rate (required)' : 'Justification of the rate (optional)'}
              value={shown.justification}
              onChange={(e) => update({ justification: e.target.value })}
              error={tried ? justificationError : undefined}
              hint={needsJustification ? (rate.gatePasses ? 'A typed rate needs its support in writing.' : 'The gate is not met, so the rate needs its support in writing.') : undefined}
              rows={3}
            />
          ) : (
            settings.rateJustification && (
              <div>
                <p className="text-sm font-semibold text-ink-soft">Justification</p>
                <p className="mt-1 text-[0.9375rem] leading-relaxed whitespace-pre-wrap">{settings.rateJustification}</p>
              </div>
            )
          )}
          <SaveProblemNotice problem={saver.problem} onDismiss={saver.clearProblem} />
          {editable && (
            <div className="flex flex-wrap items-center gap-3">
              <Button onClick={() => void save()} busy={saver.saving} busyLabel="Saving the rate…" disabled={draft === null}>
                Save the rate
              </Button>
              {draft !== null && (
                <Button variant="quiet" onClick={() => setDraft(null)}>
                  Discard changes
                </Button>
              )}
            </div>
          )}
        </div>
      </div>
    </section>
  );
}

interface RateEditorProps {
  shown: Draft;
  update: (change: Partial<Draft>) => void;
  increments: number[];
  figures: Figures;
  rateError?: string;
}

function RateEditor({ shown, update, increments, figures, rateError }: RateEditorProps) {
  return (
    <div className="flex flex-col gap-3">
      <fieldset className="flex flex-wrap gap-x-5 gap-y-2">
        <legend className="sr-only">Where the rate comes from</legend>
        {(['fit', 'typed'] as const).map((mode) => (
          <label key={mode} className="flex items-center gap-2 text-[0.9375rem]">
            <input type="radio" name="rate-source" checked={shown.mode === mode} onChange={() => update({ mode })} className="size-4 accent-ink" />
            {mode === 'fit' ? 'Use the fitted slope' : 'Type a rate'}
          </label>
        ))}
      </fieldset>
      <div className="grid gap-3 sm:grid-cols-2">
        {shown.mode === 'typed' && (
          <TextField
            label={`Rate (${figures.currency} per ${figures.unit})`}
            inputMode="decimal"
            className="figures"
            value={shown.typedRate}
            onChange={(e) => update({ typedRate: e.target.value })}
            error={rateError}
          />
        )}
        <label className="flex flex-col gap-1.5 text-sm font-semibold text-ink">
          Round the fitted slope to
          <select
            value={shown.rateIncrement}
            onChange={(e) => update({ rateIncrement: Number(e.target.value) })}
            className="figures h-10 rounded-md border border-rule-strong bg-paper-raised px-3 text-[0.9375rem] font-normal focus:border-ink focus:outline-none"
          >
            {increments.map((step) => (
              <option key={step} value={step}>
                {figures.precise(step)}
              </option>
            ))}
          </select>
        </label>
      </div>
    </div>
  );
}

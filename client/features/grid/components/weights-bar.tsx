import type { GridResponse } from '@contracts/grid';
import { Button } from '../../../components/ui/button';
import type { GridWrite, useGridSave } from '../hooks/use-grid-save';
import type { Figures } from '../lib/grid-figures';
import { SaveProblemNotice } from './save-problem';

export type WeightDraft = Record<number, string>;
type Row = GridResponse['rows'][number];

export function weightDraftFrom(grid: GridResponse): WeightDraft {
  return Object.fromEntries(grid.rows.map((r) => [r.saleId, String(Math.round(r.weightPct * 10) / 10)]));
}

export function parseWeight(text: string | undefined): number {
  if (text === undefined || text.trim() === '') return NaN;
  return Number(text.replace(',', '.'));
}

export function draftTotal(draft: WeightDraft): number {
  return Object.values(draft).reduce((t, text) => t + (Number.isFinite(parseWeight(text)) ? parseWeight(text) : 0), 0);
}

/** The input of one sale's weight, in the grid's weight row. */
export function WeightInput({ row, draft, onChange }: { row: Row; draft: WeightDraft; onChange: (draft: WeightDraft) => void }) {
  const value = parseWeight(draft[row.saleId]);
  const bad = !Number.isFinite(value) || value < 0 || value > 100;
  return (
    <span className="inline-flex items-center gap-1">
      <input
        aria-label={`Weight of ${row.address}, percent`}
        inputMode="decimal"
        value={draft[row.saleId] ?? ''}
        onChange={(e) => onChange({ ...draft, [row.saleId]: e.target.value })}
        aria-invalid={bad || undefined}
        className={`figures h-8 w-20 rounded-md border bg-paper-raised px-2 text-right text-[0.9375rem] focus:border-ink focus:ring-2 focus:ring-ink/15 focus:outline-none ${bad ? 'border-rust' : 'border-rule-strong'}`}
      />
      <span className="text-ink-soft">%</span>
    </span>
  );
}

interface WeightsBarProps {
  grid: GridResponse;
  figures: Figures;
  draft: WeightDraft | null;
  onDraft: (draft: WeightDraft | null) => void;
  saver: ReturnType<typeof useGridSave>;
}

/** Below the grid for the appraiser: set the weights by hand (they must total 100 %, shown live) or
 * go back to the default 1 ÷ gross weighting. */
export function WeightsBar({ grid, figures, draft, onDraft, saver }: WeightsBarProps) {
  const overridden = grid.rows.some((r) => !r.weightIsDefault);
  const entryOf = (saleId: number) => grid.entries.find((e) => e.saleId === saleId);
  const write = (saleId: number, weightPct: number | null): GridWrite => ({
    kind: 'entry',
    saleId,
    change: { version: entryOf(saleId)?.version ?? 0, lineItems: entryOf(saleId)?.lineItems ?? [], weightPct },
  });

  async function saveWeights() {
    if (!draft) return;
    const saved = await saver.save(grid.rows.map((r) => write(r.saleId, parseWeight(draft[r.saleId]))));
    if (saved) onDraft(null);
  }
  async function restoreDefaults() {
    const saved = await saver.save(grid.rows.filter((r) => entryOf(r.saleId)?.weightPct != null).map((r) => write(r.saleId, null)));
    if (saved) onDraft(null);
  }

  if (grid.rows.length === 0) return null;
  if (!draft) {
    return (
      <div className="flex flex-col gap-3">
        <SaveProblemNotice problem={saver.problem} onDismiss={saver.clearProblem} />
        <div className="flex flex-wrap items-center gap-3">
          <Button size="sm" onClick={() => onDraft(weightDraftFrom(grid))}>
            Set the weights
          </Button>
          {overridden && (
            <Button size="sm" variant="quiet" className="text-sm" onClick={() => void restoreDefaults()} busy={saver.saving} busyLabel="Restoring…">
              Go back to the default weights
            </Button>
          )}
          <span className="text-[0.8125rem] text-ink-faint">{overridden ? 'Weights set by hand.' : 'Default weights: the less a sale is adjusted, the more it counts.'}</span>
        </div>
      </div>
    );
  }

  const total = draftTotal(draft);
  const values = grid.rows.map((r) => parseWeight(draft[r.saleId]));
  const eachValid = values.every((v) => Number.isFinite(v) && v >= 0 && v <= 100);
  const totals100 = Math.abs(total - 100) < 0.01;
  return (
    <div className="flex flex-col gap-3 rounded-lg border border-ink/25 bg-paper-raised px-4 py-3">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p role="status" aria-live="polite" className="text-[0.9375rem]">
          Weights total{' '}
          <span data-testid="weights-total" className={`figures font-semibold ${totals100 ? 'text-teal' : 'text-rust'}`}>
            {figures.percent(total)}
          </span>
          <span className="ml-2 text-ink-soft">{totals100 ? '— ready to save.' : `— they must total 100% (${figures.percent(100 - total)} to place).`}</span>
        </p>
        <div className="flex flex-wrap gap-3">
          <Button variant="quiet" onClick={() => onDraft(null)}>
            Cancel
          </Button>
          <Button onClick={() => void saveWeights()} disabled={!eachValid || !totals100} busy={saver.saving} busyLabel="Saving the weights…">
            Save the weights
          </Button>
        </div>
      </div>
      {!eachValid && <p className="text-[0.8125rem] font-medium text-rust">Each weight is a percentage from 0 to 100.</p>}
      <SaveProblemNotice problem={saver.problem} onDismiss={saver.clearProblem} />
    </div>
  );
}

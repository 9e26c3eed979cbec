import { useState, type ReactNode } from 'react';
import type { GridResponse } from '@contracts/grid';
import type { Sale } from '@contracts/sales';
import { Button } from '../../../components/ui/button';
import { useGridSave } from '../hooks/use-grid-save';
import type { Figures } from '../lib/grid-figures';
import { GridChecks } from './grid-checks';
import { GridTable } from './grid-table';
import { LineItemsEditor } from './line-items-editor';
import { RatePanel } from './rate-panel';
import { ReconciliationComment } from './reconciliation-comment';
import { ReconciliationPanel } from './reconciliation-panel';
import { draftTotal, WeightInput, WeightsBar, type WeightDraft } from './weights-bar';

interface GridWorkspaceProps {
  assignmentId: number;
  effectiveDate: string;
  grid: GridResponse;
  sales: readonly Sale[];
  figures: Figures;
  editable: boolean;
  /** Called when the server refuses a write for a reason other than a stale version. */
  onRefused: (error: unknown) => void;
  /** Under the comment: the submission (the page brings it from the workflow feature). */
  submission?: ReactNode;
}

/** The Adjustments step's body: the floor-area rate, the grid, line items and weights, the
 * reconciliation with its cross-check, the soft checks, the comment. Each part saves on its own,
 * with its own answer to a stale version, so one refusal never throws away another part's typing. */
export function GridWorkspace({ assignmentId, effectiveDate, grid, sales, figures, editable, onRefused, submission }: GridWorkspaceProps) {
  const rateSaver = useGridSave(assignmentId, figures, onRefused);
  const lineItemSaver = useGridSave(assignmentId, figures, onRefused);
  const weightSaver = useGridSave(assignmentId, figures, onRefused);
  const valueSaver = useGridSave(assignmentId, figures, onRefused);
  const commentSaver = useGridSave(assignmentId, figures, onRefused);
  const [editingSaleId, setEditingSaleId] = useState<number | null>(null);
  const [weightDraft, setWeightDraft] = useState<WeightDraft | null>(null);
  const flagged = new Set(grid.checks.filter((c) => c.code === 'flagged-sale' && c.saleId !== null).map((c) => c.saleId!));
  const stillInGrid = editingSaleId !== null && grid.rows.some((r) => r.saleId === editingSaleId);

  return (
    <div className="flex flex-col gap-6">
      <RatePanel grid={grid} figures={figures} editable={editable} saver={rateSaver} />

      <section aria-labelledby="grid-title" className="flex flex-col gap-3">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h3 id="grid-title" className="text-lg font-semibold">
            Adjustment grid
          </h3>
          <p className="text-[0.8125rem] text-ink-faint">Sales are marked for the grid on the Comparables step.</p>
        </div>
        {grid.rows.length === 0 ? (
          <p className="rounded-lg border border-dashed border-rule-strong px-5 py-8 text-center text-[0.9375rem] text-ink-soft">
            {grid.rate.value === null || grid.subjectArea === null
              ? 'The grid needs the subject’s floor area and a floor-area rate before it can adjust any sale.'
              : 'No sale is marked for the grid yet: mark three to six on the Comparables step.'}
          </p>
        ) : (
          <GridTable
            grid={grid}
            figures={figures}
            sales={sales}
            effectiveDate={effectiveDate}
            flaggedSaleIds={flagged}
            typedWeightTotal={weightDraft ? draftTotal(weightDraft) : null}
            weightInputs={weightDraft ? (row) => <WeightInput row={row} draft={weightDraft} onChange={setWeightDraft} /> : null}
            lineItemAction={
              editable
                ? (row) => (
                    <Button size="sm" variant="quiet" className="font-sans text-sm" onClick={() => setEditingSaleId(row.saleId)} aria-label={`Edit the line items of ${row.address}`}>
                      Edit line items
                    </Button>
                  )
                : null
            }
          />
        )}
        {editable && stillInGrid && (
          <LineItemsEditor key={editingSaleId} grid={grid} saleId={editingSaleId} figures={figures} saver={lineItemSaver} onClose={() => setEditingSaleId(null)} />
        )}
        {editable && <WeightsBar grid={grid} figures={figures} draft={weightDraft} onDraft={setWeightDraft} saver={weightSaver} />}
      </section>

      <ReconciliationPanel grid={grid} figures={figures} editable={editable} saver={valueSaver} />
      <GridChecks checks={grid.checks} />

      <section aria-labelledby="submission-title" className="flex flex-col gap-4 rounded-lg border border-rule bg-paper-raised px-5 py-4">
        <h3 id="submission-title" className="text-base font-semibold">
          {editable ? 'Comment and submission' : 'Reconciliation comment'}
        </h3>
        <ReconciliationComment grid={grid} editable={editable} saver={commentSaver} />
        {submission}
      </section>
    </div>
  );
}

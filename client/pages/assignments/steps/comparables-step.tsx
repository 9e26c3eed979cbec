import { useCallback, useMemo, useState } from 'react';
import type { StepProps } from './step-registry';
import { Button, buttonClasses } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { ErrorPanel, LoadingPanel } from '../../../components/ui/query-states';
import { useSessionUser } from '../../../features/auth/hooks/use-session-user';
import { CompMap } from '../../../features/comp-map/lazy-comp-map';
import { MapLegend } from '../../../features/comp-map/components/map-legend';
import { PhotoDropZone } from '../../../features/photos/components/photo-drop-zone';
import { PhotoStrip } from '../../../features/photos/components/photo-strip';
import { ImportSalesPanel } from '../../../features/sales-import/components/import-sales-panel';
import { salesCsvUrl } from '../../../features/sales/api/sale-queries';
import { GridCount } from '../../../features/sales/components/grid-count';
import { SaleDialog, type SaleDialogMode } from '../../../features/sales/components/sale-dialog';
import { SalesFilters } from '../../../features/sales/components/sales-filters';
import { SalesTable } from '../../../features/sales/components/sales-table';
import { useCompSet } from '../../../features/sales/hooks/use-comp-set';
import { useQuickSaleEdits } from '../../../features/sales/hooks/use-quick-sale-edits';
import { filterCompRows, NO_NEIGHBOURHOOD, noFilters, type CompRow } from '../../../features/sales/lib/comp-rows';
import { figuresFor } from '../../../features/sales/lib/figures';
import { salePopup, salesOnMap } from '../../../features/sales/lib/map-sales';

const EDITABLE_STATUSES = new Set(['in_progress', 'revisions_requested']);

/** Step 2: the comp set on the map beside the sales table; add, edit, import, choose grid sales. */
export function ComparablesStep({ detail }: StepProps) {
  const user = useSessionUser();
  const { assignment } = detail;
  const editable = user.role === 'appraiser' && EDITABLE_STATUSES.has(assignment.status);
  const figures = useMemo(() => figuresFor(assignment.currency, assignment.areaUnit), [assignment.currency, assignment.areaUnit]);
  const { sales, analysis, rows, hasFit, subjectLocation } = useCompSet(detail);
  const [filters, setFilters] = useState(noFilters);
  const shown = useMemo(() => filterCompRows(rows, filters), [rows, filters]);
  const mapSales = useMemo(() => salesOnMap(shown), [shown]);
  const neighbourhoods = useMemo(() => [...new Set(rows.map((r) => r.sale.neighbourhood ?? NO_NEIGHBOURHOOD))].sort(), [rows]);
  const rowById = useMemo(() => new Map(rows.map((r) => [r.sale.id, r])), [rows]);
  const [selectedId, setSelectedId] = useState<number | null>(null);
  const [dialog, setDialog] = useState<SaleDialogMode | null>(null);
  const [importing, setImporting] = useState(false);
  const quick = useQuickSaleEdits(assignment.id);

  const editRow = useCallback((row: CompRow) => setDialog({ kind: 'edit', sale: row.sale }), []);
  const editSale = useCallback((saleId: number) => {
    const row = rowById.get(saleId);
    if (row) setDialog({ kind: 'edit', sale: row.sale });
  }, [rowById]);
  const describeSale = useCallback((saleId: number) => {
    const row = rowById.get(saleId);
    return row ? salePopup(row, figures) : null;
  }, [rowById, figures]);
  const moveSale = useCallback((saleId: number, at: { lon: number; lat: number }) => {
    const row = rowById.get(saleId);
    if (row) quick.moveSale(row, at);
  }, [rowById, quick]);

  if (sales.isPending) return <LoadingPanel label="Loading the sales…" />;
  if (sales.isError) {
    return <ErrorPanel title="The sales could not be loaded" error={sales.error} onRetry={() => void sales.refetch()} retrying={sales.isFetching} />;
  }

  const gridCount = rows.filter((r) => r.sale.inGrid).length;
  const selectedRow = selectedId === null ? undefined : rowById.get(selectedId);
  const ringText = assignment.areaUnit === 'sqft' ? 'Rings at ½ and 1 mile' : 'Rings at 1 and 2 km';
  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-center justify-between gap-x-6 gap-y-3">
        <GridCount count={gridCount} />
        <div className="flex flex-wrap gap-2">
          {rows.length > 0 && (
            <a href={salesCsvUrl(assignment.id)} download className={buttonClasses('secondary')}>
              Export sales (CSV)
            </a>
          )}
          {editable && (
            <>
              <Button onClick={() => setImporting((open) => !open)} aria-expanded={importing}>
                {importing ? 'Close the CSV import' : 'Import from CSV'}
              </Button>
              <Button variant="primary" onClick={() => setDialog({ kind: 'add', at: null })}>
                Add a sale
              </Button>
            </>
          )}
        </div>
      </div>

      {!editable && (
        <Notice>
          {user.role === 'appraiser' ? 'This assignment is with the reviewer or signed: its sales are shown as they stand.' : 'You are reading the comp set; only the appraiser changes it.'}
        </Notice>
      )}
      {!subjectLocation && <Notice tone="warning">Place the subject on the map in the Subject step to see distances and rings.</Notice>}
      {analysis.isError && <Notice tone="warning">The analysis could not be loaded, so the sales are shown without residual colours or flags.</Notice>}
      {quick.problem && (
        <Notice tone="warning" actions={<Button size="sm" onClick={quick.dismissProblem}>Dismiss</Button>}>
          {quick.problem}
        </Notice>
      )}
      {importing && editable && <ImportSalesPanel assignmentId={assignment.id} />}

      <SalesFilters
        filters={filters}
        onChange={setFilters}
        neighbourhoods={neighbourhoods}
        areaSymbol={figures.areaSymbol}
        distanceSymbol={figures.distanceSymbol}
        shown={shown.length}
        total={rows.length}
      />

      <div className="grid items-start gap-4 min-[1025px]:grid-cols-[minmax(0,5fr)_minmax(0,7fr)]">
        <div className="flex flex-col gap-2.5">
          <CompMap
            label="Map of the subject and the sales"
            className="h-[28rem] min-[1025px]:h-[38rem]"
            areaUnit={assignment.areaUnit}
            subject={subjectLocation}
            sales={mapSales}
            selectedSaleId={selectedId}
            onSelectSale={setSelectedId}
            onAddSaleAt={editable ? (at) => setDialog({ kind: 'add', at }) : undefined}
            onMoveSale={editable ? moveSale : undefined}
            onEditSale={editable ? editSale : undefined}
            describeSale={describeSale}
          />
          <MapLegend ringText={ringText} hasFit={hasFit} />
          {editable && <p className="text-[0.8125rem] text-ink-faint">Click the map to add a sale there; drag a marker to move a sale.</p>}
        </div>
        <SalesTable
          className="h-[30rem] min-[1025px]:h-[38rem]"
          rows={shown}
          selectedId={selectedId}
          onSelect={setSelectedId}
          figures={figures}
          editable={editable}
          pendingGridIds={quick.pendingIds}
          onToggleGrid={quick.toggleGrid}
          onEdit={editRow}
        />
      </div>

      {selectedRow && (
        <section aria-labelledby="sale-photos-title" className="flex flex-col gap-3 rounded-lg border border-rule bg-paper-raised/60 p-5">
          <h3 id="sale-photos-title" className="font-semibold text-ink">
            Photos of {selectedRow.sale.address}
          </h3>
          <PhotoStrip assignmentId={assignment.id} saleId={selectedRow.sale.id} editable={editable} sale={selectedRow.sale} />
          {editable && <PhotoDropZone assignmentId={assignment.id} saleId={selectedRow.sale.id} />}
        </section>
      )}

      {dialog && (
        <SaleDialog
          key={dialog.kind === 'edit' ? `edit-${dialog.sale.id}` : 'add'}
          assignmentId={assignment.id}
          mode={dialog}
          currency={assignment.currency}
          areaSymbol={figures.areaSymbol}
          onClose={() => setDialog(null)}
          onSaved={(sale) => {
            setDialog(null);
            setSelectedId(sale.id);
          }}
        />
      )}
    </div>
  );
}

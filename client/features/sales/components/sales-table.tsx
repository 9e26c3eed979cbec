import { useEffect, useMemo, useRef, useState } from 'react';
import { flexRender, getCoreRowModel, getPaginationRowModel, getSortedRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import type { CompRow } from '../lib/comp-rows';
import { salesColumns, type ColumnActions } from './sales-columns';

const PAGE_SIZE = 100;
const alignRight = new Set(['saleDate', 'salePrice', 'pricePerArea', 'floorArea', 'distance']);

interface SalesTableProps extends ColumnActions {
  rows: readonly CompRow[];
  selectedId: number | null;
  onSelect: (saleId: number | null) => void;
  className?: string;
}

/**
 * The comp set as a sortable table. A click on a row selects the sale (and the map follows); a sale
 * selected on the map scrolls into view here. Long lists are paged, 100 rows a page.
 */
export function SalesTable({ rows, selectedId, onSelect, className = '', ...actions }: SalesTableProps) {
  const [sorting, setSorting] = useState<SortingState>([{ id: 'distance', desc: false }]);
  const [pagination, setPagination] = useState({ pageIndex: 0, pageSize: PAGE_SIZE });
  const { figures, editable, pendingGridIds, onToggleGrid, onEdit } = actions;
  const columns = useMemo(() => salesColumns({ figures, editable, pendingGridIds, onToggleGrid, onEdit }), [figures, editable, pendingGridIds, onToggleGrid, onEdit]);
  const table = useReactTable({
    data: rows as CompRow[],
    columns,
    state: { sorting, pagination },
    onSortingChange: setSorting,
    onPaginationChange: setPagination,
    getRowId: (row) => String(row.sale.id),
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getPaginationRowModel: getPaginationRowModel(),
    autoResetPageIndex: false,
  });

  // A sale selected elsewhere (the map): open its page and bring its row into view.
  const scroller = useRef<HTMLDivElement>(null);
  const shownFor = useRef<number | null>(null);
  useEffect(() => {
    if (selectedId === null) shownFor.current = null;
    if (selectedId === null || shownFor.current === selectedId) return;
    const index = table.getSortedRowModel().rows.findIndex((r) => r.original.sale.id === selectedId);
    // A sale just added may not be in the list yet: try again when the rows arrive.
    if (index < 0) return;
    shownFor.current = selectedId;
    const page = Math.floor(index / PAGE_SIZE);
    if (page !== table.getState().pagination.pageIndex) table.setPageIndex(page);
    requestAnimationFrame(() => scroller.current?.querySelector(`[data-sale-id="${selectedId}"]`)?.scrollIntoView({ block: 'nearest' }));
  }, [selectedId, table, rows]);

  const pageCount = table.getPageCount();
  return (
    <div className={`flex min-h-0 flex-col overflow-hidden rounded-lg border border-rule bg-paper-raised ${className}`}>
      <div ref={scroller} className="relative min-h-0 flex-1 overflow-auto">
        <table className="w-full border-separate border-spacing-0 text-left text-[0.8125rem]" aria-label="Comparable sales">
          <thead className="sticky top-0 z-[1]">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const right = alignRight.has(header.column.id);
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
                      className={`border-b border-rule-strong bg-paper-sunk px-2.5 py-2 align-bottom text-xs font-semibold tracking-wide whitespace-nowrap text-ink-soft uppercase ${right ? 'text-right' : ''}`}
                    >
                      {header.column.getCanSort() ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className={`inline-flex items-end gap-1 uppercase hover:text-ink ${right ? 'flex-row-reverse' : ''} ${sorted ? 'text-ink' : ''}`}
                        >
                          {flexRender(header.column.columnDef.header, header.getContext())}
                          {sorted && (
                            <span aria-hidden className="text-[0.625rem]">
                              {sorted === 'desc' ? '▼' : '▲'}
                            </span>
                          )}
                        </button>
                      ) : (
                        flexRender(header.column.columnDef.header, header.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => {
              const selected = row.original.sale.id === selectedId;
              return (
                <tr
                  key={row.id}
                  data-sale-id={row.original.sale.id}
                  aria-selected={selected}
                  onClick={() => onSelect(selected ? null : row.original.sale.id)}
                  className={`cursor-pointer ${selected ? 'bg-ink/[0.07] shadow-[inset_3px_0_0_var(--color-ink)]' : 'hover:bg-paper'}`}
                >
                  {row.getVisibleCells().map((cell) => (
                    <td key={cell.id} className="border-b border-rule px-2.5 py-2.5 align-top first:pl-3.5">
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  ))}
                </tr>
              );
            })}
          </tbody>
        </table>
        {rows.length === 0 && <p className="px-4 py-10 text-center text-[0.9375rem] text-ink-soft">No sale matches these filters.</p>}
      </div>
      {pageCount > 1 && (
        <div className="flex items-center justify-between gap-3 border-t border-rule px-3 py-2 text-sm text-ink-soft">
          <span className="figures">
            Page {table.getState().pagination.pageIndex + 1} of {pageCount}
          </span>
          <div className="flex gap-2">
            <button type="button" className="rounded border border-rule-strong px-2.5 py-1 disabled:opacity-50" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
              Previous
            </button>
            <button type="button" className="rounded border border-rule-strong px-2.5 py-1 disabled:opacity-50" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
              Next
            </button>
          </div>
        </div>
      )}
    </div>
  );
}

import type { ReactNode } from 'react';
import type { ColumnDef } from '@tanstack/react-table';
import { saleTypeLabels } from '@contracts/sales';
import { formatIsoDate } from '../../../lib/format-date';
import type { CompRow } from '../lib/comp-rows';
import type { Figures } from '../lib/figures';
import { FlagChips } from './flag-chips';
import { GridToggle } from './grid-toggle';
import { ResidualDot } from './residual-dot';

export interface ColumnActions {
  figures: Figures;
  editable: boolean;
  pendingGridIds: ReadonlySet<number>;
  onToggleGrid: (row: CompRow) => void;
  onEdit: (row: CompRow) => void;
}

const figureCell = 'figures text-right whitespace-nowrap';

/** A column title with its unit underneath, so that the cells can carry bare figures. */
function Titled({ label, unit }: { label: ReactNode; unit: string }) {
  return (
    <span className="inline-flex flex-col items-end leading-tight">
      <span>{label}</span>
      <span className="font-mono text-[0.6875rem] font-normal tracking-normal normal-case text-ink-faint">{unit}</span>
    </span>
  );
}

/** The sales table's columns: sortable on every figure, the derived ones included. */
export function salesColumns({ figures, editable, pendingGridIds, onToggleGrid, onEdit }: ColumnActions): ColumnDef<CompRow>[] {
  return [
    {
      id: 'inGrid',
      header: 'Grid',
      accessorFn: (r) => (r.sale.inGrid ? 1 : 0),
      sortDescFirst: true,
      cell: ({ row: { original: r } }) => (
        <GridToggle
          address={r.sale.address}
          on={r.sale.inGrid}
          busy={pendingGridIds.has(r.sale.id)}
          disabled={!editable || (r.sale.excluded && !r.sale.inGrid)}
          disabledReason={editable ? 'An excluded sale stays out of the grid.' : 'Only the appraiser can change the grid while the file is open.'}
          onToggle={() => onToggleGrid(r)}
        />
      ),
    },
    {
      id: 'address',
      header: 'Sale',
      accessorFn: (r) => r.sale.address,
      sortingFn: 'alphanumeric',
      cell: ({ row: { original: r } }) => (
        <div className="flex min-w-[10rem] gap-2">
          <ResidualDot band={r.band} inGrid={r.sale.inGrid} />
          <div className="min-w-0">
            <p className={`text-[0.875rem] leading-snug font-semibold ${r.sale.excluded ? 'text-ink-faint line-through decoration-ink-soft' : 'text-ink'}`}>{r.sale.address}</p>
            <p className="text-[0.8125rem] leading-snug text-ink-faint">
              {r.sale.neighbourhood ?? 'No neighbourhood'}
              {/* Arm's length is the norm; any other kind of sale is worth reading at a glance. */}
              {r.sale.saleType !== 'arms_length' && <span className="font-semibold text-ink-soft"> · {saleTypeLabels[r.sale.saleType]}</span>}
            </p>
            {r.sale.excluded && (
              <p className="mt-0.5 text-[0.8125rem] leading-snug text-rust">Excluded: {r.sale.exclusionReason ?? 'no reason given'}</p>
            )}
            {r.flags.length > 0 && (
              <div className="mt-1">
                <FlagChips flags={r.flags} reason={r.flagReason} />
              </div>
            )}
          </div>
        </div>
      ),
    },
    {
      id: 'saleDate',
      header: () => <Titled label="Sold" unit="months before" />,
      accessorFn: (r) => r.sale.saleDate,
      cell: ({ row: { original: r } }) => (
        <div className={`${figureCell} ${r.sale.excluded ? 'text-ink-faint line-through' : ''}`}>
          <p>{formatIsoDate(r.sale.saleDate)}</p>
          <p className="text-xs text-ink-faint" title="Months before the effective date">
            {figures.months(r.monthsSinceSale)}
          </p>
        </div>
      ),
    },
    {
      id: 'salePrice',
      header: () => <Titled label="Price" unit={figures.currency} />,
      accessorFn: (r) => r.sale.salePrice,
      sortDescFirst: true,
      cell: ({ row: { original: r } }) => <p className={`${figureCell} ${r.sale.excluded ? 'text-ink-faint line-through' : ''}`}>{figures.priceInColumn(r.sale.salePrice)}</p>,
    },
    {
      id: 'pricePerArea',
      header: () => <Titled label="Rate" unit={`per ${figures.areaSymbol}`} />,
      accessorFn: (r) => r.pricePerArea,
      sortDescFirst: true,
      cell: ({ row: { original: r } }) => <p className={`${figureCell} text-ink-soft`}>{figures.pricePerAreaInColumn(r.pricePerArea)}</p>,
    },
    {
      id: 'floorArea',
      header: () => <Titled label="Area" unit={figures.areaSymbol} />,
      accessorFn: (r) => r.sale.floorArea,
      sortDescFirst: true,
      cell: ({ row: { original: r } }) => <p className={figureCell}>{figures.areaInColumn(r.sale.floorArea)}</p>,
    },
    {
      id: 'distance',
      header: () => (
        <Titled
          label={
            <abbr title="Distance from the subject" className="no-underline">
              Dist.
            </abbr>
          }
          unit={figures.distanceSymbol}
        />
      ),
      accessorFn: (r) => r.distance ?? Number.POSITIVE_INFINITY,
      cell: ({ row: { original: r } }) => <p className={`${figureCell} text-ink-soft`}>{r.distance === null ? '—' : figures.distanceInColumn(r.distance)}</p>,
    },
    {
      id: 'actions',
      header: () => <span className="sr-only">Actions</span>,
      enableSorting: false,
      cell: ({ row: { original: r } }) =>
        editable ? (
          <button
            type="button"
            onClick={(event) => {
              event.stopPropagation();
              onEdit(r);
            }}
            aria-label={`Edit ${r.sale.address}`}
            className="rounded px-1.5 py-0.5 text-[0.8125rem] font-semibold text-ink-soft underline decoration-rule-strong underline-offset-4 hover:text-ink hover:decoration-ink"
          >
            Edit
          </button>
        ) : null,
    },
  ];
}

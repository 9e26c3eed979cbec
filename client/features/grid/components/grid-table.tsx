import type { ReactNode } from 'react';
import type { GridResponse } from '@contracts/grid';
import type { Sale } from '@contracts/sales';
import { formatIsoDate } from '../../../lib/format-date';
import type { Figures } from '../lib/grid-figures';
import { lineItemFeatureLabels, type LineItemFeature } from '@contracts/grid';
import { GUIDELINE_NOTE, monthsBetween } from '../lib/grid-labels';

type Row = GridResponse['rows'][number];

interface GridTableProps {
  grid: GridResponse;
  figures: Figures;
  sales: readonly Sale[];
  effectiveDate: string;
  /** Sales the fit flags: drawn with the magenta ring. */
  flaggedSaleIds: ReadonlySet<number>;
  /** Cells of the weight row while the appraiser sets weights; null shows the weights. */
  weightInputs: ((row: Row) => ReactNode) | null;
  /** A button per column to edit its line items; null when read-only. */
  lineItemAction: ((row: Row) => ReactNode) | null;
  /** The total of the weights being typed, shown live under the subject; null when not editing. */
  typedWeightTotal: number | null;
}

const cell = 'border-b border-rule px-3 py-2 text-right align-top';
const labelCell = 'sticky left-0 z-[1] border-b border-r border-rule bg-paper-raised px-4 py-2 text-left align-top font-normal';

function GridRow({ label, hint, subject, cells, tone = 'plain' }: { label: string; hint?: string; subject?: ReactNode; cells: ReactNode[]; tone?: 'plain' | 'total' | 'section' }) {
  const weight = tone === 'total' ? 'font-semibold text-ink' : 'text-ink';
  return (
    <tr className={tone === 'total' ? 'bg-paper-sunk/50' : undefined}>
      <th scope="row" className={`${labelCell} ${tone === 'total' ? 'bg-paper-sunk font-semibold' : ''}`}>
        <span className="block text-[0.9375rem] text-ink">{label}</span>
        {hint && <span className="block text-xs text-ink-faint">{hint}</span>}
      </th>
      <td className={`${cell} figures border-r border-rule bg-paper/60 text-sm text-ink-soft`}>{subject ?? ''}</td>
      {cells.map((content, index) => (
        <td key={index} className={`${cell} figures text-[0.9375rem] ${weight}`}>
          {content}
        </td>
      ))}
    </tr>
  );
}

/** The adjustment grid: the subject and one column per grid sale, read top to bottom from the sale
 * price through each adjustment to the adjusted price, its net and gross share and its weight. */
export function GridTable({ grid, figures, sales, effectiveDate, flaggedSaleIds, weightInputs, lineItemAction, typedWeightTotal }: GridTableProps) {
  const weightTotal = typedWeightTotal ?? grid.weightsTotalPct;
  const { rows, rate, subjectArea, monthlyRate, limits } = grid;
  const saleOf = (row: Row) => sales.find((s) => s.id === row.saleId);
  const features = [...new Set(grid.entries.filter((e) => rows.some((r) => r.saleId === e.saleId)).flatMap((e) => e.lineItems.map((li) => li.feature)))] as LineItemFeature[];
  const itemsOf = (row: Row, feature: LineItemFeature) => grid.entries.find((e) => e.saleId === row.saleId)?.lineItems.filter((li) => li.feature === feature) ?? [];

  const areaArithmetic = (row: Row) => {
    const saleArea = saleOf(row)?.floorArea ?? null;
    return `${figures.rate(rate.value)} × (${figures.area(subjectArea)} − ${figures.area(saleArea)}) = ${figures.adjustment(row.areaAdjustment)}`;
  };
  const timeArithmetic = (row: Row) => {
    const sale = saleOf(row);
    if (monthlyRate === null || !sale) return 'Market-conditions adjustment is off for this assignment.';
    const months = monthsBetween(sale.saleDate, effectiveDate);
    return `${figures.fraction(monthlyRate)} a month × ${figures.number(Math.round(months * 10) / 10)} months × ${figures.money(row.salePrice)} = ${figures.adjustment(row.timeAdjustment)}`;
  };

  return (
    <div className="overflow-x-auto rounded-lg border border-rule bg-paper-raised">
      <table className="w-full border-collapse text-left" aria-label="Adjustment grid">
        <thead>
          <tr>
            <th scope="col" className={`${labelCell} w-48 min-w-40 border-b-rule-strong bg-paper-sunk text-xs font-semibold tracking-wide text-ink-soft uppercase`}>
              Line
            </th>
            <th scope="col" className="min-w-28 border-r border-b border-rule border-b-rule-strong bg-paper-sunk px-3 py-2 text-right align-bottom">
              <span className="block text-xs font-semibold tracking-wide text-ink-soft uppercase">Subject</span>
            </th>
            {rows.map((row, index) => (
              <th key={row.saleId} scope="col" className="min-w-36 border-b border-rule-strong bg-paper-sunk px-3 py-2 text-right align-bottom">
                <span className="figures block text-xs text-ink-faint">Sale {index + 1}</span>
                <span className="inline-flex items-center justify-end gap-1.5 text-[0.9375rem] font-semibold text-ink">
                  {flaggedSaleIds.has(row.saleId) && <span title="Flagged by the fit" aria-label="flagged by the fit" className="inline-block size-3 rounded-full border-2 border-flag-ring" />}
                  {row.address}
                </span>
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          <GridRow label="Sale date" hint="subject: the effective date" subject={formatIsoDate(effectiveDate)} cells={rows.map((r) => (saleOf(r) ? formatIsoDate(saleOf(r)!.saleDate) : '—'))} />
          <GridRow label="Floor area" subject={figures.area(subjectArea)} cells={rows.map((r) => figures.area(saleOf(r)?.floorArea))} />
          <GridRow label="Sale price" tone="total" cells={rows.map((r) => figures.money(r.salePrice))} />
          <GridRow label="Seller concessions" hint="paid by the seller, taken off" cells={rows.map((r) => figures.adjustment(r.concessionAdjustment))} />
          <GridRow
            label="Market conditions"
            hint={monthlyRate === null ? 'time adjustment off' : `${figures.fraction(monthlyRate)} a month`}
            cells={rows.map((r) => (
              <span title={timeArithmetic(r)} className="cursor-help underline decoration-rule-strong decoration-dotted underline-offset-4">
                {figures.adjustment(r.timeAdjustment)}
              </span>
            ))}
          />
          <GridRow
            label="Floor-area adjustment"
            hint={`${figures.rate(rate.value)} × difference`}
            cells={rows.map((r) => (
              <span title={areaArithmetic(r)} aria-label={`${figures.adjustment(r.areaAdjustment)}: ${areaArithmetic(r)}`} className="cursor-help underline decoration-rule-strong decoration-dotted underline-offset-4">
                {figures.adjustment(r.areaAdjustment)}
              </span>
            ))}
          />
          {features.map((feature) => (
            <GridRow
              key={feature}
              label={lineItemFeatureLabels[feature]}
              hint="typed by the appraiser"
              cells={rows.map((r) => {
                const items = itemsOf(r, feature);
                if (items.length === 0) return <span className="text-ink-faint">—</span>;
                const total = items.reduce((t, li) => t + li.amount, 0);
                return <span title={items.map((li) => li.note).filter(Boolean).join(' · ') || undefined}>{figures.adjustment(total)}</span>;
              })}
            />
          ))}
          <GridRow
            label={features.length ? 'Line items, total' : 'Line items'}
            hint={features.length ? undefined : 'none typed yet'}
            cells={rows.map((r) => (
              <span className="inline-flex flex-col items-end gap-1">
                {figures.adjustment(r.lineItemTotal)}
                {lineItemAction?.(r)}
              </span>
            ))}
          />
          <GridRow label="Adjusted price" tone="total" subject={<span title="Opinion of value">{figures.money(grid.opinionOfValue)}</span>} cells={rows.map((r) => figures.money(r.adjustedPrice))} />
          <GridRow
            label="Net adjustment"
            hint={`marked above ${figures.percent(limits.netLimitPct)}`}
            cells={rows.map((r) => <Share pct={r.netAdjustmentPct} over={r.netOverLimit} figures={figures} amount={r.adjustedPrice - r.salePrice} />)}
          />
          <GridRow
            label="Gross adjustment"
            hint={`marked above ${figures.percent(limits.grossLimitPct)}`}
            cells={rows.map((r) => <Share pct={r.grossAdjustmentPct} over={r.grossOverLimit} figures={figures} />)}
          />
          <GridRow
            label="Weight"
            hint={rows.some((r) => !r.weightIsDefault) ? 'set by the appraiser' : 'default: 1 ÷ gross, normalised'}
            subject={<span className={Math.abs(weightTotal - 100) < 0.01 ? 'text-ink-faint' : 'font-semibold text-rust'}>Total {figures.percent(weightTotal)}</span>}
            cells={rows.map((r) => (weightInputs ? weightInputs(r) : figures.percent(r.weightPct)))}
          />
        </tbody>
      </table>
      <p className="border-t border-rule px-4 py-2.5 text-[0.8125rem] text-ink-faint">
        Net and gross shares above the firm’s limits are marked as a question, not an error: a {GUIDELINE_NOTE}. Hover a figure to see its arithmetic.
      </p>
    </div>
  );
}

function Share({ pct, over, figures, amount }: { pct: number; over: boolean; figures: Figures; amount?: number }) {
  return (
    <span className="inline-flex flex-col items-end">
      {amount !== undefined && <span className="text-sm text-ink-soft">{figures.adjustment(amount)}</span>}
      <span className={over ? 'font-semibold text-rust' : undefined}>
        {over && (
          <span className="mr-1.5 rounded-sm bg-rust-wash px-1 text-[0.6875rem] font-semibold tracking-wide uppercase" title={GUIDELINE_NOTE}>
            above limit
          </span>
        )}
        {figures.fraction(pct)}
      </span>
    </span>
  );
}

import type { ReportSnapshot } from '@contracts/report';
import type { ReportFormat } from '../lib/report-format';
import { lineItemFeatureLabels } from '@contracts/grid';

type Row = ReportSnapshot['grid']['rows'][number];
type Entry = ReportSnapshot['grid']['entries'][number];

function Line({ label, note, amount, format, strong = false }: { label: string; note?: string | null; amount: number; format: ReportFormat; strong?: boolean }) {
  return (
    <div className={`grid grid-cols-[minmax(0,1fr)_auto] gap-x-3 py-1.5 ${strong ? 'border-t-2 border-ink pt-2' : 'border-t border-dotted border-rule-strong'}`}>
      <dt className={`text-[0.875rem] ${strong ? 'font-semibold text-ink' : 'text-ink-soft'}`}>
        {label}
        {note && <span className="block text-[0.75rem] leading-snug text-ink-faint">{note}</span>}
      </dt>
      <dd className={`figures text-right text-[0.875rem] whitespace-nowrap ${strong ? 'font-semibold text-ink' : amount === 0 ? 'text-ink-faint' : 'text-ink'}`}>
        {strong ? format.money(amount) : format.signedMoney(amount)}
      </dd>
    </div>
  );
}

/** One grid sale's way from its price to its adjusted price, line by line, with the guideline
 * checks and the weight it carries in the reconciliation. */
export function SaleLedger({ row, entry, floorArea, subjectArea, rate, format }: { row: Row; entry: Entry | null; floorArea: number; subjectArea: number | null; rate: number | null; format: ReportFormat }) {
  const areaNote = rate !== null && subjectArea !== null ? `${format.money(rate)}/${format.unit} × (${format.areaNumber(subjectArea)} − ${format.areaNumber(floorArea)})` : null;
  return (
    <div className="flex flex-col gap-2">
      <dl aria-label={`Adjustments to ${row.address}`}>
        <div className="grid grid-cols-[minmax(0,1fr)_auto] gap-x-3 pb-1.5">
          <dt className="text-[0.875rem] text-ink-soft">Sale price</dt>
          <dd className="figures text-right text-[0.875rem] text-ink">{format.money(row.salePrice)}</dd>
        </div>
        {row.concessionAdjustment !== 0 && <Line label="Seller concessions" amount={row.concessionAdjustment} format={format} />}
        <Line label="Market conditions (time)" amount={row.timeAdjustment} format={format} />
        <Line label="Floor area" note={areaNote} amount={row.areaAdjustment} format={format} />
        {(entry?.lineItems ?? []).map((item, i) => (
          <Line key={i} label={lineItemFeatureLabels[item.feature] ?? item.feature} note={item.note || null} amount={item.amount} format={format} />
        ))}
        <Line label="Adjusted price" amount={row.adjustedPrice} format={format} strong />
      </dl>
      <p className="figures flex flex-wrap gap-x-4 gap-y-1 text-[0.75rem] text-ink-soft">
        <span className={row.netOverLimit ? 'font-semibold text-rust' : ''}>
          net {format.percent(row.netAdjustmentPct)}
          {row.netOverLimit ? ' ▲' : ''}
        </span>
        <span className={row.grossOverLimit ? 'font-semibold text-rust' : ''}>
          gross {format.percent(row.grossAdjustmentPct)}
          {row.grossOverLimit ? ' ▲' : ''}
        </span>
        <span>
          weight {format.pct(row.weightPct, 0)}
          {row.weightIsDefault ? ' (by 1/gross)' : ''}
        </span>
      </p>
    </div>
  );
}

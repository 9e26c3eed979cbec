import { Link } from 'react-router-dom';
import { pointFlagWords, type FlaggedSale, type GroupAnalysis } from '@contracts/analysis';
import { saleTypeLabels, saleTypes, type SaleType } from '@contracts/sales';
import type { FigureFormat } from '../lib/figure-format';
import { flagMeanings } from '../lib/flag-words';
import { saleHref, type SaleLookup } from '../lib/sale-lookup';

interface Props {
  assignmentId: number;
  group: GroupAnalysis;
  otherGroups: readonly GroupAnalysis[];
  format: FigureFormat;
  lookup: SaleLookup;
  onChooseGroup: (name: string) => void;
}

function saleTypeWords(code: string): string {
  return (saleTypes as readonly string[]).includes(code) ? saleTypeLabels[code as SaleType] : code;
}

const linkClass = 'font-semibold text-ink underline decoration-rule-strong underline-offset-4 hover:decoration-ink';

/** The sales the chosen fit cannot explain, each with its flags, the reason in words and how it
 * stands (sale type, in the grid, revealed once others were set aside). */
export function FlaggedSales({ assignmentId, group, otherGroups, format, lookup, onChooseGroup }: Props) {
  if (group.pooled) {
    const withFlags = otherGroups.filter((g) => !g.pooled && g.flagged.length > 0);
    return (
      <div className="text-[0.9375rem] text-ink-soft">
        <p>Flags are judged within each neighbourhood, where price levels are alike; the pooled fit flags no sale.</p>
        {withFlags.length > 0 && (
          <p className="mt-2 flex flex-wrap gap-x-4 gap-y-1">
            {withFlags.map((g) => (
              <button key={g.neighbourhood} type="button" onClick={() => onChooseGroup(g.neighbourhood)} className={linkClass}>
                {g.neighbourhood}: {g.flagged.length} flagged
              </button>
            ))}
          </p>
        )}
      </div>
    );
  }
  if (!group.fit) {
    return <p className="text-[0.9375rem] text-ink-soft">Without a line there is nothing to measure the sales against, so none is flagged.</p>;
  }
  if (group.flagged.length === 0) {
    return <p className="text-[0.9375rem] text-ink-soft">No sale in {group.neighbourhood} is flagged: each lies within the scatter the line expects.</p>;
  }
  return (
    <ol className="flex flex-col divide-y divide-rule" data-testid="flagged-sales">
      {group.flagged.map((sale) => (
        <FlaggedSaleItem key={sale.saleId} sale={sale} assignmentId={assignmentId} format={format} lookup={lookup} />
      ))}
    </ol>
  );
}

function FlaggedSaleItem({ sale, assignmentId, format, lookup }: { sale: FlaggedSale; assignmentId: number; format: FigureFormat; lookup: SaleLookup }) {
  const revealedBy = sale.revealedWhenSetAside.map((id) => lookup(id).address);
  return (
    <li className="flex gap-3.5 py-3.5 first:pt-1 last:pb-1">
      <svg width="18" height="18" aria-hidden className="mt-0.5 shrink-0">
        <circle cx="9" cy="9" r="6.5" fill="none" stroke="var(--color-flag-ring)" strokeWidth="2" />
      </svg>
      <div className="min-w-0 flex-1">
        <div className="flex flex-wrap items-center gap-x-3 gap-y-1.5">
          <Link to={saleHref(assignmentId, sale.saleId)} className={linkClass}>
            {sale.address}
          </Link>
          <ul className="flex flex-wrap gap-1.5" aria-label="Flags">
            {sale.flags.map((flag) => (
              <li
                key={flag}
                title={flagMeanings[flag]}
                className="rounded-sm border border-flag-ring/35 bg-paper px-1.5 py-px text-xs font-semibold text-ink-soft"
              >
                {pointFlagWords[flag]}
              </li>
            ))}
          </ul>
          {sale.inGrid && (
            <span className="ml-auto inline-flex items-center gap-1.5 rounded-sm bg-ink px-2 py-0.5 text-xs font-semibold text-paper">
              <svg width="10" height="10" aria-hidden viewBox="0 0 10 10">
                <path d="M0.5 0.5h9v9h-9zM0.5 5h9M5 0.5v9" fill="none" stroke="currentColor" strokeWidth="1" />
              </svg>
              In the grid
            </span>
          )}
        </div>
        <p className="mt-1.5 text-[0.9375rem] leading-relaxed text-ink-soft">{sale.reason}</p>
        {revealedBy.length > 0 && (
          <p className="mt-1 text-[0.875rem] text-ink">
            <span className="font-semibold">Seen only once others were set aside:</span> {revealedBy.join(', ')}.
          </p>
        )}
        <p className="mt-1.5 flex flex-wrap gap-x-5 gap-y-0.5 text-[0.8125rem] text-ink-faint">
          <span>Sale type: <span className="text-ink-soft">{saleTypeWords(sale.saleType)}</span></span>
          <span>
            Residual <span className="figures text-ink-soft">{format.signedMoney(sale.residual)}</span>
            {sale.residualPct !== null && <span className="figures text-ink-soft"> ({format.signedPercent(sale.residualPct)})</span>}
          </span>
          <span>
            Studentized <span className="figures text-ink-soft">{format.signedRatio(sale.externallyStudentized)}</span>
          </span>
          <span>
            Cook’s distance <span className="figures text-ink-soft">{sale.cooksDistance === null ? 'not defined' : format.ratio(sale.cooksDistance)}</span>
          </span>
        </p>
      </div>
    </li>
  );
}

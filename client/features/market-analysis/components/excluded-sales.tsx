import { Link } from 'react-router-dom';
import type { Analysis } from '@contracts/analysis';
import { saleHref } from '../lib/sale-lookup';

/** Sales set aside by the appraiser: still listed, struck through, each with its reason. */
export function ExcludedSales({ assignmentId, excluded }: { assignmentId: number; excluded: Analysis['excluded'] }) {
  if (excluded.length === 0) {
    return <p className="text-[0.9375rem] text-ink-soft">No sale has been set aside: every sale of the assignment is in the analysis.</p>;
  }
  return (
    <ul className="flex flex-col divide-y divide-rule" data-testid="excluded-sales">
      {excluded.map((sale) => (
        <li key={sale.saleId} className="flex flex-col gap-0.5 py-2.5 first:pt-0 last:pb-0 sm:flex-row sm:gap-6">
          <Link to={saleHref(assignmentId, sale.saleId)} className="shrink-0 text-ink-soft line-through decoration-ink-soft/70 hover:text-ink sm:w-60">
            {sale.address}
          </Link>
          <p className="text-[0.9375rem] text-ink-soft">
            <span className="text-ink-faint">Reason: </span>
            {sale.reason ?? 'no reason recorded'}
          </p>
        </li>
      ))}
    </ul>
  );
}

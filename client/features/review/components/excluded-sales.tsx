import type { Analysis } from '@contracts/analysis';

/** Sales the appraiser excluded: still listed, struck through, each with the reason given. */
export function ExcludedSales({ excluded }: { excluded: Analysis['excluded'] }) {
  if (excluded.length === 0) return null;
  return (
    <section aria-labelledby="excluded-title" className="flex flex-col gap-2">
      <h4 id="excluded-title" className="text-sm font-semibold text-ink">
        Excluded sales
      </h4>
      <ul className="flex flex-col divide-y divide-rule rounded-lg border border-rule bg-paper-sunk/40" aria-label="Excluded sales">
        {excluded.map((sale) => (
          <li key={sale.saleId} className="px-4 py-2.5" data-testid="excluded-sale">
            <p className="font-semibold text-ink-faint line-through decoration-rust/70 decoration-2">{sale.address}</p>
            <p className="text-[0.875rem] text-ink-soft">
              <span className="font-semibold text-ink-soft">Reason: </span>
              {sale.reason ?? 'no reason recorded'}
            </p>
          </li>
        ))}
      </ul>
    </section>
  );
}

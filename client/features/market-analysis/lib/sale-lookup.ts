import type { Analysis } from '@contracts/analysis';
import type { Sale } from '@contracts/sales';

/** What a chart needs to name a sale it draws. */
export interface SaleFacts {
  address: string;
  salePrice: number | null;
}

export type SaleLookup = (saleId: number) => SaleFacts;

/** Names each sale from the sales list; while that list is missing, from the flagged and excluded
 * lists of the analysis; and as "Sale 12" when neither knows it. */
export function saleLookup(sales: readonly Sale[] | undefined, analysis: Analysis): SaleLookup {
  const known = new Map<number, SaleFacts>();
  for (const group of analysis.groups) for (const f of group.flagged) known.set(f.saleId, { address: f.address, salePrice: null });
  for (const e of analysis.excluded) known.set(e.saleId, { address: e.address, salePrice: null });
  for (const s of sales ?? []) known.set(s.id, { address: s.address, salePrice: s.salePrice });
  return (saleId) => known.get(saleId) ?? { address: `Sale ${saleId}`, salePrice: null };
}

/** Where a sale is opened: its row on the comparables step. */
export function saleHref(assignmentId: number, saleId: number): string {
  return `/assignments/${assignmentId}/comparables?sale=${saleId}`;
}

import type { Reconsideration } from '@contracts/reconsiderations';

export const requestStatusWords: Record<Reconsideration['status'], string> = {
  open: 'Waiting for the appraiser',
  value_kept: 'Answered: the value stands',
  new_version: 'Answered: a revised report will follow',
};

export const requestStatusTone: Record<Reconsideration['status'], 'pending' | 'neutral' | 'positive'> = {
  open: 'pending',
  value_kept: 'neutral',
  new_version: 'positive',
};

/** A sale as the client sent it (stored as a plain record), read safely for display. */
export function extraSaleSummary(sale: Record<string, unknown>) {
  const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : null);
  return {
    address: typeof sale.address === 'string' ? sale.address : 'Unnamed sale',
    saleDate: typeof sale.saleDate === 'string' ? sale.saleDate : null,
    salePrice: num(sale.salePrice),
    floorArea: num(sale.floorArea),
    neighbourhood: typeof sale.neighbourhood === 'string' ? sale.neighbourhood : null,
  };
}

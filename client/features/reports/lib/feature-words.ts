import { saleTypeLabels, type SaleType } from '@contracts/sales';

/** Words for the sale types, as the report prints them. */
export function saleTypeWords(type: string): string {
  return saleTypeLabels[type as SaleType] ?? type;
}

import { saleTypeLabels, type SaleType } from '@contracts/sales';

/** Words for the line-item features of the grid and for the sale types, as the report prints them. */
export const featureWords: Record<string, string> = {
  bathrooms: 'Bathrooms',
  garage: 'Garage',
  view: 'View',
  condition: 'Condition',
  lot: 'Lot',
  quality: 'Quality',
  other: 'Other',
};

export function saleTypeWords(type: string): string {
  return saleTypeLabels[type as SaleType] ?? type;
}

export const flagWords: Record<string, string> = {
  unusual: 'unusual',
  outlier: 'outlier',
  influential: 'influential',
  'high-leverage': 'high leverage',
};

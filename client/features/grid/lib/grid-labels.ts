export type { LineItemFeature } from '@contracts/grid';

/** Names of the soft checks, as the reviewer would say them. */
export const checkLabels: Record<string, string> = {
  'few-sales': 'Few sales',
  'old-sale': 'Old sale',
  'far-sale': 'Far sale',
  'not-bracketed': 'Not bracketed',
  'flagged-sale': 'Flagged by the fit',
  'net-over': 'Net above the guideline',
  'gross-over': 'Gross above the guideline',
  'weights-total': 'Weights',
  'outside-range': 'Outside the range',
};

export const GUIDELINE_NOTE = 'legacy guideline, common practice, no single source';

const DAYS_PER_MONTH = 365.25 / 12;

/** Months between a sale and the effective date, both 'YYYY-MM-DD'. */
export function monthsBetween(saleDate: string, effectiveDate: string): number {
  return (Date.parse(`${effectiveDate}T00:00:00Z`) - Date.parse(`${saleDate}T00:00:00Z`)) / 86_400_000 / DAYS_PER_MONTH;
}

/** Money in the assignment's ISO 4217 currency, whole units (e.g. "$432,000"). */
export function formatMoney(amount: number, currency: string): string {
  return new Intl.NumberFormat('en-US', { style: 'currency', currency, maximumFractionDigits: 0 }).format(amount);
}

import type { GridResponse } from '@contracts/grid';
import type { Figures } from './grid-figures';

type Settings = GridResponse['settings'];
type Entry = GridResponse['entries'][number];

const quote = (text: string | null) => (text ? `reads “${text.length > 80 ? `${text.slice(0, 77)}…` : text}”` : 'is now empty');

/** What someone else changed in the grid settings between the copy this page had and the server's. */
export function settingsChanges(before: Settings, after: Settings, figures: Figures): string[] {
  const changes: string[] = [];
  if (before.typedRate !== after.typedRate) {
    const word = (rate: number | null) => (rate === null ? 'the fit’s rate' : figures.rate(rate));
    changes.push(`The floor-area rate is now ${word(after.typedRate)} (was ${word(before.typedRate)}).`);
  }
  if (before.rateIncrement !== after.rateIncrement) changes.push(`The rate is now rounded to ${figures.precise(after.rateIncrement)} (was ${figures.precise(before.rateIncrement)}).`);
  if (before.rateJustification !== after.rateJustification) changes.push(`The rate’s justification ${quote(after.rateJustification)}`);
  if (before.valueIncrement !== after.valueIncrement) changes.push(`The opinion of value is now rounded to ${figures.money(after.valueIncrement)} (was ${figures.money(before.valueIncrement)}).`);
  if (before.reconciliationComment !== after.reconciliationComment) changes.push(`The reconciliation comment ${quote(after.reconciliationComment)}`);
  return changes;
}

/** What someone else changed in one sale's grid entry. */
export function entryChanges(address: string, before: Entry | undefined, after: Entry | undefined, figures: Figures): string[] {
  const changes: string[] = [];
  const items = (entry: Entry | undefined) => entry?.lineItems ?? [];
  const list = (entry: Entry | undefined) => items(entry).map((li) => `${li.feature} ${figures.adjustment(li.amount)}`).join(', ') || 'none';
  if (JSON.stringify(items(before)) !== JSON.stringify(items(after))) changes.push(`${address}: line items are now ${list(after)} (were ${list(before)}).`);
  const weight = (entry: Entry | undefined) => (entry?.weightPct == null ? 'the default' : figures.percent(entry.weightPct));
  if ((before?.weightPct ?? null) !== (after?.weightPct ?? null)) changes.push(`${address}: the weight is now ${weight(after)} (was ${weight(before)}).`);
  return changes;
}

/** Every difference in settings and entries, for a write that touched several of them. */
export function gridChanges(before: GridResponse | undefined, after: GridResponse, figures: Figures): string[] {
  if (!before) return [];
  const address = (saleId: number) => after.rows.find((r) => r.saleId === saleId)?.address ?? before.rows.find((r) => r.saleId === saleId)?.address ?? `Sale ${saleId}`;
  const saleIds = new Set([...before.entries, ...after.entries].map((e) => e.saleId));
  const entryDiffs = [...saleIds].flatMap((saleId) =>
    entryChanges(address(saleId), before.entries.find((e) => e.saleId === saleId), after.entries.find((e) => e.saleId === saleId), figures),
  );
  const rowsBefore = before.rows.map((r) => r.saleId).join();
  const rowsAfter = after.rows.map((r) => r.saleId).join();
  const salesDiff = rowsBefore === rowsAfter ? [] : ['The sales in the grid changed on the Comparables step.'];
  return [...settingsChanges(before.settings, after.settings, figures), ...entryDiffs, ...salesDiff];
}

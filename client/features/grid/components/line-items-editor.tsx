import { useState } from 'react';
import { lineItemFeatures, type GridResponse } from '@contracts/grid';
import { Button } from '../../../components/ui/button';
import type { useGridSave } from '../hooks/use-grid-save';
import type { Figures } from '../lib/grid-figures';
import { lineItemFeatureLabels, type LineItemFeature } from '@contracts/grid';
import { SaveProblemNotice } from './save-problem';

interface DraftItem {
  key: number;
  feature: LineItemFeature;
  amount: string;
  note: string;
}

interface LineItemsEditorProps {
  grid: GridResponse;
  saleId: number;
  figures: Figures;
  saver: ReturnType<typeof useGridSave>;
  onClose: () => void;
}

let nextKey = 1;
const control =
  'h-9 w-full rounded-md border border-rule-strong bg-paper-raised px-2.5 text-[0.9375rem] text-ink focus:border-ink focus:ring-2 focus:ring-ink/15 focus:outline-none';

/** The appraiser's own adjustments for one grid sale: feature, amount (+ adds to the sale's price,
 * − takes off) and a note; saved together with the entry's version. */
export function LineItemsEditor({ grid, saleId, figures, saver, onClose }: LineItemsEditorProps) {
  const row = grid.rows.find((r) => r.saleId === saleId);
  const entry = grid.entries.find((e) => e.saleId === saleId);
  const [items, setItems] = useState<DraftItem[]>(() =>
    (entry?.lineItems ?? []).map((li) => ({ key: nextKey++, feature: li.feature, amount: String(li.amount), note: li.note })),
  );
  const [tried, setTried] = useState(false);
  if (!row) return null;

  const parsed = items.map((item) => ({ ...item, value: item.amount.trim() === '' ? NaN : Number(item.amount.replace(/[,\s]/g, '')) }));
  const invalid = parsed.some((item) => !Number.isFinite(item.value));
  const total = parsed.reduce((t, item) => t + (Number.isFinite(item.value) ? item.value : 0), 0);
  const change = (key: number, patch: Partial<DraftItem>) => setItems(items.map((item) => (item.key === key ? { ...item, ...patch } : item)));

  async function save() {
    setTried(true);
    if (invalid) return;
    const saved = await saver.save([
      {
        kind: 'entry',
        saleId,
        change: {
          version: entry?.version ?? 0,
          lineItems: parsed.map((item) => ({ feature: item.feature, amount: item.value, note: item.note.trim() })),
          weightPct: entry?.weightPct ?? null,
        },
      },
    ]);
    if (saved) onClose();
  }

  return (
    <section aria-labelledby="line-items-title" className="rounded-lg border border-ink/25 bg-paper-raised shadow-[0_1px_0_rgb(29_42_68/0.06)]">
      <header className="flex flex-wrap items-baseline justify-between gap-2 border-b border-rule px-5 py-3">
        <h3 id="line-items-title" className="text-base font-semibold">
          Line items for {row.address}
        </h3>
        <p className="text-[0.8125rem] text-ink-faint">A plus adds to the sale’s price, a minus takes off: adjust the sale towards the subject.</p>
      </header>
      <div className="flex flex-col gap-3 px-5 py-4">
        {items.length === 0 && <p className="text-[0.9375rem] text-ink-soft">No line items for this sale. Add one for each difference the market pays for.</p>}
        {items.length > 0 && (
          <div className="hidden grid-cols-[10rem_9rem_minmax(0,1fr)_auto] gap-3 text-xs font-semibold tracking-wide text-ink-soft uppercase md:grid">
            <span>Feature</span>
            <span>Amount ({figures.currency})</span>
            <span>Note</span>
            <span className="sr-only">Remove</span>
          </div>
        )}
        {parsed.map((item, index) => {
          const bad = tried && !Number.isFinite(item.value);
          return (
            <div key={item.key} className="grid grid-cols-2 gap-3 md:grid-cols-[10rem_9rem_minmax(0,1fr)_auto] md:items-start">
              <select aria-label={`Feature of line item ${index + 1}`} className={control} value={item.feature} onChange={(e) => change(item.key, { feature: e.target.value as LineItemFeature })}>
                {lineItemFeatures.map((feature) => (
                  <option key={feature} value={feature}>
                    {lineItemFeatureLabels[feature]}
                  </option>
                ))}
              </select>
              <div>
                <input
                  aria-label={`Amount of line item ${index + 1}`}
                  inputMode="decimal"
                  placeholder="e.g. -5000"
                  className={`${control} figures text-right ${bad ? 'border-rust' : ''}`}
                  aria-invalid={bad || undefined}
                  value={item.amount}
                  onChange={(e) => change(item.key, { amount: e.target.value })}
                />
                {bad && <p className="mt-1 text-[0.8125rem] font-medium text-rust">Type an amount such as 5000 or -2500.</p>}
              </div>
              <input
                aria-label={`Note of line item ${index + 1}`}
                placeholder="What the market pays for this difference, and the support"
                maxLength={500}
                className={`${control} col-span-2 md:col-span-1`}
                value={item.note}
                onChange={(e) => change(item.key, { note: e.target.value })}
              />
              <Button size="sm" variant="quiet" className="col-span-2 justify-self-start md:col-span-1 md:mt-1.5" onClick={() => setItems(items.filter((i) => i.key !== item.key))}>
                Remove
              </Button>
            </div>
          );
        })}
        <div>
          <Button size="sm" onClick={() => setItems([...items, { key: nextKey++, feature: 'other', amount: '', note: '' }])} disabled={items.length >= 30}>
            Add a line item
          </Button>
        </div>
        <SaveProblemNotice problem={saver.problem} onDismiss={saver.clearProblem} />
        <div className="flex flex-wrap items-center justify-between gap-3 border-t border-rule pt-3">
          <p className="text-[0.9375rem] text-ink-soft">
            Total of the line items <span className="figures ml-1 font-semibold text-ink">{figures.adjustment(total)}</span>
          </p>
          <div className="flex gap-3">
            <Button variant="quiet" onClick={onClose}>
              Close without saving
            </Button>
            <Button onClick={() => void save()} busy={saver.saving} busyLabel="Saving…">
              Save line items
            </Button>
          </div>
        </div>
      </div>
    </section>
  );
}

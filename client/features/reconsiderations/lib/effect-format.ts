/** Figures of a reconsideration's effect, in the assignment's currency and unit ('—' when missing). */
const DASH = '—';
const ok = (v: number | null | undefined): v is number => typeof v === 'number' && Number.isFinite(v);

export function effectFormat(currency: string, areaUnit: 'sqft' | 'sqm') {
  let money: Intl.NumberFormat | null = null;
  try {
    money = new Intl.NumberFormat(undefined, { style: 'currency', currency, maximumFractionDigits: 0 });
  } catch {
    money = null;
  }
  const plain = new Intl.NumberFormat(undefined, { maximumFractionDigits: 0 });
  const unit = areaUnit === 'sqm' ? 'm²' : 'ft²';
  const asMoney = (v: number | null | undefined) => (!ok(v) ? DASH : money ? money.format(v) : `${plain.format(v)} ${currency}`);
  return {
    unit,
    money: asMoney,
    perArea: (v: number | null | undefined) => (!ok(v) ? DASH : `${asMoney(v)} per ${unit}`),
    area: (v: number | null | undefined) => (!ok(v) ? DASH : `${plain.format(v)} ${unit}`),
    r2: (v: number | null | undefined) => (!ok(v) ? DASH : new Intl.NumberFormat(undefined, { minimumFractionDigits: 3, maximumFractionDigits: 3 }).format(v)),
    count: (v: number | null | undefined) => (!ok(v) ? DASH : plain.format(v)),
    change: (before: number | null | undefined, after: number | null | undefined, show: (v: number) => string) => {
      if (!ok(before) || !ok(after)) return '';
      const d = after - before;
      const shown = show(Math.abs(d));
      // A change too small to show at the figure's precision is no change at all.
      if (!/[1-9]/.test(shown)) return 'no change';
      return `${d > 0 ? '+' : '\u2212'}${shown}`;
    },
  };
}
export type EffectFormat = ReturnType<typeof effectFormat>;

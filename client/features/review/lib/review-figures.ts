import type { GroupAnalysis } from '@contracts/analysis';

const DASH = '—';
const ok = (v: number | null | undefined): v is number => typeof v === 'number' && Number.isFinite(v);

/** R² to three decimals; to four when that is what tells two values apart. */
export function formatRSquared(value: number | null | undefined, other?: number | null): string {
  if (!ok(value)) return DASH;
  const digits = ok(other) && value.toFixed(3) === other.toFixed(3) && value !== other ? 4 : 3;
  return new Intl.NumberFormat(undefined, { minimumFractionDigits: digits, maximumFractionDigits: digits }).format(value);
}

/** 0.37 below → '37% below the line'. */
export function residualWords(residualPct: number | null | undefined): string {
  if (!ok(residualPct)) return '';
  const pct = new Intl.NumberFormat(undefined, { style: 'percent', maximumFractionDigits: 0 }).format(Math.abs(residualPct));
  return `${pct} ${residualPct < 0 ? 'below' : 'above'} the line`;
}

export interface FitSnapshot {
  neighbourhood: string;
  rSquared: number | null;
  n: number;
}

export function fitSnapshot(group: GroupAnalysis | undefined): FitSnapshot | null {
  if (!group) return null;
  return { neighbourhood: group.neighbourhood, rSquared: group.fit?.rSquared ?? null, n: group.n };
}

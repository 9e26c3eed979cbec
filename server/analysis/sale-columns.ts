// The usable sales of an assignment as typed columns, neighbourhood by neighbourhood: what the
// market analysis (market-columns.ts) computes on.
import type { AnalysisInput, AnalysisSale } from './market-analysis';
import { monthsBetween, utcDayMs } from './time-trend';

/** The usable sales as columns, neighbourhood by neighbourhood (a "position" indexes them). */
export interface SaleColumns {
  usable: readonly AnalysisSale[];
  excluded: readonly AnalysisSale[];
  /** Neighbourhood names in display order: the subject's first, then by name. */
  names: string[];
  /** Group g holds positions start[g] to start[g + 1] − 1. */
  start: Int32Array;
  /** The index into `usable` of the sale at each position. */
  order: Int32Array;
  saleId: Float64Array;
  floorArea: Float64Array;
  salePrice: Float64Array;
  monthsBefore: Float64Array;
  pricePerArea: Float64Array;
  /** The index of the subject's neighbourhood in `names`, or −1. */
  subjectGroup: number;
}

export const NO_NEIGHBOURHOOD = 'No neighbourhood';

/** The order of String.prototype.localeCompare without arguments, from one collator made once. */
const compareNames = new Intl.Collator().compare;

/**
 * Reads the sales once: sets the excluded ones aside, numbers the neighbourhoods, and writes each
 * usable sale's figures into the columns at its position (a counting sort by neighbourhood, stable,
 * so that sales keep their order within a neighbourhood).
 */
export function readSales(input: Pick<AnalysisInput, 'sales' | 'effectiveDate' | 'subject'>): SaleColumns {
  const all = input.sales;
  const usable: AnalysisSale[] = [];
  const excluded: AnalysisSale[] = [];
  const codeOf = new Map<string, number>();
  const firstNames: string[] = [];
  const codes: number[] = [];
  for (let i = 0; i < all.length; i++) {
    const s = all[i];
    if (s.excluded) {
      excluded.push(s);
      continue;
    }
    const name = s.neighbourhood ?? NO_NEIGHBOURHOOD;
    let code = codeOf.get(name);
    if (code === undefined) {
      codeOf.set(name, (code = firstNames.length));
      firstNames.push(name);
    }
    usable.push(s);
    codes.push(code);
  }
  const subjectName = input.subject.neighbourhood;
  const names = [...firstNames].sort((a, b) => (a === subjectName ? -1 : b === subjectName ? 1 : compareNames(a, b)));
  const rankOf = new Int32Array(names.length);
  names.forEach((name, rank) => (rankOf[codeOf.get(name)!] = rank));
  const G = names.length;
  const n = usable.length;
  const start = new Int32Array(G + 1);
  for (let i = 0; i < n; i++) start[rankOf[codes[i]] + 1]++;
  for (let g = 0; g < G; g++) start[g + 1] += start[g];
  const next = start.slice(0, G);
  const order = new Int32Array(n);
  const saleId = new Float64Array(n);
  const floorArea = new Float64Array(n);
  const salePrice = new Float64Array(n);
  const monthsBefore = new Float64Array(n);
  const pricePerArea = new Float64Array(n);
  const effectiveMs = utcDayMs(input.effectiveDate);
  for (let i = 0; i < n; i++) {
    const s = usable[i];
    const k = next[rankOf[codes[i]]]++;
    order[k] = i;
    saleId[k] = s.id;
    floorArea[k] = s.floorArea;
    salePrice[k] = s.salePrice;
    monthsBefore[k] = monthsBetween(utcDayMs(s.saleDate), effectiveMs);
    pricePerArea[k] = s.salePrice / s.floorArea;
  }
  const subjectGroup = subjectName === null ? -1 : names.indexOf(subjectName);
  return { usable, excluded, names, start, order, saleId, floorArea, salePrice, monthsBefore, pricePerArea, subjectGroup };
}

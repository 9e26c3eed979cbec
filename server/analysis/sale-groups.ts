// Bookkeeping for the market analysis: which usable sales belong to which neighbourhood (as indices,
// so that each sale's figures can sit in typed arrays), and the adjusted prices keyed by sale id.
import type { AnalysisSale } from './market-analysis';

/**
 * Indices into `sales` by neighbourhood, in order of first appearance, and for each sale the
 * position of its neighbourhood in that order.
 */
export function groupBy(sales: readonly AnalysisSale[], noName: string): { members: Map<string, number[]>; groupOf: Int32Array } {
  const members = new Map<string, number[]>();
  const lists: number[][] = [];
  const position = new Map<string, number>();
  const groupOf = new Int32Array(sales.length);
  for (let i = 0; i < sales.length; i++) {
    const key = sales[i].neighbourhood ?? noName;
    let g = position.get(key);
    if (g === undefined) {
      position.set(key, (g = lists.length));
      lists.push([]);
      members.set(key, lists[g]);
    }
    lists[g].push(i);
    groupOf[i] = g;
  }
  return { members, groupOf };
}

/**
 * The adjusted price of each sale, keyed by its id, entered in neighbourhood order. Should two
 * sales share an id, the last one entered stands, and `prices` is rewritten so that both are fitted
 * at that price (as a Map from id to price would have it).
 */
export function pricesById(usable: readonly AnalysisSale[], prices: Float64Array, groups: number[][]): Record<string, number> {
  const byId: Record<string, number> = {};
  let increasing = true;
  for (let i = 0; i < usable.length && increasing; i++) {
    const id = usable[i].id;
    increasing = Number.isInteger(id) && id >= 0 && id < 2 ** 32 - 1 && (i === 0 || id > usable[i - 1].id);
  }
  if (increasing) {
    // Ids that are array indices are listed in ascending order whatever the order of entry; entered
    // in that order, they stay in V8's fast elements instead of a dictionary.
    for (let i = 0; i < usable.length; i++) byId[usable[i].id] = prices[i];
    return byId;
  }
  for (const members of groups) for (const i of members) byId[usable[i].id] = prices[i];
  if (new Set(usable.map((s) => s.id)).size < usable.length) usable.forEach((s, i) => (prices[i] = byId[s.id]));
  return byId;
}

/** The order of String.prototype.localeCompare without arguments, from one collator made once. */
export const compareNames = new Intl.Collator().compare;

/** The q-quantile of sorted values, by linear interpolation between order statistics. */
function quantile(sorted: readonly number[], q: number): number {
  const at = (sorted.length - 1) * q;
  const lo = Math.floor(at);
  const hi = Math.ceil(at);
  return sorted[lo] + (sorted[hi] - sorted[lo]) * (at - lo);
}

/**
 * The floor-area range of the main cluster of sales, between Tukey's far fences (Q1 − 3·IQR and
 * Q3 + 3·IQR), or null when every sale lies inside them and there is nothing to zoom to. A floor
 * area keyed ten times too large otherwise squeezes every other sale into a corner of the chart.
 */
export function focusRange(areas: readonly number[]): [number, number] | null {
  const sorted = areas.filter(Number.isFinite).sort((a, b) => a - b);
  if (sorted.length < 4) return null;
  const q1 = quantile(sorted, 0.25);
  const q3 = quantile(sorted, 0.75);
  const reach = 3 * (q3 - q1);
  if (!(reach > 0)) return null;
  const range: [number, number] = [q1 - reach, q3 + reach];
  return sorted.some((x) => x < range[0] || x > range[1]) ? range : null;
}

export function inRange(range: readonly [number, number] | null, x: number): boolean {
  return range === null || (x >= range[0] && x <= range[1]);
}

/** Bounds [west, south, east, north] of every [lon, lat] position given; null for none. */
export function boundsOf(positions: ReadonlyArray<readonly number[]>): [number, number, number, number] | null {
  if (positions.length === 0) return null;
  let [w, s, e, n] = [Infinity, Infinity, -Infinity, -Infinity];
  for (const [lon, lat] of positions) {
    w = Math.min(w, lon);
    e = Math.max(e, lon);
    s = Math.min(s, lat);
    n = Math.max(n, lat);
  }
  return [w, s, e, n];
}

/** A step of 1, 2, 2.5 or 5 times a power of ten that cuts `span` into about `ticks` parts. */
function niceStep(span: number, ticks: number): number {
  const raw = span / Math.max(1, ticks);
  const power = 10 ** Math.floor(Math.log10(raw));
  const scaled = raw / power;
  const factor = scaled <= 1 ? 1 : scaled <= 2 ? 2 : scaled <= 2.5 ? 2.5 : scaled <= 5 ? 5 : 10;
  return factor * power;
}

export interface AxisDomain {
  domain: [number, number];
  ticks: number[];
}

/**
 * A round axis range that holds every value given, with its tick marks. Values that are not
 * finite are ignored; with nothing left (or no spread) a small range around the value is used,
 * so a chart never receives NaN. `atLeast` keeps the range from reaching below a bound (0 for prices).
 */
export function niceDomain(values: readonly number[], ticks = 5, pad = 0.03, atLeast = -Infinity): AxisDomain {
  const finite = values.filter(Number.isFinite);
  let lo = finite.length ? Math.min(...finite) : 0;
  let hi = finite.length ? Math.max(...finite) : 1;
  if (hi === lo) {
    const spread = Math.abs(lo) * 0.1 || 1;
    lo -= spread;
    hi += spread;
  }
  const padding = (hi - lo) * pad;
  lo -= padding;
  hi += padding;
  const step = niceStep(hi - lo, ticks);
  // Never below `atLeast` (0 for prices), which is itself a round number.
  const start = Math.max(Math.floor(lo / step) * step, atLeast);
  const end = Math.ceil(hi / step) * step;
  const list: number[] = [];
  for (let v = start; v <= end + step / 2; v += step) list.push(Number(v.toPrecision(12)));
  return { domain: [list[0], list[list.length - 1]], ticks: list };
}

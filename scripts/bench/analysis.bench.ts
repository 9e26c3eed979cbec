// Budget: the full analysis of 50,000 sales over 200 neighbourhoods (fits, diagnostics, time trend)
// ≤ 5× a bare single pass summing x, y, x², xy over the same arrays, measured in the same run.
// The bare pass reads the same array of sale objects the analysis receives.
//
// The ratio is measured as it always was: the bare pass run back to back (warm), the analysis run
// back to back with nothing forced between runs, so that each run also pays, on average, for
// collecting the answers before it (the mean shows that; the median may skip it).
//
// The breakdown (analysis-breakdown.ts) then samples the analysis and each phase in turn, round
// after round, so that all of them see the same load on a shared machine; with --expose-gc (as
// scripts/bench.sh runs it) each of those samples starts from a collected heap, so that each pays
// only for its own garbage. Its shares are of the analysis timed that way.
import { analyseMarket } from '../../server/analysis/market-analysis';
import { breakdownPhases } from './analysis-breakdown';
import { benchmarkSales } from './analysis-data';
import { median, recordFigures } from './report';

const sales = benchmarkSales();
const input = { assignmentId: 1, dataRevision: 1, areaUnit: 'sqft' as const, currency: 'USD', effectiveDate: '2026-11-15', timeAdjustment: true, subject: { floorArea: 1850, neighbourhood: 'N0' }, sales };

function barePass(): number {
  let sx = 0, sy = 0, sxx = 0, sxy = 0;
  for (const s of sales) {
    const x = s.floorArea, y = s.salePrice;
    sx += x; sy += y; sxx += x * x; sxy += x * y;
  }
  return sx + sy + sxx + sxy;
}

let sink = 0;
function sample(fn: () => unknown, before = () => {}): number {
  before();
  const t0 = performance.now();
  const r = fn();
  const ms = performance.now() - t0;
  sink += typeof r === 'number' ? r : 1;
  return ms;
}
const times = (fn: () => unknown, runs: number) => Array.from({ length: runs }, () => sample(fn));
const mean = (list: number[]) => list.reduce((a, b) => a + b, 0) / list.length;

// The ratio, as the budget states it.
times(barePass, 50);
times(() => analyseMarket(input), 3);
const bare = median(times(barePass, 200));
const fullRuns = times(() => analyseMarket(input), 15);
const full = median(fullRuns);
const fullMean = mean(fullRuns);

// The breakdown.
const collect = (globalThis as { gc?: () => void }).gc ?? (() => {});
const { phases, rows } = breakdownPhases(input);
const timed: Record<string, () => unknown> = { full: () => analyseMarket(input), ...phases };
const samples: Record<string, number[]> = Object.fromEntries(Object.keys(timed).map((name) => [name, []]));
const ROUNDS = 15;
for (let round = -2; round < ROUNDS; round++) {
  for (const [name, fn] of Object.entries(timed)) {
    const ms = sample(fn, collect);
    if (round >= 0) samples[name].push(ms); // the first two rounds only warm up
  }
}
const ms = Object.fromEntries(Object.entries(samples).map(([name, list]) => [name, median(list)])) as Record<string, number>;
const parts = rows(ms as Parameters<typeof rows>[0]);
const rest = ms.full - parts.reduce((total, [, part]) => total + part, 0);
const share = (part: number) => `${part.toFixed(2)} ms (${Math.round((100 * part) / ms.full)}%)`;

console.log(`bare pass: ${bare.toFixed(3)} ms; full analysis: ${full.toFixed(2)} ms; ratio ${(full / bare).toFixed(1)}× (budget ≤ 5×)${sink > 0 ? '' : ' '}`);
console.log(`  full analysis, mean of the same 15 runs: ${fullMean.toFixed(2)} ms (${(fullMean / bare).toFixed(1)}×)`);
console.log(`breakdown of one analysis from a collected heap (${ms.full.toFixed(2)} ms, median of ${ROUNDS}):`);
for (const [what, part] of parts) console.log(`  ${what}: ${share(part)}`);
console.log(`  the rest (reading and grouping the sales, prices, summaries, warnings): ${share(rest)}`);
recordFigures('analysis', [
  ['bare pass over 50,000 sales (median of 200)', `${bare.toFixed(3)} ms`],
  ['full analysis, 200 neighbourhoods (median of 15)', `${full.toFixed(2)} ms`],
  ['ratio', `${(full / bare).toFixed(1)}× (budget ≤ 5×)`],
  ['full analysis, mean of the same 15 runs', `${fullMean.toFixed(2)} ms (${(fullMean / bare).toFixed(1)}×)`],
  [`breakdown: one analysis from a collected heap (median of ${ROUNDS})`, `${ms.full.toFixed(2)} ms`],
  ...parts.map(([what, part]): [string, string] => [`  ${what}`, share(part)]),
  ['  the rest (reading and grouping the sales, prices, summaries, warnings)', share(rest)],
]);

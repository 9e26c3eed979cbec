// Budget: the full analysis of 50,000 sales over 200 neighbourhoods (fits, diagnostics, time trend)
// ≤ 5× a bare single pass summing x, y, x², xy over the same arrays, measured in the same run.
// The bare pass reads the same array of sale objects the analysis receives. Run with --expose-gc
// (as scripts/bench.sh does) and each timed run starts from a collected heap, so that no run pays
// for the garbage of the one before it.
import { analyseMarket } from '../../server/analysis/market-analysis';
import { analysisBreakdown } from './analysis-breakdown';
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

const collect = (globalThis as { gc?: () => void }).gc ?? (() => {});
let sink = 0;
const time = (fn: () => unknown, runs: number) => {
  const out: number[] = [];
  for (let i = 0; i < runs; i++) {
    collect();
    const t0 = performance.now();
    const r = fn();
    out.push(performance.now() - t0);
    sink += typeof r === 'number' ? r : 1;
  }
  return median(out);
};

time(barePass, 50);
time(() => analyseMarket(input), 3);
const bare = time(barePass, 200);
const full = time(() => analyseMarket(input), 15);
const ratio = full / bare;
const parts = analysisBreakdown(input, time, 9);
const rest = full - parts.reduce((total, [, ms]) => total + ms, 0);
const share = (ms: number) => `${ms.toFixed(2)} ms (${Math.round((100 * ms) / full)}%)`;

console.log(`bare pass: ${bare.toFixed(3)} ms; full analysis: ${full.toFixed(2)} ms; ratio ${ratio.toFixed(1)}× (budget ≤ 5×)${sink > 0 ? '' : ' '}`);
for (const [what, ms] of parts) console.log(`  ${what}: ${share(ms)}`);
console.log(`  the rest (grouping, prices, summaries, flagged-sale objects, collection): ${share(rest)}`);
recordFigures('analysis', [
  ['bare pass over 50,000 sales (median)', `${bare.toFixed(3)} ms`],
  ['full analysis, 200 neighbourhoods (median of 15)', `${full.toFixed(2)} ms`],
  ['ratio', `${ratio.toFixed(1)}× (budget ≤ 5×)`],
  ...parts.map(([what, ms]): [string, string] => [`  of which ${what}`, share(ms)]),
  ['  of which the rest (grouping, prices, summaries, flagged-sale objects, collection)', share(rest)],
]);

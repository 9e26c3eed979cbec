// Budget: the full analysis of 50,000 sales over 200 neighbourhoods (fits, diagnostics, time trend)
// ≤ 5× a bare single pass summing x, y, x², xy over the same arrays, measured in the same run.
import { analyseMarket } from '../../server/analysis/market-analysis';
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
const time = (fn: () => unknown, runs: number) => {
  const out: number[] = [];
  for (let i = 0; i < runs; i++) {
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
console.log(`bare pass: ${bare.toFixed(3)} ms; full analysis: ${full.toFixed(2)} ms; ratio ${ratio.toFixed(1)}× (budget ≤ 5×) ${sink > 0 ? '' : ' '}`);
recordFigures('analysis', [
  ['bare pass over 50,000 sales (median)', `${bare.toFixed(3)} ms`],
  ['full analysis, 200 neighbourhoods (median of 15)', `${full.toFixed(2)} ms`],
  ['ratio', `${ratio.toFixed(1)}× (budget ≤ 5×)`],
]);

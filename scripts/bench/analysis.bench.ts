// Budget: the full analysis of 50,000 sales over 200 neighbourhoods (fits, diagnostics, time trend)
// ≤ 5× a bare single pass summing x, y, x², xy over the same arrays, measured in the same run.
//
// The analysis works on columns (server/analysis/market-columns.ts): the bare pass sums over the
// same Float64Arrays of floor area and price that the fits read. Every phase is sampled in turn,
// round after round, so that all of them see the same load on a shared machine. No collection is
// forced between samples: a forced full collection makes V8 drop the compiled code of functions it
// considers old, and the next sample would then measure recompilation (up to 10× slower).
//
// Also measured, outside the budget, because a request pays them once per data revision: reading
// the sale objects into columns, the answer in words and columns, its JSON text, and the rows of
// the older contract (built now only for a report snapshot and the server's own callers).
import { expandAnalysis } from '../../server/contracts/analysis';
import { fitColumnsOut, fitRange } from '../../server/analysis/lean-fit';
import { analyseColumns } from '../../server/analysis/market-columns';
import { readSales } from '../../server/analysis/sale-columns';
import { analysisWire, transportWire } from '../../server/analysis/market-analysis';
import { benchmarkSales } from './analysis-data';
import { median, recordFigures } from './report';

const sales = benchmarkSales();
const input = { assignmentId: 1, dataRevision: 1, areaUnit: 'sqft' as const, currency: 'USD', effectiveDate: '2026-11-15', timeAdjustment: true, subject: { floorArea: 1850, neighbourhood: 'N0' }, sales };
const columns = readSales(input);
const options = { timeAdjustment: true, x0: 1850 };
const { floorArea: X, salePrice: Y, monthsBefore, pricePerArea, start } = columns;
const N = X.length;
const G = columns.names.length;

function bareColumns(): number {
  let sx = 0, sy = 0, sxx = 0, sxy = 0;
  for (let i = 0; i < N; i++) {
    const x = X[i], y = Y[i];
    sx += x; sy += y; sxx += x * x; sxy += x * y;
  }
  return sx + sy + sxx + sxy;
}
function bareObjects(): number {
  let sx = 0, sy = 0, sxx = 0, sxy = 0;
  for (const s of sales) {
    const x = s.floorArea, y = s.salePrice;
    sx += x; sy += y; sxx += x * x; sxy += x * y;
  }
  return sx + sy + sxx + sxy;
}
const out = fitColumnsOut(N);
const range = (g: number): [number, number] => (g < G ? [start[g], start[g + 1]] : [0, N]);
const trendFits = () => { for (let g = 0; g <= G; g++) fitRange(monthsBefore, pricePerArea, ...range(g), null, undefined, 0.95); };
const areaFits = () => { for (let g = 0; g <= G; g++) fitRange(X, Y, ...range(g), out, undefined, 0.95); };
const pooledWithout = () => fitRange(X, Y, 0, N, null, undefined, 0.95);
const pooledWith = () => fitRange(X, Y, 0, N, out, undefined, 0.95);
const analysed = analyseColumns(columns, options);
const wire = analysisWire(input, analysed);
const json = JSON.stringify(transportWire(wire));

const phases: Record<string, () => unknown> = {
  bareColumns, bareObjects,
  full: () => analyseColumns(columns, options),
  trendFits, areaFits, pooledWithout, pooledWith,
  read: () => readSales(input),
  wire: () => analysisWire(input, analysed),
  json: () => JSON.stringify(transportWire(wire)),
  rows: () => expandAnalysis(wire),
};
const repeat: Record<string, number> = { bareColumns: 50, bareObjects: 50, pooledWithout: 5, pooledWith: 5 };
let sink = 0;
const samples: Record<string, number[]> = Object.fromEntries(Object.keys(phases).map((name) => [name, []]));
const ROUNDS = 25;
for (let round = -3; round < ROUNDS; round++) {
  for (const [name, fn] of Object.entries(phases)) {
    const times = repeat[name] ?? 1;
    const t0 = performance.now();
    for (let r = 0; r < times; r++) sink += fn() ? 1 : 0;
    const ms = (performance.now() - t0) / times;
    if (round >= 0) samples[name].push(ms); // the first rounds only warm up
  }
}
const ms = Object.fromEntries(Object.entries(samples).map(([name, list]) => [name, median(list)])) as Record<keyof typeof phases, number>;
const bare = ms.bareColumns;
const x = (v: number) => `${(v / bare).toFixed(1)}×`;
const f = (v: number) => `${v < 1 ? v.toFixed(3) : v.toFixed(2)} ms`;
const diagnosticsPerSale = ((ms.pooledWith - ms.pooledWithout) / N) * 1e6;
const rows: Array<[string, string]> = [
  ['bare pass over the 50,000-sale columns (floor area, price)', f(bare)],
  ['full analysis on the columns: 201 trend fits, time-adjusted prices, 201 floor-area fits with every point’s leverage, studentized residuals, Cook’s distance and flags, the masked-outlier refits', `${f(ms.full)} = **${x(ms.full)}** the bare pass (budget ≤ 5×)`],
  ['  trend fits alone (201, figures only)', `${f(ms.trendFits)} (${x(ms.trendFits)})`],
  ['  floor-area fits with per-point figures (201)', `${f(ms.areaFits)} (${x(ms.areaFits)})`],
  ['  one fit of all 50,000 sales without / with per-point figures', `${f(ms.pooledWithout)} (${x(ms.pooledWithout)}) / ${f(ms.pooledWith)} (${x(ms.pooledWith)}): the per-point figures cost ${diagnosticsPerSale.toFixed(1)} ns a sale`],
  ['bare pass over the 50,000 sale objects instead (as measured before)', `${f(ms.bareObjects)}; the full analysis is ${(ms.full / ms.bareObjects).toFixed(1)}× that`],
  ['outside the budget, once per data revision: reading the sale objects into columns', f(ms.read)],
  ['  the answer in words and columns (flag reasons, gates, warnings)', f(ms.wire)],
  ['  its JSON text (figures rounded for transport)', `${f(ms.json)}, ${(json.length / 2 ** 20).toFixed(1)} MiB`],
  ['  the answer as rows of objects (the report snapshot’s shape)', f(ms.rows)],
  ['rounds (each figure the median)', `${ROUNDS}${sink > 0 ? '' : ' '}`],
];
for (const [what, value] of rows) console.log(`${what}: ${value.replaceAll('**', '')}`);
recordFigures('analysis', rows);

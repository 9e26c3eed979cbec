// Gathers the figures the benchmarks wrote (bench-output/*.json) into docs/performance.md.
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { readFigures } from './report';

const sections: Array<[string, string, string]> = [
  ['analysis', 'Analysis of 50,000 sales over 200 neighbourhoods', '`npx tsx scripts/bench/analysis.bench.ts`'],
  ['import', 'CSV import of 50,000 rows through the API, and server memory', '`BENCH_ONLY=import npm run bench`'],
  ['explain', 'Query plans on a large table (EXPLAIN)', '`BENCH_ONLY="import explain" npm run bench`'],
  ['analysis-endpoint', 'GET /api/assignments/:id/analysis under load (2,000 sales)', '`BENCH_ONLY=analysis-endpoint npm run bench`'],
  ['bundle', 'JavaScript of a first page load', '`npx vite build && npx tsx scripts/bench/bundle.bench.ts`'],
  ['photo-pipeline', 'A 12-megapixel JPEG through the photo pipeline', '`npx tsx scripts/bench/photo-pipeline.bench.ts`'],
  ['comp-map', 'The comp map with 20,000 sales in Chromium', '`BENCH_ONLY=comp-map npm run bench`'],
  ['analysis-page', 'The market analysis page with a large neighbourhood in Chromium', '`BENCH_ONLY=analysis-page npm run bench`'],
];

const file = path.resolve(import.meta.dirname, '../../docs/performance.md');
const previous = readFileSync(file, 'utf8');
const notes = previous.includes('<!-- notes -->') ? previous.slice(previous.indexOf('<!-- notes -->')) : '<!-- notes -->\n';
const lines = ['# Performance', '', 'Figures from the benchmark scripts (`npm run bench` runs them all against a throwaway PostgreSQL and rewrites the figures below). Each figure is measured beside a baseline in the same run where one exists, because these machines are noisy.', ''];
for (const [name, title, command] of sections) {
  const figures = readFigures(name);
  lines.push(`## ${title}`, '', `Reproduce: ${command}`, '');
  if (!figures) {
    lines.push('_Not measured in the last run._', '');
    continue;
  }
  lines.push(`Measured ${figures.at.slice(0, 16).replace('T', ' ')} UTC on ${figures.machine}.`, '', '| what | figure |', '|---|---|');
  for (const [what, value] of figures.rows) lines.push(`| ${what} | ${value} |`);
  lines.push('');
}
writeFileSync(file, `${lines.join('\n')}\n${notes}`);
console.log(`wrote ${path.relative(process.cwd(), file)}`);

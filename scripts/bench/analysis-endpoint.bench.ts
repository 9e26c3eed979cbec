// Budget: GET /api/assignments/:id/analysis for an assignment with 2,000 sales, 50 loopback
// connections for 20 s: p95 < 50 ms and 0 errors. Baseline in the same run: GET /api/health.
import autocannon from 'autocannon';
import { pool } from '../../db/client';
import { startChildServer } from '../../tests/setup/child-server';
import { benchAssignment, benchFirm, signInCookie } from './bench-fixtures';
import { recordFigures } from './report';

const firm = await benchFirm('analysis');
const assignment = await benchAssignment(firm, 2000);
const server = await startChildServer();
const cookie = await signInCookie(server.origin, firm.appraiser);

function run(path: string, seconds: number): Promise<autocannon.Result> {
  return autocannon({ url: `${server.origin}${path}`, connections: 50, duration: seconds, headers: { cookie } });
}

// autocannon reports p90 and p97.5; p95 lies between them. The budget is met when p97.5 < 50 ms.
const summarise = (r: autocannon.Result) =>
  `${r.requests.total} requests, ${r.requests.average.toFixed(0)} req/s, p50 ${r.latency.p50} ms, p90 ${r.latency.p90} ms, p97.5 ${r.latency.p97_5} ms, p99 ${r.latency.p99} ms, errors ${r.errors}, timeouts ${r.timeouts}, non-2xx ${r.non2xx}`;

await run(`/api/assignments/${assignment.id}/analysis`, 3); // warm-up (first computation fills the cache)
const health = await run('/api/health', 10);
const analysis = await run(`/api/assignments/${assignment.id}/analysis`, 20);
console.log(`health baseline: ${summarise(health)}`);
console.log(`analysis (2,000 sales): ${summarise(analysis)}`);
server.process.kill('SIGTERM');
await server.exited;
await pool.end();
recordFigures('analysis-endpoint', [
  ['GET analysis, 2,000 sales, 50 connections, 20 s', summarise(analysis)],
  ['budget', `p95 < 50 ms (p97.5 measured: ${analysis.latency.p97_5} ms), 0 errors (${analysis.errors + analysis.non2xx})`],
  ['baseline: GET /api/health, same settings, 10 s', summarise(health)],
]);

// Budget: GET /api/assignments/:id/analysis for an assignment with 2,000 sales, 50 loopback
// connections for 20 s: p95 < 50 ms and 0 errors. Baseline in the same run: GET /api/health.
//
// The load comes from wrk (Debian's `wrk`, a C load generator): on a 2-core machine the generator
// shares the CPU with the server, and autocannon converts every response body to a JavaScript
// string (about 70% of its own core in a profile of this run), so its latencies measure
// autocannon as much as the server. One autocannon run is kept for comparison with earlier
// figures. Each run also reports the server's own CPU time per request, read from /proc.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import { pool } from '../../db/client';
import { startChildServer } from '../../tests/setup/child-server';
import { benchAssignment, benchFirm, signInCookie } from './bench-fixtures';
import { recordFigures } from './report';

const CONNECTIONS = 50;
/** What a browser sends: the budget is measured on the response a browser gets. */
const BROWSER_ENCODINGS = 'gzip, deflate, br';

const firm = await benchFirm('analysis');
const assignment = await benchAssignment(firm, 2000);
const server = await startChildServer();
const cookie = await signInCookie(server.origin, firm.appraiser);
const analysisPath = `/api/assignments/${assignment.id}/analysis`;

/** CPU seconds (user + system) the server process has used so far (Linux /proc, 100 ticks/s). */
function serverCpuSeconds(): number {
  const fields = readFileSync(`/proc/${server.process.pid}/stat`, 'utf8').split(') ')[1].split(' ');
  return (Number(fields[11]) + Number(fields[12])) / 100;
}

interface Figures {
  requests: number;
  perSecond: number;
  p50: number;
  p90: number;
  p95: number;
  p975: number;
  p99: number;
  errors: number;
  /** Responses with a status of 400 or more (wrk counts those, not 3xx). */
  httpErrors: number;
  bytesPerResponse: number;
  serverCpuMsPerRequest: number;
}

const scratch = mkdtempSync(path.join(os.tmpdir(), 'compline-wrk-'));
const wrkScript = path.join(scratch, 'report.lua');
// wrk calls done() once at the end; latencies are in microseconds.
writeFileSync(
  wrkScript,
  `done = function(summary, latency, requests)
  local e = summary.errors
  io.write(string.format('{"requests":%d,"seconds":%f,"bytes":%d,"p50":%f,"p90":%f,"p95":%f,"p975":%f,"p99":%f,"httpErrors":%d,"errors":%d}\\n',
    summary.requests, summary.duration / 1e6, summary.bytes, latency:percentile(50) / 1000, latency:percentile(90) / 1000,
    latency:percentile(95) / 1000, latency:percentile(97.5) / 1000, latency:percentile(99) / 1000,
    e.status, e.connect + e.read + e.write + e.timeout))
end
`,
);

function wrk(urlPath: string, seconds: number, headers: Record<string, string> = {}): Figures {
  const headerArgs = Object.entries({ cookie, ...headers }).flatMap(([name, value]) => ['-H', `${name}: ${value}`]);
  const cpuBefore = serverCpuSeconds();
  const run = spawnSync('wrk', ['-t1', `-c${CONNECTIONS}`, `-d${seconds}s`, '-s', wrkScript, ...headerArgs, `${server.origin}${urlPath}`], { encoding: 'utf8' });
  const cpu = serverCpuSeconds() - cpuBefore;
  if (run.status !== 0) throw new Error(`wrk failed (is Debian's wrk installed?): ${run.error ?? run.stderr}`);
  const r = JSON.parse(run.stdout.trim().split('\n').at(-1)!);
  const round = (ms: number) => Math.round(ms * 10) / 10;
  return {
    requests: r.requests,
    perSecond: Math.round(r.requests / r.seconds),
    p50: round(r.p50),
    p90: round(r.p90),
    p95: round(r.p95),
    p975: round(r.p975),
    p99: round(r.p99),
    errors: r.errors,
    httpErrors: r.httpErrors,
    bytesPerResponse: Math.round(r.bytes / Math.max(1, r.requests)),
    serverCpuMsPerRequest: Math.round((cpu * 1000 * 1000) / Math.max(1, r.requests)) / 1000,
  };
}

const summarise = (f: Figures) =>
  `${f.requests} requests, ${f.perSecond} req/s, p50 ${f.p50} ms, p90 ${f.p90} ms, p95 ${f.p95} ms, p97.5 ${f.p975} ms, p99 ${f.p99} ms, errors ${f.errors}, status ≥ 400 ${f.httpErrors}, ${f.bytesPerResponse} bytes/response, server CPU ${f.serverCpuMsPerRequest} ms/request`;

wrk(analysisPath, 3, { 'accept-encoding': BROWSER_ENCODINGS }); // warm-up (the first request fills the cache)
const health = wrk('/api/health', 10);
const browser = wrk(analysisPath, 20, { 'accept-encoding': BROWSER_ENCODINGS });
const identity = wrk(analysisPath, 10);

const first = await fetch(`${server.origin}${analysisPath}`, { headers: { cookie, 'accept-encoding': 'gzip' } });
await first.arrayBuffer();
const etag = first.headers.get('etag')!;
// Every answer here is a 304 without a body (the bytes per response show it).
const revalidation = wrk(analysisPath, 10, { 'accept-encoding': BROWSER_ENCODINGS, 'if-none-match': etag });

const cpuBefore = serverCpuSeconds();
const ac = await autocannon({ url: `${server.origin}${analysisPath}`, connections: CONNECTIONS, duration: 20, headers: { cookie } });
const acCpuMs = ((serverCpuSeconds() - cpuBefore) * 1000) / Math.max(1, ac.requests.total);
const autocannonLine = `${ac.requests.total} requests, ${ac.requests.average.toFixed(0)} req/s, p50 ${ac.latency.p50} ms, p90 ${ac.latency.p90} ms, p97.5 ${ac.latency.p97_5} ms, p99 ${ac.latency.p99} ms, errors ${ac.errors}, non-2xx ${ac.non2xx}, server CPU ${acCpuMs.toFixed(3)} ms/request`;

console.log(`health baseline: ${summarise(health)}`);
console.log(`analysis (2,000 sales), Accept-Encoding "${BROWSER_ENCODINGS}": ${summarise(browser)}`);
console.log(`analysis, no Accept-Encoding: ${summarise(identity)}`);
console.log(`analysis, If-None-Match (304 expected): ${summarise(revalidation)}`);
console.log(`analysis, no Accept-Encoding, autocannon: ${autocannonLine}`);
server.process.kill('SIGTERM');
await server.exited;
await pool.end();
rmSync(scratch, { recursive: true, force: true });
const budgetMet = browser.p95 < 50 && browser.errors + browser.httpErrors === 0;
recordFigures('analysis-endpoint', [
  [`GET analysis, 2,000 sales, 50 connections, 20 s, Accept-Encoding "${BROWSER_ENCODINGS}" (wrk)`, summarise(browser)],
  ['budget', `p95 < 50 ms and 0 errors: ${budgetMet ? 'met' : 'not met'} (p95 ${browser.p95} ms, errors ${browser.errors + browser.httpErrors})`],
  ['same, no Accept-Encoding (plain JSON), 10 s (wrk)', summarise(identity)],
  ['same, If-None-Match with the current ETag, 10 s (wrk; 304 Not Modified)', summarise(revalidation)],
  ['same, no Accept-Encoding, 20 s (autocannon, as in earlier runs)', autocannonLine],
  ['baseline: GET /api/health, signed in, 50 connections, 10 s (wrk)', summarise(health)],
]);

// Load on loopback: 100 connections for 30 s against a running Compline (npm start with the demo
// data), signed in as the demo appraiser, over a mix of reads (assignment, sales, analysis, a report)
// and writes (a sale's verification note, with its version; a 409 re-reads the version).
//   npx tsx scripts/load.ts [http://127.0.0.1:3000]      (LOAD_CONNECTIONS, LOAD_SECONDS to change)
// Prints throughput and latency percentiles and writes them into docs/reliability.md.
import { readFile, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import { DEMO_PASSWORD, demoUsers } from '../db/seed/demo-accounts';

const base = new URL(process.argv[2] ?? process.env.LOAD_URL ?? 'http://127.0.0.1:3000');
if (!['127.0.0.1', 'localhost', '[::1]'].includes(base.hostname)) throw new Error(`load.ts runs on loopback only, not ${base.hostname}`);
const origin = base.origin;
const CONNECTIONS = Math.min(Number(process.env.LOAD_CONNECTIONS ?? 100), 200);
const SECONDS = Math.min(Number(process.env.LOAD_SECONDS ?? 30), 120);
const MAX_REQUESTS = 1_000_000;
/** Writes among every five requests of a connection. */
const WRITE_EVERY = 5;
/** Sales the writers share: two or more connections per sale, so stale versions (409) do happen. */
const SHARED_SALES = Math.max(1, Math.floor(CONNECTIONS / 2));

async function api<T>(cookie: string, method: string, url: string, body?: unknown): Promise<{ status: number; body: T; headers: Headers }> {
  const res = await fetch(`${origin}${url}`, {
    method,
    headers: { Origin: origin, Cookie: cookie, ...(body ? { 'Content-Type': 'application/json' } : {}) },
    body: body ? JSON.stringify(body) : undefined,
  });
  const text = await res.text();
  return { status: res.status, body: (text && res.headers.get('content-type')?.includes('json') ? JSON.parse(text) : text) as T, headers: res.headers };
}

const appraiser = demoUsers.find((u) => u.role === 'appraiser')!;
const signIn = await api<unknown>('', 'POST', '/api/auth/sign-in', { email: appraiser.email, password: DEMO_PASSWORD });
if (signIn.status !== 204) throw new Error(`sign-in of the demo appraiser answered ${signIn.status}`);
const cookie = signIn.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');

type AssignmentRow = { id: number; subjectAddress: string; status: string };
type SaleRow = { id: number; version: number };
const { body: list } = await api<{ assignments: AssignmentRow[] }>(cookie, 'GET', '/api/assignments');
const editable = (a: AssignmentRow) => a.status === 'in_progress' || a.status === 'revisions_requested';
const assignment = list.assignments.find((a) => a.subjectAddress.startsWith('14 Lantern Lane') && editable(a)) ?? list.assignments.find(editable) ?? list.assignments[0];
if (!assignment) throw new Error('no assignment to load: is the demo data seeded?');
const salesUrl = `/api/assignments/${assignment.id}/sales`;
const { body: salesBody } = await api<{ sales: SaleRow[] }>(cookie, 'GET', salesUrl);
const sales = salesBody.sales.slice(0, SHARED_SALES);
const { body: reports } = await api<{ reports: Array<{ id: number }> }>(cookie, 'GET', '/api/reports');
const reads = [`/api/assignments/${assignment.id}`, salesUrl, `/api/assignments/${assignment.id}/analysis`, ...(reports.reports[0] ? [`/api/reports/${reports.reports[0].id}`] : [])];
const writes = editable(assignment) && sales.length > 0;
// A short warm-up (not measured): each read a few times, so that the figures are not the first
// requests' compilation and cache filling.
for (let round = 0; round < 3; round++) for (const url of reads) await api(cookie, 'GET', url);
console.log(`load: ${origin}, ${CONNECTIONS} connections, ${SECONDS} s; assignment ${assignment.id} (${assignment.subjectAddress}, ${assignment.status}); reads ${reads.join(', ')}; writes ${writes ? `PATCH verificationNote on ${sales.length} sales` : 'none (assignment not editable)'}`);

/** Each connection is one person editing one sale with the version they last saw; another
 * connection editing the same sale makes it stale, so a 409 and a re-read follow now and then. */
interface Ctx { step?: number; sale?: SaleRow; pending?: string; reread?: boolean; sentAt?: number }
/** Response times by kind of request (measured from setupRequest, which runs just before the send). */
const byKind = new Map<string, number[]>();
// A fresh object per request: autocannon writes Content-Length into the headers object it is given,
// and a shared one would then send a body length with every GET (the server waits for that body).
const headers = () => ({ cookie, origin, 'content-type': 'application/json' });
let connectionNo = 0;
let conflicts = 0;

const connectionRequest: autocannon.Request = {
  setupRequest: (req, context) => {
    const ctx = context as Ctx;
    ctx.sale ??= sales.length ? { ...sales[connectionNo++ % sales.length] } : undefined;
    ctx.step = (ctx.step ?? 0) + 1;
    ctx.sentAt = performance.now();
    if (ctx.reread) {
      ctx.pending = 'reread';
      return { ...req, method: 'GET', path: salesUrl, headers: headers(), body: undefined };
    }
    if (writes && ctx.step % WRITE_EVERY === 0) {
      ctx.pending = 'write';
      const body = JSON.stringify({ version: ctx.sale!.version, verificationNote: `Confirmed by telephone with the listing agent (load check ${ctx.step}).` });
      return { ...req, method: 'PATCH', path: `${salesUrl}/${ctx.sale!.id}`, headers: headers(), body };
    }
    ctx.pending = reads[ctx.step % reads.length];
    return { ...req, method: 'GET', path: reads[ctx.step % reads.length], headers: headers(), body: undefined };
  },
  onResponse: (status, body, context) => {
    const ctx = context as Ctx;
    const kind = ctx.pending === 'write' ? 'PATCH sale' : ctx.pending === 'reread' ? 'GET sales (re-read after 409)' : `GET ${ctx.pending}`;
    if (!byKind.has(kind)) byKind.set(kind, []);
    byKind.get(kind)!.push(performance.now() - ctx.sentAt!);
    if (ctx.pending === 'write' && status === 200) ctx.sale!.version = (JSON.parse(body) as { sale: SaleRow }).sale.version;
    if (ctx.pending === 'write' && status === 409) {
      conflicts++;
      ctx.reread = true;
    }
    if (ctx.pending === 'reread' && status === 200) {
      const fresh = (JSON.parse(body) as { sales: SaleRow[] }).sales.find((s) => s.id === ctx.sale!.id);
      if (fresh) ctx.sale!.version = fresh.version;
      ctx.reread = false;
    }
  },
};

const instance = autocannon({
  url: origin,
  connections: CONNECTIONS,
  duration: SECONDS,
  maxOverallRequests: MAX_REQUESTS,
  timeout: 30,
  // autocannon clears a connection's context each time it comes round to the first request again:
  // one entry repeated more often than a connection sends in a run keeps its state for the run. (Not
  // far more: each connection walks the whole list when it starts. Should a connection come round
  // anyway, it starts afresh — another sale, a stale version, a 409 and a re-read.)
  requests: Array.from({ length: 2_000 }, () => connectionRequest),
});

const loadBefore = os.loadavg()[0];
const latencies: number[] = [];
instance.on('response', (_client, _status, _bytes, responseTime) => latencies.push(responseTime));
const result = await new Promise<autocannon.Result>((resolve) => instance.on('done', resolve));

const percentile = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] ?? NaN;
latencies.sort((a, b) => a - b);
const pct = (p: number) => percentile(latencies, p);
const kinds = [...byKind].map(([kind, times]) => {
  times.sort((a, b) => a - b);
  return `${kind}: ${times.length}, p50 ${percentile(times, 50).toFixed(0)} / p95 ${percentile(times, 95).toFixed(0)} ms`;
});
const byStatus = Object.fromEntries(Object.entries(result.statusCodeStats ?? {}).map(([code, v]) => [code, Number((v as { count: number }).count)]));
const fiveXX = Object.entries(byStatus).filter(([code]) => code.startsWith('5')).reduce((n, [, c]) => n + c, 0);
const total = latencies.length;
const figures: Array<[string, string]> = [
  ['target', `${origin} (loopback), demo appraiser, assignment ${assignment.id}`],
  ['machine', `${os.cpus().length} CPUs, Node ${process.version}; 1-min load average ${loadBefore.toFixed(1)} before, ${os.loadavg()[0].toFixed(1)} after (other work shares the machine)`],
  ['connections × duration', `${CONNECTIONS} × ${result.duration.toFixed(0)} s`],
  ['requests answered', `${total.toLocaleString('en-US')} (${(total / result.duration).toFixed(0)} per second; autocannon mean ${result.requests.average.toFixed(0)}/s)`],
  ['mix', `${reads.length} read routes; every ${WRITE_EVERY}th request of a connection a sale PATCH (${SHARED_SALES} sales shared by ${CONNECTIONS} connections)`],
  ['latency p50 / p95 / p99', `${pct(50).toFixed(1)} / ${pct(95).toFixed(1)} / ${pct(99).toFixed(1)} ms (max ${latencies.at(-1)?.toFixed(1)} ms)`],
  ['autocannon p50 / p97.5 / p99', `${result.latency.p50} / ${result.latency.p97_5} / ${result.latency.p99} ms`],
  ['by request', kinds.join('; ')],
  ['status codes', Object.entries(byStatus).map(([c, n]) => `${c}: ${n.toLocaleString('en-US')}`).join(', ')],
  ['409 stale versions re-read', String(conflicts)],
  ['errors / timeouts / 5xx', `${result.errors} / ${result.timeouts} / ${fiveXX}`],
];
const table = ['| figure | value |', '|---|---|', ...figures.map(([k, v]) => `| ${k} | ${v} |`)].join('\n');
console.log(`\n${table}\n`);

const docPath = path.resolve(import.meta.dirname, '../docs/reliability.md');
const doc = await readFile(docPath, 'utf8').catch(() => '# Reliability\n\n<!-- load:start -->\n<!-- load:end -->\n');
const section = `<!-- load:start -->\nLast run ${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC with \`npx tsx scripts/load.ts ${origin}\`:\n\n${table}\n<!-- load:end -->`;
await writeFile(docPath, doc.replace(/<!-- load:start -->[\s\S]*<!-- load:end -->/, section));
console.log(`load: figures written to ${path.relative(process.cwd(), docPath)}`);
if (result.errors > 0 || result.timeouts > 0 || fiveXX > 0) {
  console.error('load: there were errors, timeouts or 5xx answers');
  process.exitCode = 1;
}

// Budget: CSV import of 50,000 validated rows into PostgreSQL, end to end through the API, < 10 s;
// the server's memory after the import, and no growth across 5 repeated imports.
import supertest from 'supertest';
import { pool } from '../../db/client';
import { startChildServer } from '../../tests/setup/child-server';
import { cleanSaleRows, csvFile, mappingFor, standardHeaders } from '../../tests/factories/csv';
import { benchAssignment, benchFirm, rssMiB, signInCookie } from './bench-fixtures';
import { recordFigures } from './report';

const ROWS = 50_000;
const file = csvFile(cleanSaleRows(ROWS));
const firm = await benchFirm('import');
const server = await startChildServer();
const pid = server.process.pid!;
const cookie = await signInCookie(server.origin, firm.appraiser);
const rssBefore = rssMiB(pid);
const runs: Array<{ seconds: number; rss: number }> = [];
for (let run = 1; run <= 5; run++) {
  const assignment = await benchAssignment(firm);
  const t0 = performance.now();
  const res = await supertest(server.origin)
    .post(`/api/assignments/${assignment.id}/sales/import`)
    .set('Origin', server.origin)
    .set('Cookie', cookie)
    .field('mapping', JSON.stringify(mappingFor(standardHeaders)))
    .field('skipInvalid', 'false')
    .attach('file', file, { filename: 'bench.csv', contentType: 'text/csv' });
  const seconds = (performance.now() - t0) / 1000;
  if (res.status !== 201 || res.body.imported !== ROWS) throw new Error(`import failed: ${res.status} ${res.text.slice(0, 300)}`);
  await new Promise((r) => setTimeout(r, 1500));
  runs.push({ seconds, rss: rssMiB(pid) });
  console.log(`import ${run}: ${ROWS.toLocaleString('en-US')} rows in ${seconds.toFixed(2)} s (budget < 10 s); server RSS ${runs.at(-1)!.rss.toFixed(0)} MiB`);
}
server.process.kill('SIGTERM');
await server.exited;
await pool.end();
const best = Math.min(...runs.map((r) => r.seconds));
recordFigures('import', [
  [`CSV import of ${ROWS.toLocaleString('en-US')} rows through the API (${(file.length / 1e6).toFixed(1)} MB), first run`, `${runs[0].seconds.toFixed(2)} s (budget < 10 s)`],
  ['best of 5 runs', `${best.toFixed(2)} s`],
  ['server RSS before the first import', `${rssBefore.toFixed(0)} MiB`],
  ['server RSS after imports 1–5', runs.map((r) => `${r.rss.toFixed(0)}`).join(', ') + ' MiB'],
]);

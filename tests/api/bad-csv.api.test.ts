import { readdir } from 'node:fs/promises';
import path from 'node:path';
import fc from 'fast-check';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { count } from 'drizzle-orm';
import { db } from '../../db/client';
import { salesImports } from '../../db/schema/assignments';
import { env } from '../../server/env';
import { csvCell } from '../../server/modules/sales/sales-export';
import { createAssignment, createFirmWithAssignment, liveSalesRows, totalSalesRows } from '../factories/assignments';
import { cleanSaleRow, cleanSaleRows, csvFile, daysFromToday, mappingFor, salesCsv, standardHeaders } from '../factories/csv';
import { envelopeProblems } from '../setup/route-table';
import { signedInAgent, startTestApi, stopTestApi, type Agent, type TestApi } from '../setup/test-api';

// CSV imports that are broken, mis-encoded, hostile or huge, and the CSV export that must not hand
// a spreadsheet a formula. Every address is invented (streets of the demo town of Port Ellery).

const FORMULAS = ["=cmd|' /C calc'!A0", '+1 Mooring Way', '@SUM(1)', '-2 Beacon Row', '=HYPERLINK("http://example.invalid","x")'];
const NUMBER = /^-?\d+(\.\d+)?(e[+-]?\d+)?$/i;
const FORMULA_START = /^[=+\-@\t\r]/;

let api: TestApi;
beforeAll(async () => {
  api = await startTestApi();
});
afterAll(async () => {
  await stopTestApi(api);
});

async function appraiser() {
  const team = await createFirmWithAssignment();
  return { ...team, agent: await signedInAgent(api, team.appraiser) };
}

function commit(agent: Agent, assignmentId: number, file: Buffer, name = 'sales-export.csv') {
  return agent
    .post(`/api/assignments/${assignmentId}/sales/import`)
    .field('mapping', JSON.stringify(mappingFor(standardHeaders)))
    .field('skipInvalid', 'false')
    .attach('file', file, name);
}

/** A request the server may answer before it has read the whole body: a reset socket after the
 * answer is the client's problem, not a failure of the check. */
async function refusable<T>(request: PromiseLike<T>): Promise<T> {
  try {
    return await request;
  } catch (err) {
    const response = (err as { response?: T }).response;
    if (response) return response;
    throw err;
  }
}

async function scratchFiles(): Promise<string[]> {
  return readdir(path.resolve(env.DATA_DIR, 'tmp')).catch(() => []);
}

async function importRuns(): Promise<number> {
  return (await db.select({ n: count() }).from(salesImports))[0].n;
}

type RowKind = 'clean' | 'formula' | 'broken-quote' | 'latin1' | 'nul' | 'huge-number' | 'future-date' | 'not-a-date';
const VALID_KINDS: ReadonlySet<RowKind> = new Set(['clean', 'formula']);

/** The bytes of one data row of a given kind (UTF-8 except the Latin-1 one). */
function rowBytes(kind: RowKind, index: number): Buffer {
  const line = (overrides: Parameters<typeof cleanSaleRow>[1]) => Buffer.from(salesCsv([cleanSaleRow(index, overrides)]).split('\r\n')[1] + '\r\n', 'utf8');
  switch (kind) {
    case 'clean': return line({});
    case 'formula': return line({ address: `${FORMULAS[index % FORMULAS.length]} ${index}` });
    case 'broken-quote': return Buffer.from(`"${index} Tidewater Court,312000,2025-03-01,1500,-61.41,44.70,3,2\r\n`, 'utf8');
    case 'latin1': return Buffer.from(`${index} Caf\u00e9 Row,298000,2025-04-02,1410,-61.41,44.70,3,1\r\n`, 'latin1');
    case 'nul': return line({ address: `${index} Net\u0000mender Road` });
    case 'huge-number': return line({ price: '1e400' });
    case 'future-date': return line({ date: daysFromToday(45) });
    case 'not-a-date': return line({ date: '2025-02-30' });
  }
}

const header = (bom: boolean) => Buffer.from(`${bom ? '\uFEFF' : ''}${salesCsv([]).trimEnd()}\r\n`, 'utf8');

describe('a fuzzed sales file is imported whole or not at all', () => {
  it('mixes clean, formula, broken, mis-encoded and impossible rows: 201 only when every row is good', { timeout: 180_000 }, async () => {
    const { agent, appraiser: holder } = await appraiser();
    const kinds: RowKind[] = ['clean', 'formula', 'broken-quote', 'latin1', 'nul', 'huge-number', 'future-date', 'not-a-date'];
    const file = fc.record({ bom: fc.boolean(), rows: fc.array(fc.oneof({ weight: 4, arbitrary: fc.constantFrom<RowKind>('clean', 'formula') }, fc.constantFrom(...kinds)), { minLength: 1, maxLength: 8 }) });
    let runs = 0;
    await fc.assert(
      fc.asyncProperty(file, async ({ bom, rows }) => {
        runs++;
        const assignment = await createAssignment({ appraiser: holder });
        const bytes = Buffer.concat([header(bom), ...rows.map((kind, i) => rowBytes(kind, i))]);
        const [salesBefore, runsBefore] = [await totalSalesRows(), await importRuns()];
        const res = await commit(agent, assignment.id, bytes);
        const allValid = rows.every((k) => VALID_KINDS.has(k));
        expect(res.status, `${rows.join(', ')}: ${res.text.slice(0, 200)}`).toBe(allValid ? 201 : 422);
        if (allValid) {
          expect(res.body.imported).toBe(rows.length);
          expect(await liveSalesRows(assignment.id)).toHaveLength(rows.length);
        } else {
          expect(envelopeProblems(res)).toEqual([]);
          expect(await totalSalesRows()).toBe(salesBefore);
          expect(await importRuns()).toBe(runsBefore);
        }
      }),
      { numRuns: 25, seed: 20_261_202 },
    );
    expect(runs).toBe(25);
  });
});

describe('encodings and quoting', () => {
  it('a byte-order mark is dropped: the headers are recognised and the rows import', async () => {
    const { agent, assignment } = await appraiser();
    const bytes = Buffer.concat([Buffer.from('\uFEFF', 'utf8'), csvFile(cleanSaleRows(3))]);
    const pre = await agent.post(`/api/assignments/${assignment.id}/sales/import/preview`).attach('file', bytes, 'bom.csv');
    expect(pre.status).toBe(200);
    expect(pre.body.headers[0]).toBe(standardHeaders.address);
    expect(pre.body.mapping.address).toBe(standardHeaders.address);
    expect((await commit(agent, assignment.id, bytes)).status).toBe(201);
  });

  it('a Latin-1 file is refused row by row with the advice to save it as UTF-8', async () => {
    const { agent, assignment } = await appraiser();
    const bytes = Buffer.concat([header(false), rowBytes('latin1', 1), rowBytes('latin1', 2)]);
    const res = await commit(agent, assignment.id, bytes);
    expect(res.status).toBe(422);
    const problems = res.body.error.details.problems as Array<{ row: number; message: string }>;
    expect(problems.map((p) => p.row)).toEqual([2, 3]);
    expect(problems[0].message).toMatch(/UTF-8/);
    expect(await liveSalesRows(assignment.id)).toEqual([]);
  });

  it('an unterminated quote is a problem of its row, not a crash', async () => {
    const { agent, assignment } = await appraiser();
    const res = await commit(agent, assignment.id, Buffer.concat([header(false), rowBytes('clean', 0), rowBytes('broken-quote', 1)]));
    expect(res.status).toBe(422);
    expect(res.body.error.details.problems[0]).toMatchObject({ row: 3, field: 'File' });
    expect(await liveSalesRows(assignment.id)).toEqual([]);
  });

  it('1e400, a date in the future and an impossible date are named, with their row', async () => {
    const { agent, assignment } = await appraiser();
    const res = await commit(agent, assignment.id, Buffer.concat([header(false), rowBytes('huge-number', 0), rowBytes('future-date', 1), rowBytes('not-a-date', 2)]));
    expect(res.status).toBe(422);
    const messages = (res.body.error.details.problems as Array<{ message: string }>).map((p) => p.message);
    expect(messages[0]).toContain('1e400');
    expect(messages[1]).toMatch(/future/);
    expect(messages[2]).toMatch(/not a real date/);
  });
});

describe('huge files', () => {
  it('a 50 MB file is streamed and refused with a clear message: too many rows, nothing imported', { timeout: 180_000 }, async () => {
    const { agent, assignment } = await appraiser();
    const bytes = csvFile(cleanSaleRows(800_000));
    expect(bytes.length).toBeGreaterThan(50 * 1024 * 1024);
    const [salesBefore, runsBefore, scratchBefore] = [await totalSalesRows(), await importRuns(), await scratchFiles()];
    const res = await refusable(commit(agent, assignment.id, bytes, 'fifty-megabytes.csv'));
    expect(res.status).toBe(422);
    expect(envelopeProblems(res)).toEqual([]);
    expect(res.body.error.message).toMatch(/more than 100,000 rows.*Split it/);
    expect(await totalSalesRows()).toBe(salesBefore);
    expect(await importRuns()).toBe(runsBefore);
    expect(await scratchFiles()).toEqual(scratchBefore);
  });

  it('a file over 60 MB is refused with 413 and a message about the CSV limit; no scratch file stays', { timeout: 180_000 }, async () => {
    const { agent, assignment } = await appraiser();
    const bytes = Buffer.concat([csvFile(cleanSaleRows(10)), Buffer.alloc(61 * 1024 * 1024, 0x20)]);
    const scratchBefore = await scratchFiles();
    const res = await refusable(commit(agent, assignment.id, bytes, 'too-big.csv'));
    expect(res.status).toBe(413);
    expect(res.body.error.message).toMatch(/CSV file is larger than 60 MB/);
    await new Promise((r) => setTimeout(r, 200));
    expect(await scratchFiles()).toEqual(scratchBefore);
    expect(await liveSalesRows(assignment.id)).toEqual([]);
  });
});

describe('the CSV export neutralises formulas', () => {
  it('imports formula-like addresses as text and exports them with a leading quote', async () => {
    const { agent, assignment, reviewer } = await appraiser();
    const rows = FORMULAS.map((address, i) => cleanSaleRow(i, { address }));
    expect((await commit(agent, assignment.id, csvFile(rows))).status).toBe(201);
    const res = await (await signedInAgent(api, reviewer)).get(`/api/assignments/${assignment.id}/sales.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="compline-sales-\d+\.csv"/);
    const parsed = Papa.parse<Record<string, string>>(res.text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: true });
    expect(parsed.data.map((r) => r.Address).sort()).toEqual(FORMULAS.map((f) => `'${f}`).sort());
    for (const row of parsed.data) {
      for (const cell of Object.values(row)) if (FORMULA_START.test(cell)) expect(cell, 'a formula-like cell that is not a number').toMatch(NUMBER);
    }
    // The exported file names its own columns: importing it again needs no mapping by hand.
    const again = await agent.post(`/api/assignments/${assignment.id}/sales/import/preview`).attach('file', Buffer.from(res.text, 'utf8'), 'export.csv');
    expect(again.body.mapping).toMatchObject({ address: 'Address', salePrice: 'Sale price', saleDate: 'Sale date', floorArea: 'Floor area' });
  });

  it('any text cell, read back by a CSV parser, is the text itself or the text after a quote — never a formula', () => {
    const text = fc.tuple(fc.constantFrom('', '=', '+', '-', '@', '\t', '\r', '\uFF1D', '"', ','), fc.string({ unit: 'grapheme', maxLength: 30 })).map(([a, b]) => a + b);
    fc.assert(
      fc.property(text, (value) => {
        const back = Papa.parse<string[]>(`${csvCell(value)}\r\n`, { delimiter: ',', newline: '\r\n' }).data[0]?.[0] ?? '';
        expect(FORMULA_START.test(back)).toBe(false);
        expect([value, `'${value}`]).toContain(back);
      }),
      { numRuns: 500, seed: 20_261_203 },
    );
  });
});

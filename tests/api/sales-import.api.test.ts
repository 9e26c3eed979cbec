import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createAssignment, createFirmWithAssignment, createSale, liveSalesRows, totalSalesRows } from '../factories/assignments';
import { cleanSaleRow, cleanSaleRows, csvFile, daysFromToday, mappingFor, oddHeaders, standardHeaders, type SaleCsvRow } from '../factories/csv';
import { signedInAgent, startTestApi, stopTestApi, type Agent, type TestApi } from '../setup/test-api';

let api: TestApi;
beforeAll(async () => {
  api = await startTestApi();
});
afterAll(async () => {
  await stopTestApi(api);
});

interface Problem {
  row: number;
  field: string;
  message: string;
}

async function appraiserWithAssignment() {
  const team = await createFirmWithAssignment();
  return { ...team, agent: await signedInAgent(api, team.appraiser) };
}

function preview(agent: Agent, assignmentId: number, file: Buffer) {
  return agent.post(`/api/assignments/${assignmentId}/sales/import/preview`).attach('file', file, 'sales-export.csv');
}

function commit(agent: Agent, assignmentId: number, file: Buffer, mapping: object, skipInvalid?: boolean) {
  const req = agent.post(`/api/assignments/${assignmentId}/sales/import`).field('mapping', JSON.stringify(mapping));
  if (skipInvalid !== undefined) req.field('skipInvalid', String(skipInvalid));
  return req.attach('file', file, 'sales-export.csv');
}

async function listedAddresses(agent: Agent, assignmentId: number): Promise<string[]> {
  const res = await agent.get(`/api/assignments/${assignmentId}/sales`);
  expect(res.status).toBe(200);
  return res.body.sales.map((s: { address: string }) => s.address).sort();
}

/** Two good rows (spreadsheet rows 2 and 9) around six bad ones (rows 3 to 8). */
function fileWithBadRows() {
  const good = [cleanSaleRow(0), cleanSaleRow(7)];
  const rows: SaleCsvRow[] = [
    good[0],
    cleanSaleRow(1, { price: '' }),
    cleanSaleRow(2, { price: 'call the agent' }),
    cleanSaleRow(3, { date: '2025-02-30' }),
    cleanSaleRow(4, { date: daysFromToday(40) }),
    cleanSaleRow(5, { area: '-850' }),
    cleanSaleRow(6, { lon: '200' }),
    good[1],
  ];
  return { file: csvFile(rows), good, futureDate: rows[4].date };
}

describe('importing a clean file', () => {
  it('guesses the mapping in the preview, then imports every row', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const rows = cleanSaleRows(12);
    const file = csvFile(rows);
    const salesBefore = await totalSalesRows();

    const pre = await preview(agent, assignment.id, file);
    expect(pre.status).toBe(200);
    expect(pre.body.headers).toEqual(Object.values(standardHeaders));
    expect(pre.body.mapping).toEqual(mappingFor(standardHeaders));
    expect(pre.body).toMatchObject({ totalRows: 12, validRows: 12, invalidRows: 0, problems: [] });
    expect(pre.body.previewRows[0][standardHeaders.address]).toBe(rows[0].address);
    expect(await totalSalesRows()).toBe(salesBefore);

    const res = await commit(agent, assignment.id, file, pre.body.mapping);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ imported: 12, skipped: 0 });
    expect(await listedAddresses(agent, assignment.id)).toEqual(rows.map((r) => r.address).sort());
    const stored = (await liveSalesRows(assignment.id)).find((s) => s.address === rows[3].address);
    expect(stored).toMatchObject({ salePrice: Number(rows[3].price), saleDate: rows[3].date, floorArea: Number(rows[3].area), bedrooms: Number(rows[3].beds) });
  });

  it('imports a 10,000-row file in one go', { timeout: 180_000 }, async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const rows = cleanSaleRows(10_000);
    const res = await commit(agent, assignment.id, csvFile(rows), mappingFor(standardHeaders));
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ imported: 10_000, skipped: 0 });
    const stored = await liveSalesRows(assignment.id);
    expect(stored).toHaveLength(10_000);
    expect(new Set(stored.map((s) => s.address)).size).toBe(10_000);
    expect(stored.find((s) => s.address === rows[9_999].address)?.salePrice).toBe(Number(rows[9_999].price));
  });
});

describe('a file with bad rows', () => {
  it('is refused whole with 422 and row-numbered problems; the sales table is unchanged', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const { file, futureDate } = fileWithBadRows();
    const salesBefore = await totalSalesRows();
    const res = await commit(agent, assignment.id, file, mappingFor(standardHeaders));
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('unprocessable');
    const problems = res.body.error.details.problems as Problem[];
    const byRow = (row: number) => problems.filter((p) => p.row === row);
    expect([...new Set(problems.map((p) => p.row))].sort((a, b) => a - b)).toEqual([3, 4, 5, 6, 7, 8]);
    expect(byRow(3)[0].field).toMatch(/price/i);
    expect(byRow(3)[0].message).toMatch(/missing/i);
    expect(byRow(4)[0].field).toMatch(/price/i);
    expect(byRow(4)[0].message).toContain('call the agent');
    expect(byRow(5)[0].field).toMatch(/date/i);
    expect(byRow(5)[0].message).toContain('2025-02-30');
    expect(byRow(6)[0].field).toMatch(/date/i);
    expect(byRow(6)[0].message).toContain(futureDate);
    expect(byRow(7)[0].field).toMatch(/area/i);
    expect(byRow(8)[0].field).toMatch(/longitude/i);
    expect(res.body.error.message).toMatch(/6 rows/);
    expect(await totalSalesRows()).toBe(salesBefore);
    expect(await liveSalesRows(assignment.id)).toEqual([]);
  });

  it('the preview lists the same problems without storing anything', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const salesBefore = await totalSalesRows();
    const res = await preview(agent, assignment.id, fileWithBadRows().file);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ totalRows: 8, validRows: 2, invalidRows: 6 });
    expect(res.body.problems.map((p: Problem) => p.row)).toEqual([3, 4, 5, 6, 7, 8]);
    expect(await totalSalesRows()).toBe(salesBefore);
  });

  it('with skipInvalid=true imports the good rows and skips the bad', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const { file, good } = fileWithBadRows();
    const salesBefore = await totalSalesRows();
    const res = await commit(agent, assignment.id, file, mappingFor(standardHeaders), true);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ imported: 2, skipped: 6 });
    expect(await listedAddresses(agent, assignment.id)).toEqual(good.map((r) => r.address).sort());
    expect(await totalSalesRows()).toBe(salesBefore + 2);
  });
});

describe('duplicates', () => {
  it('reports a sale already in the assignment (same address and sale date)', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const already = cleanSaleRow(1);
    const existing = await createSale(assignment.id, { address: already.address, saleDate: already.date });
    const file = csvFile([cleanSaleRow(0), already, cleanSaleRow(2)]);

    const pre = await preview(agent, assignment.id, file);
    expect(pre.body).toMatchObject({ validRows: 2, invalidRows: 1 });
    expect(pre.body.problems).toHaveLength(1);
    expect(pre.body.problems[0].row).toBe(3);
    expect(pre.body.problems[0].message).toContain(already.address);

    const refused = await commit(agent, assignment.id, file, mappingFor(standardHeaders));
    expect(refused.status).toBe(422);
    expect(refused.body.error.details.problems.map((p: Problem) => p.row)).toEqual([3]);

    const skipped = await commit(agent, assignment.id, file, mappingFor(standardHeaders), true);
    expect(skipped.body).toMatchObject({ imported: 2, skipped: 1 });
    const stored = await liveSalesRows(assignment.id);
    expect(stored.filter((s) => s.address === already.address).map((s) => s.id)).toEqual([existing.id]);
    expect(stored).toHaveLength(3);
  });

  it('reports a row repeated within the same file', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const row = cleanSaleRow(4);
    const res = await preview(agent, assignment.id, csvFile([row, cleanSaleRow(5), row]));
    expect(res.body).toMatchObject({ validRows: 2, invalidRows: 1 });
    expect(res.body.problems.map((p: Problem) => p.row)).toEqual([4]);
  });
});

describe('the saved mapping', () => {
  it('is offered the next time for a file whose headers no guess would match', async () => {
    const { agent, assignment, appraiser } = await appraiserWithAssignment();
    const first = csvFile(cleanSaleRows(3), oddHeaders);
    const unguessed = await preview(agent, assignment.id, first);
    expect(unguessed.status).toBe(200);
    expect(unguessed.body.mapping).not.toHaveProperty('address');
    expect(unguessed.body.mapping).not.toHaveProperty('salePrice');

    const chosen = mappingFor(oddHeaders);
    expect((await commit(agent, assignment.id, first, chosen)).status).toBe(201);

    const next = await createAssignment({ appraiser });
    const again = await preview(agent, next.id, csvFile(cleanSaleRows(4, 50), oddHeaders));
    expect(again.status).toBe(200);
    expect(again.body.mapping).toEqual(chosen);
    expect(again.body).toMatchObject({ totalRows: 4, validRows: 4, invalidRows: 0 });
  });
});

describe('who may import', () => {
  it('an appraiser of another firm gets 404 and nothing is imported', async () => {
    const { assignment } = await createFirmWithAssignment();
    const outsider = (await appraiserWithAssignment()).agent;
    const file = csvFile(cleanSaleRows(2));
    const salesBefore = await totalSalesRows();
    expect((await preview(outsider, assignment.id, file)).status).toBe(404);
    const res = await commit(outsider, assignment.id, file, mappingFor(standardHeaders));
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
    expect(await totalSalesRows()).toBe(salesBefore);
  });

  it('a reviewer of the same firm gets 403 and nothing is imported', async () => {
    const { assignment, reviewer } = await createFirmWithAssignment();
    const agent = await signedInAgent(api, reviewer);
    const file = csvFile(cleanSaleRows(2));
    expect((await preview(agent, assignment.id, file)).status).toBe(403);
    const res = await commit(agent, assignment.id, file, mappingFor(standardHeaders));
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
    expect(await liveSalesRows(assignment.id)).toEqual([]);
  });
});

// No N+1 queries: the number of SQL statements a request sends must not grow with the number of
// rows it returns. Counted at the driver (every pg Client.query call in this process).
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createAssignment, createFirmWithAssignment, createSale } from '../factories/assignments';
import { signedInAgent, startTestApi, stopTestApi, type Agent, type TestApi } from '../setup/test-api';
import { db } from '../../db/client';
import { photos } from '../../db/schema/assignments';
import { reviewQueries, queryMessages } from '../../db/schema/review';

let api: TestApi;
let counting = false;
let count = 0;
const originalQuery = pg.Client.prototype.query;

beforeAll(async () => {
  api = await startTestApi();
  pg.Client.prototype.query = function (this: pg.Client, ...args: unknown[]) {
    if (counting) count++;
    return (originalQuery as (...a: unknown[]) => unknown).apply(this, args);
  } as typeof originalQuery;
});
afterAll(async () => {
  pg.Client.prototype.query = originalQuery;
  await stopTestApi(api);
});

async function queriesFor(agent: Agent, path: string): Promise<number> {
  count = 0;
  counting = true;
  const res = await agent.get(path);
  counting = false;
  expect(res.status).toBe(200);
  return count;
}

async function assignmentWith(saleCount: number) {
  const setup = await createFirmWithAssignment();
  for (let i = 0; i < saleCount; i++) {
    const sale = await createSale(setup.assignment.id, { floorArea: 1200 + i * 37, salePrice: 300_000 + i * 9_100, neighbourhood: 'Quarry Hill' });
    await db.insert(photos).values({ assignmentId: setup.assignment.id, saleId: sale.id, storageKey: `x/${sale.id}`, width: 10, height: 10, bytes: 1, sha256: 'x', originalName: 'x.jpg', uploadedBy: setup.appraiser.id });
    const [q] = await db.insert(reviewQueries).values({ assignmentId: setup.assignment.id, saleId: sale.id, raisedBy: setup.reviewer.id }).returning();
    await db.insert(queryMessages).values([
      { queryId: q.id, authorId: setup.reviewer.id, kind: 'question', body: 'Why this one?' },
      { queryId: q.id, authorId: setup.appraiser.id, kind: 'comment', body: 'Checking.' },
    ]);
  }
  return { ...setup, agent: await signedInAgent(api, setup.appraiser) };
}

describe('queries per request do not grow with the rows returned', () => {
  it.each([
    ['sales list', (id: number) => `/api/assignments/${id}/sales`],
    ['photo list', (id: number) => `/api/assignments/${id}/photos`],
    ['query threads', (id: number) => `/api/assignments/${id}/queries`],
    ['analysis', (id: number) => `/api/assignments/${id}/analysis`],
    ['grid', (id: number) => `/api/assignments/${id}/grid`],
  ])('%s: the same number of statements for 3 rows and for 30', async (_name, path) => {
    const small = await assignmentWith(3);
    const large = await assignmentWith(30);
    const few = await queriesFor(small.agent, path(small.assignment.id));
    const many = await queriesFor(large.agent, path(large.assignment.id));
    expect(few).toBeGreaterThan(0);
    expect(many).toBe(few);
  });

  it('assignment list: the same number of statements for a firm with 2 assignments and with 12', async () => {
    const firmWith = async (n: number) => {
      const setup = await createFirmWithAssignment();
      for (let i = 1; i < n; i++) await createAssignment({ appraiser: setup.appraiser });
      return signedInAgent(api, setup.appraiser);
    };
    const few = await queriesFor(await firmWith(2), '/api/assignments');
    const many = await queriesFor(await firmWith(12), '/api/assignments');
    expect(few).toBeGreaterThan(0);
    expect(many).toBe(few);
  });
});

// How GET /api/assignments/:id/analysis is sent: a strong ETag per representation, 304 when the
// browser already holds it (RFC 9110 §13.1.2 If-None-Match), gzip when Accept-Encoding allows it
// (RFC 9110 §12.5.3), revalidation on every use (RFC 9111 §5.2.2.4 no-cache).
import http from 'node:http';
import { gunzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '../../db/client';
import { bumpDataRevision } from '../../server/modules/assignments/assignments.repo';
import { createFirmWithAssignment, createSale } from '../factories/assignments';
import { createUser } from '../factories/accounts';
import { signInSessionId, startTestApi, stopTestApi, type TestApi } from '../setup/test-api';

let api: TestApi;
beforeAll(async () => {
  api = await startTestApi();
});
afterAll(async () => {
  await stopTestApi(api);
});

interface RawResponse {
  status: number;
  headers: http.IncomingHttpHeaders;
  body: Buffer;
}

/** A GET that returns the bytes as they came over the wire (supertest would gunzip them). */
function rawGet(path: string, headers: Record<string, string>): Promise<RawResponse> {
  return new Promise((resolve, reject) => {
    const req = http.get(`${api.origin}${path}`, { headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => resolve({ status: res.statusCode!, headers: res.headers, body: Buffer.concat(chunks) }));
      res.on('error', reject);
    });
    req.on('error', reject);
  });
}

async function cookieOf(user: { email: string; password: string }): Promise<string> {
  return `compline_session=${await signInSessionId(api, user)}`;
}

async function assignmentWithSales() {
  const setup = await createFirmWithAssignment();
  for (let i = 0; i < 6; i++) {
    await createSale(setup.assignment.id, { floorArea: 1200 + i * 110, salePrice: 310_000 + i * 26_500, neighbourhood: 'Quarry Hill' });
  }
  const cookie = await cookieOf(setup.appraiser);
  return { ...setup, cookie, path: `/api/assignments/${setup.assignment.id}/analysis` };
}

describe('analysis response: ETag, 304 and gzip', () => {
  it('sends the plain body with a strong ETag, private no-cache and Vary: Accept-Encoding', async () => {
    const { cookie, path, assignment } = await assignmentWithSales();
    const res = await rawGet(path, { cookie });
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(res.headers['content-type']).toBe('application/json; charset=utf-8');
    expect(res.headers.etag).toMatch(/^"[A-Za-z0-9_-]+"$/);
    expect(res.headers['cache-control']).toBe('private, no-cache');
    expect(res.headers.vary).toMatch(/accept-encoding/i);
    expect(Number(res.headers['content-length'])).toBe(res.body.length);
    const parsed = JSON.parse(res.body.toString('utf8'));
    expect(parsed.assignmentId).toBe(assignment.id);
    // The same bytes and tag on a second request (served from the cache).
    const again = await rawGet(path, { cookie });
    expect(again.headers.etag).toBe(res.headers.etag);
    expect(again.body.equals(res.body)).toBe(true);
  });

  it('sends gzip when Accept-Encoding allows it, the same JSON inside, under its own tag', async () => {
    const { cookie, path } = await assignmentWithSales();
    const plain = await rawGet(path, { cookie });
    const gzipped = await rawGet(path, { cookie, 'accept-encoding': 'gzip, deflate, br' });
    expect(gzipped.status).toBe(200);
    expect(gzipped.headers['content-encoding']).toBe('gzip');
    expect(gzipped.headers.vary).toMatch(/accept-encoding/i);
    expect(gunzipSync(gzipped.body).equals(plain.body)).toBe(true);
    expect(gzipped.body.length).toBeLessThan(plain.body.length);
    expect(gzipped.headers.etag).toMatch(/^"[A-Za-z0-9_-]+"$/);
    expect(gzipped.headers.etag).not.toBe(plain.headers.etag);
  });

  it.each([
    ['gzip;q=0', false],
    ['identity', false],
    ['deflate, br', false],
    ['*', true],
    ['*, gzip;q=0', false],
    ['x-gzip', true],
    ['GZIP;q=0.5', true],
  ])('Accept-Encoding %s → gzip %s', async (acceptEncoding, gzip) => {
    const { cookie, path } = await assignmentWithSales();
    const res = await rawGet(path, { cookie, 'accept-encoding': acceptEncoding });
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe(gzip ? 'gzip' : undefined);
    JSON.parse((gzip ? gunzipSync(res.body) : res.body).toString('utf8'));
  });

  it('answers 304 with no body when If-None-Match names the tag, weak or in a list, for either representation', async () => {
    const { cookie, path } = await assignmentWithSales();
    const plain = await rawGet(path, { cookie });
    const gzipped = await rawGet(path, { cookie, 'accept-encoding': 'gzip' });
    for (const [ifNoneMatch, tag] of [
      [plain.headers.etag!, plain.headers.etag],
      [`W/${plain.headers.etag}`, plain.headers.etag],
      [`"something-else", ${gzipped.headers.etag}`, gzipped.headers.etag],
    ]) {
      const res = await rawGet(path, { cookie, 'accept-encoding': 'gzip', 'if-none-match': ifNoneMatch! });
      expect(res.status, ifNoneMatch).toBe(304);
      expect(res.body.length).toBe(0);
      expect(res.headers.etag).toBe(tag);
      expect(res.headers['cache-control']).toBe('private, no-cache');
      expect(res.headers.vary).toMatch(/accept-encoding/i);
    }
    const other = await rawGet(path, { cookie, 'if-none-match': '"not-this-one"' });
    expect(other.status).toBe(200);
    expect(other.body.equals(plain.body)).toBe(true);
  });

  it('answers 200 with a new tag once the data revision has risen', async () => {
    const { cookie, path, assignment } = await assignmentWithSales();
    const before = await rawGet(path, { cookie });
    await createSale(assignment.id, { floorArea: 1900, salePrice: 455_000, neighbourhood: 'Quarry Hill' });
    await bumpDataRevision(db, assignment.id);
    const after = await rawGet(path, { cookie, 'if-none-match': before.headers.etag! });
    expect(after.status).toBe(200);
    expect(after.headers.etag).not.toBe(before.headers.etag);
    expect(JSON.parse(after.body.toString('utf8')).dataRevision).toBe(JSON.parse(before.body.toString('utf8')).dataRevision + 1);
  });

  it('checks access before the tag: another firm’s appraiser holding the ETag gets 404, not 304', async () => {
    const { cookie, path } = await assignmentWithSales();
    const { etag } = (await rawGet(path, { cookie })).headers;
    const outsider = await createUser({ role: 'appraiser' });
    const res = await rawGet(path, { cookie: await cookieOf(outsider), 'if-none-match': etag! });
    expect(res.status).toBe(404);
    expect(res.headers.etag).not.toBe(etag);
    const anonymous = await rawGet(path, { 'if-none-match': etag! });
    expect(anonymous.status).toBe(401);
  });
});

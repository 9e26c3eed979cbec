import { createHash } from 'node:crypto';
import { promisify } from 'node:util';
import { gzip } from 'node:zlib';
import type { Request, Response } from 'express';

const gzipAsync = promisify(gzip);

/** A JSON response prepared once and sent many times: its bytes, their gzip and a strong ETag for
 * each. Sending it costs no serialisation, hashing or compression. */
export interface EncodedJson {
  body: Buffer;
  gzip: Buffer;
  /** Strong ETag of the identity body, from its SHA-256 (the same in every app instance). */
  etag: string;
  /** Strong ETag of the gzip body: a different representation, so a different tag. */
  gzipEtag: string;
}

/** Encodes a JSON text once; the compression runs on libuv's thread pool, off the event loop. */
export async function encodeJson(text: string): Promise<EncodedJson> {
  const body = Buffer.from(text, 'utf8');
  const hash = createHash('sha256').update(body).digest('base64url').slice(0, 32);
  return { body, gzip: await gzipAsync(body), etag: `"${hash}"`, gzipEtag: `"${hash}-gz"` };
}

/** Whether an Accept-Encoding header lets us answer with gzip (RFC 9110 §12.5.3): gzip or x-gzip
 * listed with a non-zero weight, or * with a non-zero weight when gzip is not listed itself. */
export function acceptsGzip(header: string | undefined): boolean {
  if (!header) return false;
  let star: boolean | undefined;
  for (const part of header.split(',')) {
    const [rawName, ...params] = part.split(';');
    const name = rawName.trim().toLowerCase();
    let weight = 1;
    for (const param of params) {
      const [key, value] = param.split('=').map((s) => s.trim().toLowerCase());
      if (key === 'q') weight = Number(value);
    }
    const acceptable = Number.isFinite(weight) && weight > 0;
    if (name === 'gzip' || name === 'x-gzip') return acceptable;
    if (name === '*') star = acceptable;
  }
  return star ?? false;
}

/** The entity tags an If-None-Match header lists, weak markers removed (the comparison for
 * If-None-Match is the weak one, RFC 9110 §13.1.2). */
function listedTags(header: string): string[] {
  return header.split(',').map((tag) => tag.trim().replace(/^W\//, ''));
}

/** Sends a prepared JSON response that a browser may store but must revalidate each time
 * (Cache-Control: private, no-cache): 304 with no body when If-None-Match names one of its tags,
 * else the gzip body when the client accepts it, else the plain body. */
export function sendEncodedJson(req: Request, res: Response, encoded: EncodedJson): void {
  res.setHeader('Cache-Control', 'private, no-cache');
  res.vary('Accept-Encoding');
  const ifNoneMatch = req.headers['if-none-match'];
  if (ifNoneMatch) {
    const tags = listedTags(ifNoneMatch);
    const matched = tags.includes('*') ? encoded.etag : tags.find((tag) => tag === encoded.etag || tag === encoded.gzipEtag);
    if (matched) {
      res.setHeader('ETag', matched);
      res.status(304).end();
      return;
    }
  }
  const gzipped = acceptsGzip(req.headers['accept-encoding']);
  const body = gzipped ? encoded.gzip : encoded.body;
  res.setHeader('ETag', gzipped ? encoded.gzipEtag : encoded.etag);
  res.setHeader('Content-Type', 'application/json; charset=utf-8');
  if (gzipped) res.setHeader('Content-Encoding', 'gzip');
  res.setHeader('Content-Length', body.length);
  res.status(200).end(body);
}

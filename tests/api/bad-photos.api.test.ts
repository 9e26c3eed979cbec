import { existsSync } from 'node:fs';
import { readdir } from 'node:fs/promises';
import path from 'node:path';
import { deflateSync } from 'node:zlib';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { env } from '../../server/env';
import { createFirmWithAssignment, photoRows, totalPhotoRows } from '../factories/assignments';
import { plainJpeg, textFile } from '../factories/images';
import { envelopeProblems } from '../setup/route-table';
import { signedInAgent, startTestApi, stopTestApi, type Agent, type TestApi } from '../setup/test-api';

// Files that are not what their name says, files that are two things at once, files that decode to
// gigabytes, bodies far over the limit and names that try to climb out of the photo folder. The
// stored file is always our own re-encoded JPEG under our own key.

let api: TestApi;
beforeAll(async () => {
  api = await startTestApi();
});
afterAll(async () => {
  await stopTestApi(api);
});

const dataRoot = () => path.resolve(env.DATA_DIR);

/** Files under DATA_DIR/tmp and DATA_DIR/photos, relative to DATA_DIR. */
async function storedFiles(): Promise<string[]> {
  const out: string[] = [];
  for (const dir of ['tmp', 'photos']) {
    const entries = await readdir(path.join(dataRoot(), dir), { recursive: true, withFileTypes: true }).catch(() => []);
    for (const e of entries) if (e.isFile()) out.push(path.relative(dataRoot(), path.join(e.parentPath, e.name)));
  }
  return out.sort();
}

async function appraiser() {
  const team = await createFirmWithAssignment();
  return { ...team, agent: await signedInAgent(api, team.appraiser) };
}

async function upload(agent: Agent, assignmentId: number, bytes: Buffer, name: string) {
  try {
    return await agent.post(`/api/assignments/${assignmentId}/photos`).attach('files', bytes, name);
  } catch (err) {
    // The server may answer before it has read a huge body; the answer is what counts.
    const response = (err as { response?: Awaited<ReturnType<Agent['post']>> }).response;
    if (response) return response;
    throw err;
  }
}

async function download(agent: Agent, url: string): Promise<Buffer> {
  const res = await agent.get(url).buffer(true).parse((stream, done) => {
    const chunks: Buffer[] = [];
    stream.on('data', (c: Buffer) => chunks.push(c));
    stream.on('end', () => done(null, Buffer.concat(chunks)));
  });
  expect(res.status).toBe(200);
  return res.body as Buffer;
}

const CRC_TABLE = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});
function crc32(bytes: Buffer): number {
  let c = 0xffffffff;
  for (const b of bytes) c = CRC_TABLE[(c ^ b) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}
const u32 = (n: number) => { const b = Buffer.alloc(4); b.writeUInt32BE(n); return b; };
const u32le = (n: number) => { const b = Buffer.alloc(4); b.writeUInt32LE(n); return b; };
const u16le = (n: number) => { const b = Buffer.alloc(2); b.writeUInt16LE(n); return b; };

function pngChunk(type: string, data: Buffer): Buffer {
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  return Buffer.concat([u32(data.length), body, u32(crc32(body))]);
}

/** A real decompression bomb: a one-bit PNG of 30,000 × 30,000 pixels (900 megapixels) whose
 * every row is zero, so that it deflates to about a hundred kilobytes. */
function pngBomb(side = 30_000): Buffer {
  const raw = Buffer.alloc((1 + Math.ceil(side / 8)) * side);
  const ihdr = Buffer.concat([u32(side), u32(side), Buffer.from([1, 0, 0, 0, 0])]);
  const signature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  return Buffer.concat([signature, pngChunk('IHDR', ihdr), pngChunk('IDAT', deflateSync(raw, { level: 9 })), pngChunk('IEND', Buffer.alloc(0))]);
}

/** A valid ZIP archive (stored, one file) — appended to a JPEG it makes a JPEG/ZIP polyglot. */
function zipWith(name: string, content: string): Buffer {
  const data = Buffer.from(content, 'utf8');
  const fileName = Buffer.from(name, 'utf8');
  const common = Buffer.concat([u16le(20), u16le(0), u16le(0), u16le(0), u16le(0), u16le(0), u32le(crc32(data)), u32le(data.length), u32le(data.length), u16le(fileName.length), u16le(0)]);
  const local = Buffer.concat([u32le(0x04034b50), common, fileName, data]);
  const central = Buffer.concat([u32le(0x02014b50), u16le(20), common, u16le(0), u16le(0), u16le(0), u32le(0), u32le(0), fileName]);
  const end = Buffer.concat([u32le(0x06054b50), u16le(0), u16le(0), u16le(1), u16le(1), u32le(central.length), u32le(local.length), u16le(0)]);
  return Buffer.concat([local, central, end]);
}

const SCRIPT = '<script>alert("polyglot")</script>';

describe('files that are not the image their name says', () => {
  it.each([
    ['a GIF', () => sharp({ create: { width: 20, height: 20, channels: 3, background: '#884422' } }).gif().toBuffer()],
    ['an SVG with a script', async () => Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg" width="20" height="20"><rect width="20" height="20"/>${SCRIPT}</svg>`)],
    ['an HTML page', async () => Buffer.from(`<!doctype html><html><body>${SCRIPT}</body></html>`)],
    ['a text file', async () => textFile()],
  ])('%s renamed .jpg is refused with 415 and nothing is stored', async (_label, make) => {
    const { agent, assignment } = await appraiser();
    const before = await storedFiles();
    const res = await upload(agent, assignment.id, await make(), 'kitchen.jpg');
    expect(res.status).toBe(415);
    expect(envelopeProblems(res)).toEqual([]);
    expect(await photoRows(assignment.id)).toEqual([]);
    expect(await storedFiles()).toEqual(before);
  });

  it('a PNG named .jpg is an image after all: stored as our own JPEG', async () => {
    const { agent, assignment } = await appraiser();
    const png = await sharp({ create: { width: 40, height: 30, channels: 3, background: '#336699' } }).png().toBuffer();
    const res = await upload(agent, assignment.id, png, 'garden.jpg');
    expect(res.status).toBe(201);
    const stored = await download(agent, `/api/photos/${res.body.photos[0].id}/display`);
    expect((await sharp(stored).metadata()).format).toBe('jpeg');
  });
});

describe('polyglots', () => {
  it.each([
    ['a ZIP', () => zipWith('evil.html', SCRIPT)],
    ['an HTML page', () => Buffer.from(`<html><body>${SCRIPT}</body></html>`)],
  ])('a JPEG with %s appended is accepted, and what is stored is a clean re-encoded JPEG', async (_label, tail) => {
    const { agent, assignment } = await appraiser();
    const jpeg = await plainJpeg(120, 90, '#556b2f');
    const polyglot = Buffer.concat([jpeg, tail()]);
    expect(polyglot.includes(SCRIPT)).toBe(true);
    const res = await upload(agent, assignment.id, polyglot, 'porch.jpg');
    expect(res.status).toBe(201);
    for (const size of ['display', 'thumb']) {
      const stored = await download(agent, `/api/photos/${res.body.photos[0].id}/${size}`);
      expect((await sharp(stored).metadata()).format, size).toBe('jpeg');
      expect(stored.subarray(0, 2).toString('hex'), size).toBe('ffd8');
      expect(stored.subarray(-2).toString('hex'), `${size} ends at the JPEG end marker`).toBe('ffd9');
      for (const needle of ['PK\u0003\u0004', '<script', 'evil.html', '<html']) expect(stored.includes(Buffer.from(needle, 'latin1')), `${size}: ${needle}`).toBe(false);
      expect(stored.equals(polyglot)).toBe(false);
    }
  });
});

describe('sizes', () => {
  it('a decompression bomb (900 megapixels in about 100 KB) is refused with 413 before it is decoded', { timeout: 60_000 }, async () => {
    const bomb = pngBomb();
    expect(bomb.length).toBeLessThan(512 * 1024);
    const { width, height } = await sharp(bomb, { limitInputPixels: false }).metadata();
    expect(width! * height!).toBe(900_000_000);
    const { agent, assignment } = await appraiser();
    const [rowsBefore, filesBefore] = [await totalPhotoRows(), await storedFiles()];
    const res = await upload(agent, assignment.id, bomb, 'innocent.png');
    expect(res.status).toBe(413);
    expect(res.body.error.message).toMatch(/50 megapixels/);
    expect(await totalPhotoRows()).toBe(rowsBefore);
    expect(await storedFiles()).toEqual(filesBefore);
  });

  it('a 100 MB upload is refused with 413 and leaves nothing under DATA_DIR/tmp or DATA_DIR/photos', { timeout: 120_000 }, async () => {
    const { agent, assignment } = await appraiser();
    const head = await plainJpeg(16, 16);
    const body = Buffer.concat([head, Buffer.alloc(100 * 1024 * 1024 - head.length, 0x41)]);
    const filesBefore = await storedFiles();
    const res = await upload(agent, assignment.id, body, 'enormous.jpg');
    expect(res.status).toBe(413);
    expect(res.body.error.message).toMatch(/larger than 15 MB/);
    await new Promise((r) => setTimeout(r, 300));
    expect(await storedFiles()).toEqual(filesBefore);
    expect(await photoRows(assignment.id)).toEqual([]);
  });
});

describe('file names', () => {
  const names = ['../../etc/passwd.jpg', '..\\..\\windows\\win.ini.jpg', '/abs/front.jpg', '%2e%2e%2fescape.jpg', '<img src=x onerror=alert(1)>.jpg', `${'long-'.repeat(120)}.jpg`];

  it('never choose where a file is stored: our own key, the name kept only as text', async () => {
    const { agent, assignment } = await appraiser();
    const before = await storedFiles();
    const jpeg = await plainJpeg();
    for (const name of names) expect((await upload(agent, assignment.id, jpeg, name)).status, name).toBe(201);
    const rows = await photoRows(assignment.id);
    expect(rows).toHaveLength(names.length);
    for (const row of rows) {
      expect(row.storageKey).toMatch(new RegExp(`^${assignment.id}/[0-9a-f-]{36}$`));
      expect(row.originalName.length).toBeGreaterThan(0);
      expect(row.originalName.length).toBeLessThanOrEqual(200);
    }
    expect(rows.map((r) => r.originalName)).toContain('<img src=x onerror=alert(1)>.jpg');
    const added = (await storedFiles()).filter((f) => !before.includes(f));
    expect(added, added.join(', ')).toHaveLength(names.length * 2);
    for (const file of added) expect(file).toMatch(new RegExp(`^photos/${assignment.id}/[0-9a-f-]{36}-(display|thumb)\\.jpg$`));
    for (const escape of ['../../etc/passwd.jpg', 'etc/passwd.jpg', 'photos/etc/passwd.jpg', 'escape.jpg']) {
      expect(existsSync(path.resolve(dataRoot(), 'photos', escape)), escape).toBe(false);
      expect(existsSync(path.resolve(dataRoot(), escape)), escape).toBe(false);
    }
  });
});

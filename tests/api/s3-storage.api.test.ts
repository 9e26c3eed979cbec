// The object-storage backend of the photo storage module, against s3rver (an S3-compatible server
// from the npm registry, run locally): the same interface, then a real photo upload through the API.
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import S3rver from 's3rver';
import sharp from 'sharp';
import { eq } from 'drizzle-orm';
import { db } from '../../db/client';
import { photos } from '../../db/schema/assignments';
import { s3Storage } from '../../server/integrations/storage/s3-storage';
import { photoStorage, setPhotoStorage } from '../../server/integrations/storage/photo-storage';
import type { FileStorage } from '../../server/integrations/storage/storage';
import { createFirmWithAssignment, createSale } from '../factories/assignments';
import { signedInAgent, startTestApi, stopTestApi, type TestApi } from '../setup/test-api';

let api: TestApi;
let server: S3rver;
let dir: string;
let storage: FileStorage;
let diskStorage: FileStorage;

beforeAll(async () => {
  api = await startTestApi();
  dir = await mkdtemp(path.join(os.tmpdir(), 'compline-s3-'));
  server = new S3rver({ port: 0, address: '127.0.0.1', silent: true, directory: dir, configureBuckets: [{ name: 'compline-photos', configs: [] }] });
  const address = (await server.run()) as AddressInfo;
  storage = s3Storage({
    bucket: 'compline-photos',
    region: 'us-east-1',
    endpoint: `http://127.0.0.1:${address.port}`,
    accessKeyId: 'S3RVER',
    secretAccessKey: 'S3RVER',
    prefix: 'photos/',
  });
  diskStorage = photoStorage();
});

afterAll(async () => {
  setPhotoStorage(diskStorage);
  await server.close();
  await rm(dir, { recursive: true, force: true });
  await stopTestApi(api);
});

describe('S3-compatible photo storage', () => {
  it('puts, gets and deletes bytes, and a missing key reads as null', async () => {
    const bytes = Buffer.from([0, 1, 2, 250, 251, 252]);
    await storage.put('1/probe-display.jpg', bytes, 'image/jpeg');
    expect(Buffer.compare((await storage.get('1/probe-display.jpg'))!, bytes)).toBe(0);
    await storage.delete('1/probe-display.jpg');
    expect(await storage.get('1/probe-display.jpg')).toBeNull();
    expect(await storage.get('1/never-written.jpg')).toBeNull();
  });

  it('serves a photo uploaded through the API from the bucket', async () => {
    setPhotoStorage(storage);
    const { appraiser, assignment } = await createFirmWithAssignment();
    const sale = await createSale(assignment.id);
    const agent = await signedInAgent(api, appraiser);
    const jpeg = await sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 20, g: 120, b: 140 } } }).jpeg().toBuffer();
    const upload = await agent.post(`/api/assignments/${assignment.id}/photos`).field('saleId', String(sale.id)).attach('files', jpeg, { filename: 'porch.jpg', contentType: 'image/jpeg' });
    expect(upload.status).toBe(201);
    const photoId = upload.body.photos[0].id as number;
    const served = await agent.get(`/api/photos/${photoId}/display`).buffer(true);
    expect(served.status).toBe(200);
    const metadata = await sharp(served.body as Buffer).metadata();
    expect([metadata.width, metadata.height]).toEqual([64, 48]);
    setPhotoStorage(diskStorage);
    // The disk never saw it: the bytes came from the bucket.
    expect((await agent.get(`/api/photos/${photoId}/display`)).status).toBe(404);
  });

  it('deletes both objects of a photo from the bucket when the photo is deleted through the API', async () => {
    const deleted: string[] = [];
    // The bucket backend itself, with its delete calls recorded on the way through.
    const recording: FileStorage = { ...storage, delete: async (key) => { deleted.push(key); await storage.delete(key); } };
    setPhotoStorage(recording);
    try {
      const { appraiser, assignment } = await createFirmWithAssignment();
      const agent = await signedInAgent(api, appraiser);
      const jpeg = await sharp({ create: { width: 40, height: 30, channels: 3, background: { r: 140, g: 60, b: 30 } } }).jpeg().toBuffer();
      const upload = await agent.post(`/api/assignments/${assignment.id}/photos`).attach('files', jpeg, { filename: 'gable.jpg', contentType: 'image/jpeg' });
      expect(upload.status).toBe(201);
      const photoId = upload.body.photos[0].id as number;
      const [row] = await db.select({ storageKey: photos.storageKey }).from(photos).where(eq(photos.id, photoId));
      const keys = [`${row.storageKey}-display.jpg`, `${row.storageKey}-thumb.jpg`];
      for (const key of keys) expect(await storage.get(key), key).not.toBeNull();

      expect((await agent.delete(`/api/photos/${photoId}`)).status).toBe(204);
      expect([...deleted].sort()).toEqual([...keys].sort());
      for (const key of keys) expect(await storage.get(key), key).toBeNull();
    } finally {
      setPhotoStorage(diskStorage);
    }
  });
});

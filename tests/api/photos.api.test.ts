import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { access, readdir } from 'node:fs/promises';
import path from 'node:path';
import sharp from 'sharp';
import { eq } from 'drizzle-orm';
import { db, pool } from '../../db/client';
import { assignments } from '../../db/schema/assignments';
import { env } from '../../server/env';
import { photoStorage, setPhotoStorage } from '../../server/integrations/storage/photo-storage';
import { createFirmWithAssignment, createSale, photoRows, saleRow, totalPhotoRows } from '../factories/assignments';
import { exifHasGpsBlock, jpegWithGps, jpegWithOrientation6, oversizeFile, plainJpeg, pngBomb, textFile } from '../factories/images';
import { createWorkflowAssignment, createWorkflowWorld, takeAction } from '../factories/workflow';
import { expectErrorEnvelope, signedInAgent, startTestApi, stopTestApi, type Agent, type TestApi } from '../setup/test-api';

let api: TestApi;
beforeAll(async () => {
  api = await startTestApi();
});
afterAll(async () => {
  await stopTestApi(api);
});

/** Every file under the data folder (stored photos and upload scratch), as relative paths. */
async function dataFiles(): Promise<string[]> {
  const root = path.resolve(env.DATA_DIR);
  const entries = await readdir(root, { recursive: true, withFileTypes: true }).catch(() => []);
  return entries.filter((e) => e.isFile()).map((e) => path.relative(root, path.join(e.parentPath, e.name))).sort();
}

/** Whether a file exists at this path relative to the data folder. */
async function exists(relative: string): Promise<boolean> {
  return access(path.resolve(env.DATA_DIR, relative)).then(() => true, () => false);
}

/** The two stored files of a photo, relative to the data folder (disk backend). */
async function storedFilesOf(assignmentId: number, photoId: number): Promise<string[]> {
  const row = (await photoRows(assignmentId)).find((r) => r.id === photoId);
  if (!row) throw new Error(`no photo row ${photoId}`);
  return ['display', 'thumb'].map((size) => path.join('photos', `${row.storageKey}-${size}.jpg`));
}

async function appraiserWithAssignment() {
  const team = await createFirmWithAssignment();
  return { ...team, agent: await signedInAgent(api, team.appraiser) };
}

function upload(agent: Agent, assignmentId: number, files: Array<{ bytes: Buffer; name: string }>, saleId?: number) {
  const req = agent.post(`/api/assignments/${assignmentId}/photos`);
  if (saleId !== undefined) req.field('saleId', String(saleId));
  for (const f of files) req.attach('files', f.bytes, f.name);
  return req;
}

/** GETs a photo file and returns its bytes. */
async function download(agent: Agent, url: string) {
  const res = await agent
    .get(url)
    .buffer(true)
    .parse((stream, done) => {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => done(null, Buffer.concat(chunks)));
    });
  return { status: res.status, contentType: String(res.headers['content-type'] ?? ''), bytes: res.body as Buffer };
}

/** Sends an upload that the server may refuse before reading it all; a reset socket after the
 * answer is the client's problem, not a failure of the check. */
async function refusedUpload(agent: Agent, assignmentId: number, file: { bytes: Buffer; name: string }) {
  try {
    return await upload(agent, assignmentId, [file]);
  } catch (err) {
    const response = (err as { response?: Awaited<ReturnType<typeof upload>> }).response;
    if (response) return response;
    throw err;
  }
}

describe('photo metadata', () => {
  it('strips EXIF and GPS location from the stored display and thumbnail files', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const source = await jpegWithGps();
    const sourceMeta = await sharp(source).metadata();
    expect(Buffer.isBuffer(sourceMeta.exif)).toBe(true);
    expect(exifHasGpsBlock(sourceMeta.exif!)).toBe(true);
    expect(source.includes('GPS')).toBe(true);

    const res = await upload(agent, assignment.id, [{ bytes: source, name: 'front-elevation.jpg' }]);
    expect(res.status).toBe(201);
    const [photo] = res.body.photos;
    for (const size of ['display', 'thumb']) {
      const { status, contentType, bytes } = await download(agent, `/api/photos/${photo.id}/${size}`);
      expect(status, size).toBe(200);
      expect(contentType, size).toContain('image/jpeg');
      const meta = await sharp(bytes).metadata();
      expect(meta.format, size).toBe('jpeg');
      expect(meta.exif, size).toBeUndefined();
      expect(bytes.includes('GPS'), size).toBe(false);
      expect(bytes.includes('WGS-84'), size).toBe(false);
      expect(bytes.includes('Factory Camera'), size).toBe(false);
    }
  });
});

describe('refused uploads store nothing', () => {
  it('refuses a text file renamed .jpg with 415', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const filesBefore = await dataFiles();
    const res = await upload(agent, assignment.id, [{ bytes: textFile(), name: 'photo.jpg' }]);
    expect(res.status).toBe(415);
    expectErrorEnvelope(res);
    expect(await photoRows(assignment.id)).toEqual([]);
    expect(await dataFiles()).toEqual(filesBefore);
  });

  it('refuses a file over 15 MB with 413', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const filesBefore = await dataFiles();
    const bytes = await oversizeFile();
    expect(bytes.length).toBeGreaterThan(15 * 1024 * 1024);
    const res = await refusedUpload(agent, assignment.id, { bytes, name: 'huge.jpg' });
    expect(res.status).toBe(413);
    expect(await photoRows(assignment.id)).toEqual([]);
    expect(await dataFiles()).toEqual(filesBefore);
  });

  it('refuses a decompression bomb (a small PNG of 400 megapixels) with 413', { timeout: 90_000 }, async () => {
    const bomb = await pngBomb();
    const header = await sharp(bomb, { limitInputPixels: false }).metadata();
    expect(header.width! * header.height!).toBe(400_000_000);
    expect(bomb.length).toBeLessThan(1024 * 1024);
    const { agent, assignment } = await appraiserWithAssignment();
    const photosBefore = await totalPhotoRows();
    const filesBefore = await dataFiles();
    const res = await upload(agent, assignment.id, [{ bytes: bomb, name: 'innocent.png' }]);
    expect(res.status).toBe(413);
    expectErrorEnvelope(res);
    expect(await totalPhotoRows()).toBe(photosBefore);
    expect(await dataFiles()).toEqual(filesBefore);
  });

  it('refuses the whole batch when one of several files is not an image', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const filesBefore = await dataFiles();
    const res = await upload(agent, assignment.id, [
      { bytes: await plainJpeg(), name: 'kitchen.jpg' },
      { bytes: textFile(), name: 'notes.jpg' },
    ]);
    expect(res.status).toBe(415);
    expect(await photoRows(assignment.id)).toEqual([]);
    expect(await dataFiles()).toEqual(filesBefore);
  });
});

describe('photo processing', () => {
  it('applies the EXIF orientation: a landscape-stored image tagged 6 comes back portrait', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const source = await jpegWithOrientation6(120, 40);
    const sourceMeta = await sharp(source).metadata();
    expect([sourceMeta.width, sourceMeta.height, sourceMeta.orientation]).toEqual([120, 40, 6]);
    const res = await upload(agent, assignment.id, [{ bytes: source, name: 'rotated.jpg' }]);
    expect(res.status).toBe(201);
    expect([res.body.photos[0].width, res.body.photos[0].height]).toEqual([40, 120]);
    const stored = await download(agent, `/api/photos/${res.body.photos[0].id}/display`);
    const meta = await sharp(stored.bytes).metadata();
    expect([meta.width, meta.height]).toEqual([40, 120]);
    expect(meta.orientation ?? 1).toBe(1);
  });

  it('takes several files at once and lists them all', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const files = [
      { bytes: await plainJpeg(80, 60, '#aa3322'), name: 'street.jpg' },
      { bytes: await plainJpeg(60, 80, '#2233aa'), name: 'rear.jpg' },
      { bytes: await sharp({ create: { width: 50, height: 50, channels: 3, background: '#22aa33' } }).png().toBuffer(), name: 'plan.png' },
    ];
    const filesBefore = await dataFiles();
    const res = await upload(agent, assignment.id, files);
    expect(res.status).toBe(201);
    // A display and a thumbnail per photo land under DATA_DIR/photos/<assignment>/; scratch is gone.
    const added = (await dataFiles()).filter((f) => !filesBefore.includes(f));
    expect(added).toHaveLength(6);
    for (const file of added) expect(file.startsWith(path.join('photos', String(assignment.id)))).toBe(true);
    expect(res.body.photos.map((p: { originalName: string }) => p.originalName)).toEqual(['street.jpg', 'rear.jpg', 'plan.png']);
    const list = await agent.get(`/api/assignments/${assignment.id}/photos`);
    expect(list.status).toBe(200);
    expect(list.body.photos.map((p: { id: number }) => p.id)).toEqual(res.body.photos.map((p: { id: number }) => p.id));
    expect(await photoRows(assignment.id)).toHaveLength(3);
  });

  it('deletes a photo: gone from the list and no longer served, the row kept with deleted_at', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const res = await upload(agent, assignment.id, [
      { bytes: await plainJpeg(), name: 'keep.jpg' },
      { bytes: await plainJpeg(), name: 'drop.jpg' },
    ]);
    const [keep, drop] = res.body.photos as Array<{ id: number }>;
    const del = await agent.delete(`/api/photos/${drop.id}`);
    expect(del.status).toBe(204);
    const list = await agent.get(`/api/assignments/${assignment.id}/photos`);
    expect(list.body.photos.map((p: { id: number }) => p.id)).toEqual([keep.id]);
    expect((await agent.get(`/api/photos/${drop.id}/display`)).status).toBe(404);
    expect((await agent.get(`/api/photos/${keep.id}/display`)).status).toBe(200);
    const rows = await photoRows(assignment.id);
    expect(rows.find((r) => r.id === drop.id)?.deletedAt).toBeInstanceOf(Date);
  });

  it('an appraiser of another firm cannot read or delete the photo (404)', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const res = await upload(agent, assignment.id, [{ bytes: await plainJpeg(), name: 'front.jpg' }]);
    const outsider = (await appraiserWithAssignment()).agent;
    expect((await outsider.get(`/api/photos/${res.body.photos[0].id}/display`)).status).toBe(404);
    expect((await outsider.delete(`/api/photos/${res.body.photos[0].id}`)).status).toBe(404);
    expect((await upload(outsider, assignment.id, [{ bytes: await plainJpeg(), name: 'x.jpg' }])).status).toBe(404);
  });
});

describe('deleting a photo removes its stored files', () => {
  it('removes both sizes from the disk once the delete has committed, and only those', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const res = await upload(agent, assignment.id, [
      { bytes: await plainJpeg(), name: 'keep.jpg' },
      { bytes: await plainJpeg(), name: 'drop.jpg' },
    ]);
    const [keep, drop] = res.body.photos as Array<{ id: number }>;
    const dropFiles = await storedFilesOf(assignment.id, drop.id);
    const keepFiles = await storedFilesOf(assignment.id, keep.id);
    for (const file of [...dropFiles, ...keepFiles]) expect(await exists(file), file).toBe(true);

    expect((await agent.delete(`/api/photos/${drop.id}`)).status).toBe(204);
    for (const file of dropFiles) expect(await exists(file), file).toBe(false);
    for (const file of keepFiles) expect(await exists(file), file).toBe(true);
    expect((await agent.get(`/api/photos/${keep.id}/thumb`)).status).toBe(200);
  });

  it('keeps the files when the delete transaction fails', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const res = await upload(agent, assignment.id, [{ bytes: await plainJpeg(), name: 'front.jpg' }]);
    const photoId = res.body.photos[0].id as number;
    const files = await storedFilesOf(assignment.id, photoId);
    // The audit row the delete writes last is refused for this one photo: the transaction rolls back.
    const fn = `refuse_photo_delete_${photoId}`;
    await pool.query(`create function ${fn}() returns trigger language plpgsql as $$ begin
      if new.action = 'photo-deleted' and new.entity_id = '${photoId}' then raise exception 'refused by the test'; end if;
      return new; end $$`);
    await pool.query(`create trigger ${fn} before insert on audit_events for each row execute function ${fn}()`);
    try {
      const del = await agent.delete(`/api/photos/${photoId}`);
      expect(del.status).toBe(500);
    } finally {
      await pool.query(`drop trigger ${fn} on audit_events`);
      await pool.query(`drop function ${fn}()`);
    }
    expect((await photoRows(assignment.id))[0].deletedAt).toBeNull();
    for (const file of files) expect(await exists(file), file).toBe(true);
    expect((await agent.get(`/api/photos/${photoId}/display`)).status).toBe(200);
  });

  it('logs a file that cannot be removed and still answers 204', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const res = await upload(agent, assignment.id, [{ bytes: await plainJpeg(), name: 'front.jpg' }]);
    const photoId = res.body.photos[0].id as number;
    const disk = photoStorage();
    const failing = { ...disk, delete: async (key: string) => { throw new Error(`storage unavailable for ${key}`); } };
    const logged = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    setPhotoStorage(failing);
    try {
      expect((await agent.delete(`/api/photos/${photoId}`)).status).toBe(204);
    } finally {
      setPhotoStorage(disk);
    }
    const lines = logged.mock.calls.map((args) => args.map(String).join(' '));
    logged.mockRestore();
    const [row] = await photoRows(assignment.id);
    for (const size of ['display', 'thumb']) {
      expect(lines.some((line) => line.includes(`photo ${photoId}`) && line.includes(`${row.storageKey}-${size}.jpg`)), size).toBe(true);
    }
    expect(row.deletedAt).toBeInstanceOf(Date);
    expect((await agent.get(`/api/photos/${photoId}/display`)).status).toBe(404);
  });

  it('keeps the files of a photo that a signed report version froze, and the report still shows it', async () => {
    const world = await createWorkflowWorld(api);
    const assignment = await createWorkflowAssignment(world, 'in_progress');
    const agent = world.agents.appraiser;
    const res = await upload(agent, assignment.id, [{ bytes: await plainJpeg(), name: 'street.jpg' }], assignment.gridSaleIds[0]);
    const photoId = res.body.photos[0].id as number;
    const files = await storedFilesOf(assignment.id, photoId);
    await db.update(assignments).set({ status: 'approved' }).where(eq(assignments.id, assignment.id));
    const version = async () => (await db.select({ v: assignments.version }).from(assignments).where(eq(assignments.id, assignment.id)))[0].v;
    const signed = await takeAction(agent, assignment.id, 'sign', await version());
    expect(signed.status).toBe(201);
    const reportVersionId = signed.body.reportVersionId as number;
    const draft = await agent.post(`/api/assignments/${assignment.id}/new-draft`).send({ version: await version(), reason: 'Photo of the wrong house.' });
    expect(draft.status).toBe(200);

    expect((await agent.delete(`/api/photos/${photoId}`)).status).toBe(204);
    expect((await agent.get(`/api/photos/${photoId}/display`)).status).toBe(404);
    for (const file of files) expect(await exists(file), file).toBe(true);
    const shown = await world.agents.client.get(`/api/reports/${reportVersionId}/photos/${photoId}/thumb`);
    expect(shown.status).toBe(200);
  });
});

describe('cover photo of a sale', () => {
  it('makes the first photo of a sale its cover and keeps it when more are added', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const sale = await createSale(assignment.id);
    expect(sale.coverPhotoId).toBeNull();
    const first = await upload(agent, assignment.id, [{ bytes: await plainJpeg(), name: 'first.jpg' }], sale.id);
    expect(first.status).toBe(201);
    expect((await saleRow(sale.id)).coverPhotoId).toBe(first.body.photos[0].id);
    await upload(agent, assignment.id, [{ bytes: await plainJpeg(), name: 'second.jpg' }], sale.id);
    expect((await saleRow(sale.id)).coverPhotoId).toBe(first.body.photos[0].id);
  });

  it('sets another photo of the same sale as cover, and refuses a photo of another sale with 400', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const sale = await createSale(assignment.id);
    const otherSale = await createSale(assignment.id);
    const own = await upload(agent, assignment.id, [
      { bytes: await plainJpeg(), name: 'a.jpg' },
      { bytes: await plainJpeg(), name: 'b.jpg' },
    ], sale.id);
    const foreign = await upload(agent, assignment.id, [{ bytes: await plainJpeg(), name: 'c.jpg' }], otherSale.id);
    const second = own.body.photos[1].id as number;

    const ok = await agent.patch(`/api/assignments/${assignment.id}/sales/${sale.id}`).send({ version: 1, coverPhotoId: second });
    expect(ok.status).toBe(200);
    expect(ok.body.sale.coverPhotoId).toBe(second);

    const refused = await agent
      .patch(`/api/assignments/${assignment.id}/sales/${sale.id}`)
      .send({ version: ok.body.sale.version, coverPhotoId: foreign.body.photos[0].id });
    expect(refused.status).toBe(400);
    expect(expectErrorEnvelope(refused).fields).toHaveProperty('coverPhotoId');
    expect((await saleRow(sale.id)).coverPhotoId).toBe(second);
  });
});

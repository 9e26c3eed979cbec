import { execFile } from 'node:child_process';
import { createHash, randomBytes } from 'node:crypto';
import { mkdtemp, readFile, rm, stat } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pool } from '../../db/client';
import { env } from '../../server/env';
import { createAssignment } from '../factories/assignments';
import { plainJpeg } from '../factories/images';
import { createSignedReport } from '../factories/signed-report';
import { startTestApi, stopTestApi, type TestApi } from '../setup/test-api';

// The backup and restore scripts, run for real against the test cluster: a database and a photo
// folder go out as one archive and come back into an empty database and an empty folder.

const run = promisify(execFile);

let api: TestApi;
const cleanup: Array<() => Promise<unknown>> = [];
beforeAll(async () => {
  api = await startTestApi();
});
afterAll(async () => {
  for (const step of cleanup.reverse()) await step().catch((err: Error) => console.error('cleanup:', err.message));
  await stopTestApi(api);
});

function databaseUrl(name: string): string {
  const url = new URL(env.DATABASE_URL);
  url.pathname = `/${name}`;
  return url.toString();
}

/** Row counts of every table the schema has (ours and drizzle's migration journal). */
async function tableCounts(client: pg.Pool | pg.Client): Promise<Record<string, number>> {
  const { rows: tables } = await client.query<{ name: string }>(
    `select format('%I.%I', table_schema, table_name) as name from information_schema.tables
     where table_schema in ('public', 'drizzle') and table_type = 'BASE TABLE' order by 1`,
  );
  const counts: Record<string, number> = {};
  for (const { name } of tables) counts[name] = Number((await client.query(`select count(*) as n from ${name}`)).rows[0].n);
  return counts;
}

async function script(name: 'backup.sh' | 'restore.sh', args: string[], extraEnv: Record<string, string>) {
  const { stdout, stderr } = await run('bash', [`scripts/${name}`, ...args], {
    cwd: path.resolve(import.meta.dirname, '../..'),
    env: { ...process.env, ...extraEnv },
    maxBuffer: 16 * 1024 * 1024,
  });
  return { stdout, stderr };
}

describe('backup and restore', () => {
  it('round-trips every table, the signed report and its fingerprint, and the photo bytes', { timeout: 240_000 }, async () => {
    const report = await createSignedReport(api);
    const working = await createAssignment({ appraiser: report.appraiser });
    const uploaded = await report.appraiserAgent.post(`/api/assignments/${working.id}/photos`).attach('files', await plainJpeg(90, 60, '#7a5c3e'), 'front.jpg');
    expect(uploaded.status).toBe(201);
    const photoId = uploaded.body.photos[0].id as number;
    const { rows: [photo] } = await pool.query('select storage_key from photos where id = $1', [photoId]);
    const photoBytes = await readFile(path.resolve(env.DATA_DIR, 'photos', `${photo.storage_key}-display.jpg`));
    const before = await tableCounts(pool);
    expect(before['public.report_versions']).toBeGreaterThan(0);
    expect(before['public.photos']).toBeGreaterThan(0);

    const outDir = await mkdtemp(path.join(os.tmpdir(), 'compline-backup-'));
    cleanup.push(() => rm(outDir, { recursive: true, force: true }));
    const started = performance.now();
    const backup = await script('backup.sh', [outDir], { DATABASE_URL: env.DATABASE_URL, DATA_DIR: path.resolve(env.DATA_DIR) });
    const backupSeconds = (performance.now() - started) / 1000;
    const archive = backup.stdout.trim().split('\n').at(-1)!;
    expect(archive).toMatch(/compline-backup-\d{8}T\d{6}Z\.tar\.gz$/);

    const target = `restore_${randomBytes(6).toString('hex')}`;
    await pool.query(`create database ${target}`);
    cleanup.push(() => pool.query(`drop database if exists ${target} with (force)`));
    const freshDataDir = await mkdtemp(path.join(os.tmpdir(), 'compline-restored-data-'));
    cleanup.push(() => rm(freshDataDir, { recursive: true, force: true }));
    const restoreStarted = performance.now();
    await script('restore.sh', [archive], { DATABASE_URL: databaseUrl(target), DATA_DIR: freshDataDir });
    const restoreSeconds = (performance.now() - restoreStarted) / 1000;
    const rows = Object.values(before).reduce((a, b) => a + b, 0);
    console.log(`backup round trip: ${Object.keys(before).length} tables, ${rows} rows, archive ${((await stat(archive)).size / 1e6).toFixed(1)} MB; backup ${backupSeconds.toFixed(1)} s, restore ${restoreSeconds.toFixed(1)} s`);

    const restored = new pg.Client({ connectionString: databaseUrl(target) });
    await restored.connect();
    try {
      const after = await tableCounts(restored);
      expect(Object.keys(after)).toEqual(Object.keys(before));
      expect(after).toEqual(before);

      const { rows: [version] } = await restored.query('select sha256, canonical_json from report_versions where id = $1', [report.reportVersionId]);
      expect(version.sha256).toBe(report.sha256);
      expect(createHash('sha256').update(version.canonical_json, 'utf8').digest('hex')).toBe(report.sha256);
      const { rows: [restoredPhoto] } = await restored.query('select storage_key, sha256 from photos where id = $1', [photoId]);
      expect(restoredPhoto.storage_key).toBe(photo.storage_key);
      const restoredBytes = await readFile(path.join(freshDataDir, 'photos', `${photo.storage_key}-display.jpg`));
      expect(restoredBytes.equals(photoBytes)).toBe(true);
      expect(createHash('sha256').update(restoredBytes).digest('hex')).toBe(restoredPhoto.sha256);
    } finally {
      await restored.end();
    }

    // Restoring again over the restored database is refused: restore never overwrites.
    const again = await script('restore.sh', [archive], { DATABASE_URL: databaseUrl(target), DATA_DIR: freshDataDir }).catch((err: { code?: number; stdout?: string }) => err);
    expect((again as { code?: number }).code).toBe(1);
    expect(String((again as { stdout?: string }).stdout)).toMatch(/refusing/);
  });
});

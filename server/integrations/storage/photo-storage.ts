import path from 'node:path';
import { env } from '../../env';
import { diskStorage } from './disk-storage';
import { s3Storage } from './s3-storage';
import type { FileStorage } from './storage';

function configuredStorage(): FileStorage {
  if (env.PHOTO_STORAGE === 's3') {
    return s3Storage({
      bucket: env.S3_BUCKET!,
      region: env.S3_REGION,
      endpoint: env.S3_ENDPOINT,
      accessKeyId: env.S3_ACCESS_KEY_ID!,
      secretAccessKey: env.S3_SECRET_ACCESS_KEY!,
      prefix: 'photos/',
    });
  }
  return diskStorage(path.resolve(env.DATA_DIR, 'photos'));
}

let storage: FileStorage = configuredStorage();

/** The storage photos use: PHOTO_STORAGE=disk (under DATA_DIR, the default) or s3. */
export function photoStorage(): FileStorage {
  return storage;
}

export function setPhotoStorage(next: FileStorage): void {
  storage = next;
}

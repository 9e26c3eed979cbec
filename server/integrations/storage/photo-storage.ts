import path from 'node:path';
import { env } from '../../env';
import { diskStorage } from './disk-storage';
import type { FileStorage } from './storage';

let storage: FileStorage = diskStorage(path.resolve(env.DATA_DIR, 'photos'));

/** The storage photos use (disk under DATA_DIR by default). */
export function photoStorage(): FileStorage {
  return storage;
}

export function setPhotoStorage(next: FileStorage): void {
  storage = next;
}

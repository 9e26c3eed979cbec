import { mkdir, readFile, rm, writeFile, rename } from 'node:fs/promises';
import path from 'node:path';
import type { FileStorage } from './storage';

const SAFE_KEY = /^[a-z0-9][a-z0-9/_-]*\.[a-z0-9]+$/i;

/** Files under a folder of the data directory; writes go to a temporary name first, then rename,
 * so a crash never leaves half a file under a real key. */
export function diskStorage(root: string): FileStorage {
  const resolve = (key: string) => {
    if (!SAFE_KEY.test(key) || key.includes('..')) throw new Error(`unsafe storage key: ${key}`);
    return path.join(root, key);
  };
  return {
    async put(key, bytes) {
      const file = resolve(key);
      await mkdir(path.dirname(file), { recursive: true });
      const temp = `${file}.partial`;
      await writeFile(temp, bytes);
      await rename(temp, file);
    },
    async get(key) {
      try {
        return await readFile(resolve(key));
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
        throw err;
      }
    },
    async delete(key) {
      await rm(resolve(key), { force: true });
    },
  };
}

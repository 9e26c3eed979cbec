/** Where photo files live. Callers see only this interface, so an object-storage backend can
 * replace the disk without touching them. Keys are ours (never a client's file name). */
export interface FileStorage {
  put(key: string, bytes: Buffer, contentType: string): Promise<void>;
  get(key: string): Promise<Buffer | null>;
  delete(key: string): Promise<void>;
}

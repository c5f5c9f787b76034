/** Where photo files live. The local folder is the default; S3-compatible storage can slot in. */
export interface PhotoStorage {
  /** Writes a new file under a server-generated key; never overwrites. */
  put(key: string, data: Buffer): Promise<void>;
  read(key: string): Promise<Buffer>;
  /** Removes a file; a key that is already gone is not an error. */
  remove(key: string): Promise<void>;
  /** Every key stored, for sweeping files no row refers to. */
  keys(): Promise<string[]>;
}

export const PHOTO_STORAGE = Symbol('PhotoStorage');

const KEY = /^[a-z0-9][a-z0-9-]{0,80}\.(jpg|webp|png)$/;

/** Keys are made by the server (`randomUUID()` plus a suffix); anything else is a bug. */
export function assertKey(key: string): void {
  if (!KEY.test(key)) throw new Error('Invalid photo storage key');
}

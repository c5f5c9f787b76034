/** Where photo files live: the local folder by default, or an S3-compatible bucket (S3_*). */
export interface PhotoStorage {
  /** Writes a new file under a server-generated key; never overwrites. */
  put(key: string, data: Buffer): Promise<void>;
  read(key: string): Promise<Buffer>;
  /** Removes a file; a key that is already gone is not an error. */
  remove(key: string): Promise<void>;
  /**
   * Keys stored, for sweeping files no row refers to. Storage shared by several processes lists
   * only keys older than any upload in progress, so another process's staged file is never swept.
   */
  keys(): Promise<string[]>;
}

export const PHOTO_STORAGE = Symbol('PhotoStorage');

const KEY = /^[a-z0-9][a-z0-9-]{0,80}\.(jpg|webp|png)$/;

export function isPhotoKey(key: string): boolean {
  return KEY.test(key);
}

/** Keys are made by the server (`randomUUID()` plus a suffix); anything else is a bug. */
export function assertKey(key: string): void {
  if (!isPhotoKey(key)) throw new Error('Invalid photo storage key');
}

/**
 * The list rows' small square follows from the display image's key (`<uuid>.jpg` →
 * `<uuid>-small.jpg`), so photos saved before squares existed need no new column: theirs is made
 * on first request (PhotosService).
 */
export function smallKeyOf(storageKey: string): string {
  return storageKey.replace(/\.jpg$/, '-small.jpg');
}

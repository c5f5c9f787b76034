import { randomUUID } from 'node:crypto';
import { mkdir, open, readdir, readFile, rename, rm } from 'node:fs/promises';
import path from 'node:path';
import { assertKey, type PhotoStorage } from './photo-storage.js';

/** Photos as files in one folder (DATA_DIR/photos), readable by the server's user only. */
export class LocalPhotoStorage implements PhotoStorage {
  private ready: Promise<unknown> | undefined;

  constructor(private readonly dir: string) {}

  async put(key: string, data: Buffer): Promise<void> {
    assertKey(key);
    await this.ensureDir();
    const target = path.join(this.dir, key);
    const temp = path.join(this.dir, `.${randomUUID()}.part`);
    const handle = await open(temp, 'wx', 0o600);
    try {
      await handle.writeFile(data);
      await handle.sync();
      // Synced, so the name can be given while the file closes: each step is a trip through the
      // thread pool and a turn of the event loop, and a photo is three files.
      await Promise.all([handle.close(), rename(temp, target)]);
    } catch (err) {
      await handle.close().catch(() => undefined);
      await rm(temp, { force: true });
      throw err;
    }
  }

  async read(key: string): Promise<Buffer> {
    assertKey(key);
    return readFile(path.join(this.dir, key));
  }

  async remove(key: string): Promise<void> {
    assertKey(key);
    await rm(path.join(this.dir, key), { force: true });
  }

  async keys(): Promise<string[]> {
    await this.ensureDir();
    return (await readdir(this.dir)).filter((name) => !name.startsWith('.'));
  }

  private ensureDir(): Promise<unknown> {
    this.ready ??= mkdir(this.dir, { recursive: true, mode: 0o700 });
    return this.ready;
  }
}

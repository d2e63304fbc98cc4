import { randomUUID } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { mkdir, open, rename, rm } from 'node:fs/promises';
import path from 'node:path';
import type { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { checkedKey, type FileStorage, type StoredObject } from './file-storage';

/** Files under `.data/uploads`, outside the web root (ASVS 4.0.3 12.4.1). Keys are generated, never user-supplied. */
export class DiskStorage implements FileStorage {
  constructor(private readonly dir: string) {}

  /** Writes the stream to a file beside the target and renames it, so readers see the whole file or none. */
  async write(key: string, body: Readable): Promise<void> {
    await mkdir(this.dir, { recursive: true });
    const target = this.file(key);
    // Written beside the target and renamed, so a reader sees the whole file or none.
    const partial = path.join(this.dir, `.partial-${randomUUID()}`);
    try {
      await pipeline(body, createWriteStream(partial, { mode: 0o640 }));
      await rename(partial, target);
    } catch (err) {
      await rm(partial, { force: true });
      throw err;
    }
  }

  /** The stored file as a stream with its length, or null when there is none. */
  async read(key: string): Promise<StoredObject | null> {
    try {
      // Opened first so a missing file is a null here, not an error in the middle of the response.
      const handle = await open(this.file(key), 'r');
      const { size } = await handle.stat();
      return { body: handle.createReadStream(), length: size };
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
      throw err;
    }
  }

  /** Deletes the files; one already gone is not an error. */
  async remove(keys: readonly string[]): Promise<void> {
    await Promise.all(keys.map((k) => rm(this.file(k), { force: true })));
  }

  private file(key: string): string {
    return path.join(this.dir, checkedKey(key));
  }
}

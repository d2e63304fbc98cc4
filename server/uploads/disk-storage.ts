import { mkdir, readFile, writeFile } from 'node:fs/promises';
import path from 'node:path';
import type { FileStorage } from './file-storage';

/** Files under `.data/uploads`, outside the web root (ASVS 4.0.3 12.4.1). Keys are generated, never user-supplied. */
export class DiskStorage implements FileStorage {
  constructor(private readonly dir: string) {}

  async put(key: string, bytes: Buffer): Promise<void> {
    await mkdir(this.dir, { recursive: true });
    await writeFile(this.file(key), bytes, { mode: 0o640 });
  }

  async get(key: string): Promise<Buffer | null> {
    try {
      return await readFile(this.file(key));
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
      throw err;
    }
  }

  private file(key: string): string {
    if (!/^[a-z0-9-]+\.(jpg|png|webp|gif)$/.test(key)) throw new Error(`bad storage key ${key}`);
    return path.join(this.dir, key);
  }
}

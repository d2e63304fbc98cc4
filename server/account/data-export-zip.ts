import { once } from 'node:events';
import { PassThrough, type Readable } from 'node:stream';
import { Zip, ZipDeflate } from 'fflate';

/** One file of a download. */
export interface ZipEntry {
  name: string;
  text: string;
}

/**
 * A ZIP of the entries as a stream (fflate's streaming Zip): each file is compressed when the reader has taken the
 * one before, so a slow download never holds more than one compressed file in memory.
 */
export function zipStream(entries: ZipEntry[]): Readable {
  const out = new PassThrough();
  const zip = new Zip((err, chunk, final) => {
    if (err) return void out.destroy(err);
    out.write(chunk);
    if (final) out.end();
  });
  const encoder = new TextEncoder();
  (async () => {
    for (const entry of entries) {
      if (out.destroyed) return;
      const file = new ZipDeflate(entry.name, { level: 6 });
      zip.add(file);
      file.push(encoder.encode(entry.text), true);
      // A reader that went away closes the stream instead of draining it.
      if (out.writableNeedDrain) await Promise.race([once(out, 'drain'), once(out, 'close')]);
    }
    zip.end();
  })().catch((err: Error) => out.destroy(err));
  return out;
}

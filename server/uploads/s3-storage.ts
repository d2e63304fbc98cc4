import { DeleteObjectCommand, GetObjectCommand, NoSuchKey, S3Client, S3ServiceException } from '@aws-sdk/client-s3';
import { Upload } from '@aws-sdk/lib-storage';
import type { Readable } from 'node:stream';
import type { StorageConfig } from '../config';
import { AppError } from '../platform/app-error';
import { checkedKey, type FileStorage, type StoredObject } from './file-storage';

type S3Settings = Extract<StorageConfig, { kind: 's3' }>;

const UNREACHABLE = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'ENOTFOUND',
  'EAI_AGAIN',
  'EHOSTUNREACH',
  'EPIPE',
]);

/** A store that is down or overloaded is a 503 the client may retry, not a defect; anything else stays an error. */
function unavailable(err: unknown): never {
  const e = err as { code?: string; name?: string; message?: string; $metadata?: { httpStatusCode?: number } };
  const status = e.$metadata?.httpStatusCode ?? 0;
  // The retry layer may rewrap a socket error as a plain Error whose message alone still names the code.
  const code = e.code ?? /\b(E[A-Z_]+)\b/.exec(e.message ?? '')?.[1] ?? '';
  if (UNREACHABLE.has(code) || e.name === 'TimeoutError' || status >= 500) {
    throw new AppError(
      503,
      'storage_unavailable',
      'Image storage is not answering. Try again in a minute.',
      undefined,
      { 'Retry-After': '30' },
    );
  }
  throw err;
}

/** Objects in an S3-compatible bucket under a prefix, so every machine reads what any machine stored. */
export class S3Storage implements FileStorage {
  private readonly client: S3Client;

  constructor(private readonly settings: S3Settings) {
    this.client = new S3Client({
      endpoint: settings.endpoint,
      region: settings.region,
      credentials: { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey },
      forcePathStyle: settings.forcePathStyle,
      // Checksums only where the protocol demands them: many self-hosted servers refuse the newer trailing ones.
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
      maxAttempts: 3,
      requestHandler: { connectionTimeout: 3_000, requestTimeout: 15_000 },
    });
  }

  /** Streams the body to the bucket in parts, so a large image is never held in memory whole. */
  async write(key: string, body: Readable, contentType: string): Promise<void> {
    // lib-storage sends the stream in parts (multipart for large bodies), never the whole file at once.
    const upload = new Upload({
      client: this.client,
      params: { Bucket: this.settings.bucket, Key: this.objectKey(key), Body: body, ContentType: contentType },
      queueSize: 1,
      leavePartsOnError: false,
    });
    await upload.done().catch(unavailable);
  }

  /** The stored object as a stream with its length, or null when there is none. */
  async read(key: string): Promise<StoredObject | null> {
    try {
      const out = await this.client.send(
        new GetObjectCommand({ Bucket: this.settings.bucket, Key: this.objectKey(key) }),
      );
      return { body: out.Body as Readable, length: Number(out.ContentLength) };
    } catch (err) {
      if (err instanceof NoSuchKey || (err instanceof S3ServiceException && err.$metadata.httpStatusCode === 404))
        return null;
      return unavailable(err);
    }
  }

  /** Deletes the objects; one already gone is not an error. */
  async remove(keys: readonly string[]): Promise<void> {
    // One request per key: DeleteObjects needs a Content-MD5 some compatible servers compute differently.
    await Promise.all(
      keys.map((k) =>
        this.client.send(new DeleteObjectCommand({ Bucket: this.settings.bucket, Key: this.objectKey(k) })),
      ),
    ).catch(unavailable);
  }

  /** Releases the client's sockets. */
  close(): void {
    this.client.destroy();
  }

  private objectKey(key: string): string {
    return this.settings.prefix + checkedKey(key);
  }
}

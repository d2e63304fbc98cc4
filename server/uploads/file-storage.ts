/** Where uploaded bytes live; local disk in development, replaceable by object storage. */
export interface FileStorage {
  put(key: string, bytes: Buffer): Promise<void>;
  get(key: string): Promise<Buffer | null>;
}

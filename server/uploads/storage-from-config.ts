import type { StorageConfig } from '../config';
import { DiskStorage } from './disk-storage';
import type { FileStorage } from './file-storage';
import { S3Storage } from './s3-storage';

/** The FileStorage that the configuration names: the disk by default, a bucket when STORAGE_URL is set. */
export function storageFromConfig(config: StorageConfig): FileStorage {
  return config.kind === 's3' ? new S3Storage(config) : new DiskStorage(config.dir);
}

/**
 * Storage of uploaded files: local disk by default, an S3-compatible object
 * store when configured (server/storage/types.ts says how they differ).
 */
import type { StorageConfig } from '../config';
import { LocalFileStorage } from './local';
import { S3FileStorage } from './s3';
import type { FileStorage } from './types';

export { StoredFileMissing, checkKey, type FileStorage } from './types';

export function createStorage(config: StorageConfig): FileStorage {
  return config.driver === 's3' ? new S3FileStorage(config.s3) : new LocalFileStorage(config.dir);
}

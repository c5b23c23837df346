/**
 * Storage of uploaded files: local disk by default, an S3-compatible object
 * store when configured (server/storage/types.ts says how they differ).
 */
import type { S3Config, StorageConfig } from '../config';
import { LocalFileStorage } from './local';
import type { FileStorage } from './types';

export { StoredFileMissing, checkKey, type FileStorage } from './types';

export function createStorage(config: StorageConfig): FileStorage {
  return config.driver === 's3' ? lazyS3Storage(config.s3) : new LocalFileStorage(config.dir);
}

/**
 * The object store, with the S3 client loaded at the first file stored or read rather than at
 * boot: the SDK is some 20 MB of memory an idle server does not need.
 */
function lazyS3Storage(config: S3Config): FileStorage {
  let loaded: Promise<FileStorage> | null = null;
  const storage = () =>
    (loaded ??= import('./s3').then(({ S3FileStorage }) => new S3FileStorage(config)));
  return {
    kind: 's3',
    put: async (key, content, contentType) => (await storage()).put(key, content, contentType),
    get: async (key) => (await storage()).get(key),
    delete: async (key) => (await storage()).delete(key),
    exists: async (key) => (await storage()).exists(key),
  };
}

/**
 * The storage interface. Where uploaded files live: behind one small interface, on local disk by
 * default or in an S3-compatible object store when one is configured
 * (STORAGE_DRIVER=s3 with S3_BUCKET, docs/deployment.md). Several server
 * instances behind a load balancer need the object store (or one shared
 * folder); the database keeps only the key.
 */
export interface FileStorage {
  /** Which backend, for the logs and the health of a deployment. */
  readonly kind: 'local' | 's3';
  /** Stores the whole file under `key`; resolves once it is durable. */
  put(key: string, content: Buffer, contentType: string): Promise<void>;
  /** The stored file; rejects with StoredFileMissing when there is none. */
  get(key: string): Promise<Buffer>;
  /** Removes the file; a missing file is not an error. */
  delete(key: string): Promise<void>;
  /** Whether a file is stored under `key`. */
  exists(key: string): Promise<boolean>;
}

/** The key names no stored file (lost, or removed behind the server's back). */
export class StoredFileMissing extends Error {
  constructor(readonly key: string) {
    super(`No stored file under ${key}.`);
    this.name = 'StoredFileMissing';
  }
}

/** Keys are made by the server ("chromatograms/<workspace>/<uuid>"): letters, digits, - _ / only. */
export function checkKey(key: string): string {
  if (!/^[A-Za-z0-9_-]+(\/[A-Za-z0-9_-]+)*$/.test(key) || key.length > 300)
    throw new Error(`Not a storage key: ${JSON.stringify(key)}`);
  return key;
}

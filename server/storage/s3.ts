import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  NoSuchKey,
  NotFound,
  PutObjectCommand,
  S3Client,
} from '@aws-sdk/client-s3';
import type { S3Config } from '../config';
import { checkKey, StoredFileMissing, type FileStorage } from './types';

/**
 * Files in an S3-compatible object store (AWS S3, MinIO, Ceph, ...) through
 * the AWS SDK v3. An object appears whole or not at all, so a failed upload
 * leaves nothing under the key.
 */
export class S3FileStorage implements FileStorage {
  readonly kind = 's3' as const;
  private readonly client: S3Client;
  private readonly bucket: string;
  private readonly prefix: string;

  constructor(config: S3Config) {
    this.bucket = config.bucket;
    this.prefix = config.prefix;
    this.client = new S3Client({
      region: config.region,
      endpoint: config.endpoint ?? undefined,
      forcePathStyle: config.forcePathStyle,
      // Checksums only where S3 requires them: many S3-compatible stores do not read the
      // streamed (aws-chunked) checksums the SDK would otherwise add to every upload.
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
      credentials:
        config.accessKeyId && config.secretAccessKey
          ? { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey }
          : undefined,
    });
  }

  private keyOf(key: string) {
    return this.prefix + checkKey(key);
  }

  async put(key: string, content: Buffer, contentType: string): Promise<void> {
    await this.client.send(
      new PutObjectCommand({
        Bucket: this.bucket,
        Key: this.keyOf(key),
        Body: content,
        ContentType: contentType,
        ContentLength: content.length,
      }),
    );
  }

  async get(key: string): Promise<Buffer> {
    try {
      const reply = await this.client.send(
        new GetObjectCommand({ Bucket: this.bucket, Key: this.keyOf(key) }),
      );
      return Buffer.from(await reply.Body!.transformToByteArray());
    } catch (error) {
      if (error instanceof NoSuchKey || (error as { name?: string }).name === 'NoSuchKey')
        throw new StoredFileMissing(key);
      throw error;
    }
  }

  async delete(key: string): Promise<void> {
    await this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: this.keyOf(key) }));
  }

  async exists(key: string): Promise<boolean> {
    try {
      await this.client.send(new HeadObjectCommand({ Bucket: this.bucket, Key: this.keyOf(key) }));
      return true;
    } catch (error) {
      if (error instanceof NotFound || (error as { name?: string }).name === 'NotFound')
        return false;
      throw error;
    }
  }
}

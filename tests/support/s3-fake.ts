import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import S3rver from 's3rver';

export interface S3Fake {
  /** Environment that points the server's storage at the fake. */
  env: Record<string, string>;
  /** Keys of every stored object. */
  keys(): Promise<string[]>;
  close(): Promise<void>;
}

const BUCKET = 'phasewright-test';

/** An S3-compatible server (s3rver) on 127.0.0.1, a free port, with one bucket. */
export async function startS3Fake(): Promise<S3Fake> {
  const directory = mkdtempSync(path.join(tmpdir(), 'phasewright-s3-'));
  const server = new S3rver({
    address: '127.0.0.1',
    port: 0,
    silent: true,
    directory,
    configureBuckets: [{ name: BUCKET }],
  });
  const { port } = await server.run();
  const endpoint = `http://127.0.0.1:${port}`;
  const client = new S3Client({
    region: 'us-east-1',
    endpoint,
    forcePathStyle: true,
    credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
  });
  return {
    env: {
      STORAGE_DRIVER: 's3',
      S3_BUCKET: BUCKET,
      S3_ENDPOINT: endpoint,
      S3_ACCESS_KEY_ID: 'S3RVER',
      S3_SECRET_ACCESS_KEY: 'S3RVER',
      S3_PREFIX: 'files/',
    },
    keys: async () => {
      const reply = await client.send(new ListObjectsV2Command({ Bucket: BUCKET }));
      return (reply.Contents ?? []).map((o) => o.Key!).sort();
    },
    close: async () => {
      client.destroy();
      await server.close();
      rmSync(directory, { recursive: true, force: true });
    },
  };
}

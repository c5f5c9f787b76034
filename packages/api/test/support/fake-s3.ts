import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import S3rver from 's3rver';

export interface FakeS3 {
  /** S3_* settings for an app that keeps its photos in the fake bucket. */
  env: Record<string, string>;
  /** Every key in the bucket. */
  keys: () => Promise<string[]>;
  close: () => Promise<void>;
}

/**
 * A local S3-compatible server (s3rver, files in a temporary folder) with one empty bucket,
 * spoken to by the app through the real AWS SDK client.
 */
export async function startFakeS3(bucket = 'workback-photos'): Promise<FakeS3> {
  const dir = mkdtempSync(path.join(tmpdir(), 'workback-s3-'));
  const server = new S3rver({
    address: '127.0.0.1',
    port: 0,
    directory: dir,
    silent: true,
    configureBuckets: [{ name: bucket }],
  });
  const { port } = await server.run();
  const env = {
    S3_ENDPOINT: `http://127.0.0.1:${port}`,
    S3_BUCKET: bucket,
    S3_REGION: 'us-east-1',
    // s3rver's fixed credentials.
    S3_ACCESS_KEY_ID: 'S3RVER',
    S3_SECRET_ACCESS_KEY: 'S3RVER',
  };
  const client = new S3Client({
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION,
    forcePathStyle: true,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY },
  });
  return {
    env,
    keys: async () => {
      const out = await client.send(new ListObjectsV2Command({ Bucket: bucket }));
      return (out.Contents ?? []).map((o) => o.Key!).sort();
    },
    close: async () => {
      client.destroy();
      await server.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

import {
  DeleteObjectCommand,
  GetObjectCommand,
  ListObjectsV2Command,
  NoSuchKey,
  PutObjectCommand,
  S3Client,
} from '@aws-sdk/client-s3';
import type { S3Settings } from '../config/app.config.js';
import { assertKey, type PhotoStorage } from './photo-storage.js';

/** A staged file younger than this may belong to an upload still in progress in another process. */
const SWEEP_AFTER_MS = 60 * 60_000;

/**
 * Photos as objects in an S3-compatible bucket (S3_ENDPOINT, S3_BUCKET, …), shared by every
 * process. The bucket is private: photos still reach people only through the app's scoped
 * routes, never by an object URL.
 */
export class S3PhotoStorage implements PhotoStorage {
  private readonly client: S3Client;
  private readonly bucket: string;

  constructor(settings: S3Settings) {
    this.bucket = settings.bucket;
    this.client = new S3Client({
      endpoint: settings.endpoint,
      region: settings.region,
      // Path-style addressing (endpoint/bucket/key) works with every S3-compatible server.
      forcePathStyle: true,
      credentials: {
        accessKeyId: settings.accessKeyId,
        secretAccessKey: settings.secretAccessKey,
      },
    });
  }

  async put(key: string, data: Buffer): Promise<void> {
    assertKey(key);
    await this.client.send(
      new PutObjectCommand({
        Bucket: this.bucket,
        Key: key,
        Body: data,
        ContentLength: data.length,
        ContentType: key.endsWith('.jpg') ? 'image/jpeg' : 'application/octet-stream',
      }),
    );
  }

  async read(key: string): Promise<Buffer> {
    assertKey(key);
    try {
      const out = await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key: key }));
      return Buffer.from(await out.Body!.transformToByteArray());
    } catch (err) {
      // The same answer as a missing file in the local folder.
      if (err instanceof NoSuchKey) {
        throw Object.assign(new Error(`No photo file ${key}`), { code: 'ENOENT' });
      }
      throw err;
    }
  }

  async remove(key: string): Promise<void> {
    assertKey(key);
    await this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: key }));
  }

  async keys(): Promise<string[]> {
    const keys: string[] = [];
    const before = Date.now() - SWEEP_AFTER_MS;
    let token: string | undefined;
    do {
      const page = await this.client.send(
        new ListObjectsV2Command({ Bucket: this.bucket, ContinuationToken: token }),
      );
      for (const o of page.Contents ?? []) {
        if (o.Key && (o.LastModified?.getTime() ?? 0) < before) keys.push(o.Key);
      }
      token = page.IsTruncated ? page.NextContinuationToken : undefined;
    } while (token);
    return keys;
  }

  onApplicationShutdown(): void {
    this.client.destroy();
  }
}

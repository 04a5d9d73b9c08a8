import { DeleteObjectCommand, GetObjectCommand, HeadObjectCommand, ListObjectsV2Command, PutObjectCommand, S3Client, S3ServiceException } from '@aws-sdk/client-s3';
import { assertKey, ObjectNotFound, STORAGE_KEY, type ObjectStorage, type StoredObject } from './object-storage';

/** Connection settings of an S3-compatible object store. */
export interface S3Settings {
  /** Endpoint URL (e.g. http://127.0.0.1:9000 for a local store); empty for AWS itself. */
  readonly endpoint: string;
  readonly bucket: string;
  readonly region: string;
  readonly accessKeyId: string;
  readonly secretAccessKey: string;
  /** Prefix put before every key (e.g. "slantwise"). */
  readonly prefix?: string;
}

function notFound(err: unknown): boolean {
  if (err instanceof S3ServiceException) return err.name === 'NoSuchKey' || err.name === 'NotFound' || err.$metadata.httpStatusCode === 404;
  return false;
}

/** Objects in an S3-compatible bucket (path-style addressing), for running on more than one machine. */
export class S3Storage implements ObjectStorage {
  private readonly client: S3Client;

  constructor(private readonly settings: S3Settings) {
    this.client = new S3Client({
      region: settings.region,
      endpoint: settings.endpoint || undefined,
      forcePathStyle: true,
      credentials: { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey },
      // Many S3-compatible stores do not support the SDK's newer default checksums.
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
      maxAttempts: 2,
    });
  }

  private key(key: string): string {
    assertKey(key);
    return this.settings.prefix ? `${this.settings.prefix}/${key}` : key;
  }

  async put(key: string, body: Buffer, contentType: string): Promise<void> {
    await this.client.send(new PutObjectCommand({ Bucket: this.settings.bucket, Key: this.key(key), Body: body, ContentType: contentType, ContentLength: body.length }));
  }

  async get(key: string): Promise<Buffer> {
    try {
      const out = await this.client.send(new GetObjectCommand({ Bucket: this.settings.bucket, Key: this.key(key) }));
      if (!out.Body) throw new ObjectNotFound(key);
      return Buffer.from(await out.Body.transformToByteArray());
    } catch (err) {
      if (notFound(err)) throw new ObjectNotFound(key);
      throw err;
    }
  }

  async exists(key: string): Promise<boolean> {
    try {
      await this.client.send(new HeadObjectCommand({ Bucket: this.settings.bucket, Key: this.key(key) }));
      return true;
    } catch (err) {
      if (notFound(err)) return false;
      throw err;
    }
  }

  async delete(key: string): Promise<void> {
    await this.client.send(new DeleteObjectCommand({ Bucket: this.settings.bucket, Key: this.key(key) }));
  }

  /**
   * ListObjectsV2, page after page (continuation tokens). Keys come back without the settings'
   * prefix; objects whose names the server could not have made are skipped.
   */
  async list(prefix: string): Promise<StoredObject[]> {
    const base = this.settings.prefix ? `${this.settings.prefix}/` : '';
    const found: StoredObject[] = [];
    let token: string | undefined;
    do {
      const page = await this.client.send(new ListObjectsV2Command({ Bucket: this.settings.bucket, Prefix: base + prefix, ContinuationToken: token }));
      for (const object of page.Contents ?? []) {
        const key = object.Key?.slice(base.length);
        if (!object.Key?.startsWith(base) || !key || !STORAGE_KEY.test(key) || !object.LastModified) continue;
        found.push({ key, lastModified: object.LastModified });
      }
      token = page.IsTruncated ? page.NextContinuationToken : undefined;
    } while (token);
    return found;
  }

  /** Closes the SDK's connections. */
  close(): void {
    this.client.destroy();
  }
}

import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import type { Config } from '../config';
import { AppError } from '../errors';
import { imageNamePattern, type ImageStorage } from './image-storage';

/** Product images in an S3-compatible bucket, so every app server reads what any of them wrote. */
export class S3ImageStorage implements ImageStorage {
  constructor(
    private readonly client: S3Client,
    private readonly bucket: string,
    private readonly folder = 'product-images/',
  ) {}

  static fromConfig(config: Config): S3ImageStorage {
    const client = new S3Client({
      region: config.s3Region,
      ...(config.s3Endpoint ? { endpoint: config.s3Endpoint } : {}),
      forcePathStyle: config.s3ForcePathStyle,
      ...(config.s3AccessKeyId ? { credentials: { accessKeyId: config.s3AccessKeyId, secretAccessKey: config.s3SecretAccessKey } } : {}),
      // An image read or write either works within a few seconds or the request fails; it never hangs a worker.
      maxAttempts: 2,
    });
    return new S3ImageStorage(client, config.s3Bucket);
  }

  private keyOf(name: string): string {
    // The pattern admits no slash or dot-dot, so a name can never leave the folder.
    if (!imageNamePattern.test(name)) throw new Error(`Refusing image name '${name}'`);
    return this.folder + name;
  }

  async save(name: string, bytes: Buffer): Promise<void> {
    // One PUT replaces the object whole, so a reader never sees half an image.
    await this.client.send(new PutObjectCommand({ Bucket: this.bucket, Key: this.keyOf(name), Body: bytes })).catch(storeAway);
  }

  async read(name: string): Promise<Buffer | undefined> {
    if (!imageNamePattern.test(name)) return undefined;
    try {
      const res = await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key: this.keyOf(name) }));
      return res.Body ? Buffer.from(await res.Body.transformToByteArray()) : undefined;
    } catch (e) {
      if ((e as { name?: string }).name === 'NoSuchKey' || (e as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) return undefined;
      return storeAway(e);
    }
  }

  async remove(name: string): Promise<void> {
    // Deleting a missing object succeeds, as removing a missing file does on disk.
    await this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: this.keyOf(name) })).catch(storeAway);
  }
}

// An object store that cannot be reached is a temporary outage, like a database that is away, not a bug.
function storeAway(e: unknown): never {
  const status = (e as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;
  if (status === undefined || status >= 500) throw new AppError('unavailable', 'Product images are briefly unavailable. Please try again in a moment.');
  throw e;
}

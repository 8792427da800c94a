import type { Config } from '../config';
import { LocalDiskImageStorage, type ImageStorage } from './image-storage';
import { S3ImageStorage } from './s3-image-storage';

const byPlace = new Map<string, ImageStorage>();

/** One storage per place (an upload folder or a bucket), shared by the routes that write and the route that serves. */
export function imageStorageFor(config: Config): ImageStorage {
  const place =
    config.imageStorage === 's3'
      ? ['s3', config.s3Endpoint, config.s3Region, config.s3Bucket, config.s3AccessKeyId, config.s3ForcePathStyle].join('|')
      : `disk|${config.uploadDir}`;
  let s = byPlace.get(place);
  if (!s) byPlace.set(place, (s = config.imageStorage === 's3' ? S3ImageStorage.fromConfig(config) : new LocalDiskImageStorage(config.uploadDir)));
  return s;
}

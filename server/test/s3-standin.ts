import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import S3rver from 's3rver';
import type { Config } from '../config';

/** The stand-in's port: LOADLINE_S3_PORT, so two checkouts running their tests side by side can move it. */
export const s3StandinPort = Number(process.env.LOADLINE_S3_PORT ?? 20400);
const bucket = 'loadline-test-images';

export interface S3Standin {
  /** The same settings as environment variables (for an app server in another process) and as config. */
  env: Record<string, string>;
  config: Partial<Config>;
  close(): Promise<void>;
}

/** An S3-compatible object store on 127.0.0.1 (s3rver, which checks request signatures), with one empty bucket. */
export async function startS3Standin(): Promise<S3Standin> {
  const directory = mkdtempSync(join(tmpdir(), 'loadline-s3-'));
  const server = new S3rver({ address: '127.0.0.1', port: s3StandinPort, directory, silent: true, configureBuckets: [{ name: bucket }] });
  await server.run();
  const env = {
    IMAGE_STORAGE: 's3',
    S3_ENDPOINT: `http://127.0.0.1:${s3StandinPort}`,
    S3_BUCKET: bucket,
    S3_REGION: 'us-east-1',
    S3_ACCESS_KEY_ID: 'S3RVER',
    S3_SECRET_ACCESS_KEY: 'S3RVER',
    S3_FORCE_PATH_STYLE: 'true',
  };
  const config: Partial<Config> = {
    imageStorage: 's3',
    s3Endpoint: env.S3_ENDPOINT,
    s3Bucket: bucket,
    s3Region: env.S3_REGION,
    s3AccessKeyId: env.S3_ACCESS_KEY_ID,
    s3SecretAccessKey: env.S3_SECRET_ACCESS_KEY,
    s3ForcePathStyle: true,
  };
  return {
    env,
    config,
    close: async () => {
      await server.close();
      rmSync(directory, { recursive: true, force: true });
    },
  };
}

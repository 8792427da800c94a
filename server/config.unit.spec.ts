import { describe, expect, it } from 'vitest';
import { ConfigError, parseConfig } from './config';

const base = { JWT_SECRET: 'unit-secret-unit-secret-unit-secret-0123' };
const problemsOf = (env: Record<string, string>): string[] => {
  try {
    parseConfig({ ...base, ...env });
    return [];
  } catch (e) {
    return (e as ConfigError).problems;
  }
};

describe('trusted proxies', () => {
  it('trust only the loopback by default, as the demo runs without a proxy', () => {
    expect(parseConfig(base).trustProxy).toEqual(['loopback']);
  });

  it('take a hop count, false, or a list of addresses, subnets and named ranges', () => {
    expect(parseConfig({ ...base, TRUST_PROXY: '1' }).trustProxy).toBe(1);
    expect(parseConfig({ ...base, TRUST_PROXY: 'false' }).trustProxy).toBe(false);
    expect(parseConfig({ ...base, TRUST_PROXY: 'loopback, 10.0.0.0/8, fd00::/8, 192.0.2.10' }).trustProxy).toEqual([
      'loopback',
      '10.0.0.0/8',
      'fd00::/8',
      '192.0.2.10',
    ]);
  });

  it('refuse "true", which would let every client choose the address its limits are counted under', () => {
    expect(problemsOf({ TRUST_PROXY: 'true' })[0]).toMatch(/TRUST_PROXY/);
    expect(problemsOf({ TRUST_PROXY: '10.0.0.0/33' })[0]).toMatch(/10\.0\.0\.0\/33/);
    expect(problemsOf({ TRUST_PROXY: 'proxy.internal' })[0]).toMatch(/proxy\.internal/);
  });
});

describe('image storage', () => {
  it('keeps images on local disk unless told otherwise', () => {
    expect(parseConfig(base).imageStorage).toBe('disk');
  });

  it('reads the object-store settings', () => {
    const c = parseConfig({
      ...base,
      IMAGE_STORAGE: 's3',
      S3_ENDPOINT: 'http://127.0.0.1:9000/',
      S3_BUCKET: 'shop-images',
      S3_REGION: 'eu-central-1',
      S3_ACCESS_KEY_ID: 'key',
      S3_SECRET_ACCESS_KEY: 'secret',
      S3_FORCE_PATH_STYLE: 'true',
    });
    expect(c).toMatchObject({
      imageStorage: 's3',
      s3Endpoint: 'http://127.0.0.1:9000',
      s3Bucket: 'shop-images',
      s3Region: 'eu-central-1',
      s3AccessKeyId: 'key',
      s3SecretAccessKey: 'secret',
      s3ForcePathStyle: true,
    });
  });

  it('refuses an object store without a bucket, half a key pair, or an endpoint with a path', () => {
    expect(problemsOf({ IMAGE_STORAGE: 's3' })[0]).toMatch(/S3_BUCKET/);
    expect(problemsOf({ IMAGE_STORAGE: 's3', S3_BUCKET: 'shop-images', S3_ACCESS_KEY_ID: 'key' })[0]).toMatch(/S3_SECRET_ACCESS_KEY/);
    expect(problemsOf({ S3_ENDPOINT: 'http://127.0.0.1:9000/bucket' })[0]).toMatch(/S3_ENDPOINT/);
    expect(problemsOf({ IMAGE_STORAGE: 'ftp' })[0]).toMatch(/IMAGE_STORAGE/);
  });
});

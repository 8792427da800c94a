import { describe, expect, it } from 'vitest';
import { springInput } from '../test/catalogue-factories';
import { testApp, userWithToken } from '../test/factories';
import { s3StandinPort } from '../test/s3-standin';

const png = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');

describe('images in an object store that cannot be reached', () => {
  it('uploads and downloads answer 503 (try again), not 500', async () => {
    // Nothing listens on the stand-in's port while this file runs: the store is away.
    const { http, config } = testApp({
      imageStorage: 's3',
      s3Endpoint: `http://127.0.0.1:${s3StandinPort}`,
      s3Bucket: 'loadline-away',
      s3AccessKeyId: 'S3RVER',
      s3SecretAccessKey: 'S3RVER',
      s3ForcePathStyle: true,
    });
    const staff = await userWithToken(config, 'staff');
    const product = (await http.post('/api/staff/products').set(staff.auth).send(springInput()).expect(201)).body as { id: string };
    const upload = await http.post(`/api/staff/products/${product.id}/images`).set(staff.auth).attach('image', png, 'a.png');
    expect(upload.status).toBe(503);
    expect(upload.body.code).toBe('unavailable');
    const download = await http.get(`/files/product-images/${'a'.repeat(64)}.png`);
    expect(download.status).toBe(503);
  });
});

import { existsSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { StaffProductDto } from '../../shared/catalogue';
import { springInput } from '../test/catalogue-factories';
import type { Config } from '../config';
import { testApp, userWithToken } from '../test/factories';
import { startS3Standin } from '../test/s3-standin';

// A real 1×1 PNG and a real 1×1 GIF: file-type recognises them by their magic bytes.
const png = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');
const gif = Buffer.from('R0lGODlhAQABAIAAAP///wAAACH5BAEAAAAALAAAAAABAAEAAAICRAEAOw==', 'base64');

// Every test runs against each place images can live: the default local disk and an S3-compatible object store.
const storages = [
  { where: 'on local disk', start: async () => ({ config: {} as Partial<Config>, close: async () => {} }) },
  { where: 'in an S3-compatible object store', start: startS3Standin },
];
let storageConfig: Partial<Config> = {};

async function withProduct(overrides: Partial<Config> = {}) {
  const t = testApp({ uploadDir: mkdtempSync(join(tmpdir(), 'loadline-images-')), ...storageConfig, ...overrides });
  const staff = await userWithToken(t.config, 'staff');
  const product = (await t.http.post('/api/staff/products').set(staff.auth).send(springInput())).body as StaffProductDto;
  return { ...t, staff, product };
}

// Collects the raw bytes, so the comparison is of what was sent, not of a decoded string.
const binary = (res: NodeJS.ReadableStream, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

describe.each(storages)('product images $where', ({ where, start }) => {
  let stop: () => Promise<void>;
  beforeAll(async () => {
    const storage = await start();
    storageConfig = storage.config;
    stop = storage.close;
  });
  afterAll(async () => {
    storageConfig = {};
    await stop();
  });

  it('an uploaded image is served back byte-identical, with its type, a year of caching and nosniff', async () => {
    const { http, staff, product } = await withProduct();
    const res = await http.post(`/api/staff/products/${product.id}/images`).set(staff.auth).attach('image', png, { filename: 'spring.png', contentType: 'image/png' });
    expect(res.status).toBe(201);
    const [img] = (res.body as StaffProductDto).images;
    expect(img).toMatchObject({ contentType: 'image/png', sizeBytes: png.length, position: 0 });
    expect(img!.url).toMatch(/^\/files\/product-images\/[0-9a-f]{64}\.png$/);
    const served = await http.get(img!.url).buffer(true).parse(binary as never);
    expect(served.status).toBe(200);
    expect(Buffer.compare(served.body as Buffer, png)).toBe(0);
    expect(served.headers['content-type']).toBe('image/png');
    expect(served.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(served.headers['x-content-type-options']).toBe('nosniff');
    // Riders see the same gallery.
    expect((await http.get(`/api/products/${product.id}`)).body.images[0].url).toBe(img!.url);
  });

  it('the type is read from the bytes: a GIF sent as "photo.png" is stored and served as a GIF', async () => {
    const { http, staff, product } = await withProduct();
    const res = await http.post(`/api/staff/products/${product.id}/images`).set(staff.auth).attach('image', gif, { filename: 'photo.png', contentType: 'image/png' });
    expect(res.status).toBe(201);
    expect(res.body.images[0].url).toMatch(/\.gif$/);
    expect((await http.get(res.body.images[0].url)).headers['content-type']).toBe('image/gif');
  });

  it('a file that is not an image is refused, whatever it claims to be', async () => {
    const { http, staff, product } = await withProduct();
    const html = Buffer.from('<html><script>alert(1)</script></html>');
    const res = await http.post(`/api/staff/products/${product.id}/images`).set(staff.auth).attach('image', html, { filename: 'evil.png', contentType: 'image/png' });
    expect(res.status).toBe(400);
    expect(res.body.fields.image).toMatch(/not a PNG/);
    const svg = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"/>');
    expect((await http.post(`/api/staff/products/${product.id}/images`).set(staff.auth).attach('image', svg, { filename: 'a.svg', contentType: 'image/svg+xml' })).status).toBe(400);
  });

  it('a file larger than the upload limit is refused with 413', async () => {
    const { http, staff, product } = await withProduct({ uploadMaxBytes: 2048 });
    const big = Buffer.concat([png, Buffer.alloc(4096)]);
    const res = await http.post(`/api/staff/products/${product.id}/images`).set(staff.auth).attach('image', big, { filename: 'big.png', contentType: 'image/png' });
    expect(res.status).toBe(413);
    expect(res.body.fields.image).toBeDefined();
  });

  it('a file name with a path in it is refused', async () => {
    const { http, staff, product } = await withProduct();
    // Built by hand: the usual form encoders strip the directory from a file name before sending.
    const multipart = (filename: string) =>
      Buffer.concat([
        Buffer.from(`--b0undary\r\nContent-Disposition: form-data; name="image"; filename="${filename}"\r\nContent-Type: image/png\r\n\r\n`),
        png,
        Buffer.from('\r\n--b0undary--\r\n'),
      ]);
    for (const filename of ['../../etc/passwd.png', 'a/b.png', '..\\\\x.png']) {
      const res = await http.post(`/api/staff/products/${product.id}/images`).set(staff.auth).set('Content-Type', 'multipart/form-data; boundary=b0undary').send(multipart(filename));
      expect(res.status, filename).toBe(400);
      expect(res.body.fields.image).toMatch(/path/);
    }
  });

  it('no file, or a body that is not multipart, is a 400', async () => {
    const { http, staff, product } = await withProduct();
    expect((await http.post(`/api/staff/products/${product.id}/images`).set(staff.auth).field('other', 'x')).status).toBe(400);
    expect((await http.post(`/api/staff/products/${product.id}/images`).set(staff.auth).send({ image: 'x' })).status).toBe(400);
  });

  it('images are reordered and deleted; a deleted image is no longer served', async () => {
    const { http, staff, product } = await withProduct();
    await http.post(`/api/staff/products/${product.id}/images`).set(staff.auth).attach('image', png, 'a.png').expect(201);
    const two = (await http.post(`/api/staff/products/${product.id}/images`).set(staff.auth).attach('image', gif, 'b.gif').expect(201)).body as StaffProductDto;
    const [a, b] = two.images;
    const reordered = await http.put(`/api/staff/products/${product.id}/images/order`).set(staff.auth).send({ imageIds: [b!.id, a!.id] });
    expect(reordered.status).toBe(200);
    expect(reordered.body.images.map((i: { id: string }) => i.id)).toEqual([b!.id, a!.id]);
    expect((await http.put(`/api/staff/products/${product.id}/images/order`).set(staff.auth).send({ imageIds: [a!.id] })).status).toBe(400);
    const after = await http.delete(`/api/staff/products/${product.id}/images/${b!.id}`).set(staff.auth);
    expect(after.body.images).toMatchObject([{ id: a!.id, position: 0 }]);
    expect((await http.get(b!.url)).status).toBe(404);
    expect((await http.get(a!.url)).status).toBe(200);
  });

  it('image ids written in capitals name the same images when reordering', async () => {
    const { http, staff, product } = await withProduct();
    await http.post(`/api/staff/products/${product.id}/images`).set(staff.auth).attach('image', png, 'a.png').expect(201);
    const [a, b] = ((await http.post(`/api/staff/products/${product.id}/images`).set(staff.auth).attach('image', gif, 'b.gif').expect(201)).body as StaffProductDto).images;
    const res = await http.put(`/api/staff/products/${product.id}/images/order`).set(staff.auth).send({ imageIds: [b!.id.toUpperCase(), a!.id.toUpperCase()] });
    expect(res.status).toBe(200);
    expect(res.body.images.map((i: { id: string }) => i.id)).toEqual([b!.id, a!.id]);
  });

  it('a name that was never generated is not found, and never reaches the disk', async () => {
    const { http } = await withProduct();
    expect((await http.get('/files/product-images/..%2F..%2Fpackage.json')).status).toBe(404);
    expect((await http.get(`/files/product-images/${'a'.repeat(64)}.png`)).status).toBe(404);
  });

  it('the bytes are kept where the configuration says, and only there', async () => {
    const { http, staff, product, config } = await withProduct();
    await http.post(`/api/staff/products/${product.id}/images`).set(staff.auth).attach('image', png, 'a.png').expect(201);
    expect(existsSync(join(config.uploadDir, 'product-images'))).toBe(where === 'on local disk');
  });
});

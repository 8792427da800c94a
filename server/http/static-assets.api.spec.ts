import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { brotliCompressSync, gzipSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { testApp } from '../test/factories';

const script = `export const answer = ${JSON.stringify('x'.repeat(4000))};\n`;

/** A built client with one script and the compressed copies the build writes beside it. */
function clientDist(): string {
  const dir = mkdtempSync(join(tmpdir(), 'loadline-assets-'));
  mkdirSync(join(dir, 'assets'));
  writeFileSync(join(dir, 'index.html'), '<!doctype html><html><head></head><body></body></html>');
  writeFileSync(join(dir, 'assets', 'app-1.js'), script);
  writeFileSync(join(dir, 'assets', 'app-1.js.br'), brotliCompressSync(script));
  writeFileSync(join(dir, 'assets', 'app-1.js.gz'), gzipSync(script));
  return dir;
}

// The client inflates the body; Content-Length tells what went over the wire.
const wireBytes = (res: { headers: Record<string, string> }) => Number(res.headers['content-length']);

describe('built assets', () => {
  it('are sent brotli-compressed to a browser that accepts it, as JavaScript, cached for a year and varying by encoding', async () => {
    const { http } = testApp({ clientDist: clientDist() });
    const res = await http.get('/assets/app-1.js').set('Accept-Encoding', 'gzip, deflate, br');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(res.headers['vary']).toMatch(/Accept-Encoding/i);
    expect(res.headers['cache-control']).toContain('immutable');
    expect(res.text).toBe(script);
    expect(wireBytes(res)).toBe(brotliCompressSync(script).length);
  });

  it('fall back to gzip, then to the plain file', async () => {
    const { http } = testApp({ clientDist: clientDist() });
    const gz = await http.get('/assets/app-1.js').set('Accept-Encoding', 'gzip');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gz.text).toBe(script);
    expect(wireBytes(gz)).toBeLessThan(script.length / 10);
    const plain = await http.get('/assets/app-1.js').set('Accept-Encoding', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.text).toBe(script);
    expect(wireBytes(plain)).toBe(Buffer.byteLength(script));
  });

  it('answer 404 for a missing asset rather than the app page', async () => {
    const { http } = testApp({ clientDist: clientDist() });
    const res = await http.get('/assets/missing-2.js').set('Accept-Encoding', 'br');
    expect(res.status).toBe(404);
  });
});

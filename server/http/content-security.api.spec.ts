import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { testApp } from '../test/factories';
import { nonceSlot } from './content-security';

/** A built client of one page, with the nonce slot the real index.html carries. */
function clientDist(): string {
  const dir = mkdtempSync(join(tmpdir(), 'loadline-client-'));
  writeFileSync(join(dir, 'index.html'), `<!doctype html><html><head><meta name="csp-nonce" content="${nonceSlot}" /></head><body></body></html>`);
  return dir;
}

const nonceInPage = (html: string) => /name="csp-nonce" content="([^"]+)"/.exec(html)?.[1];
const nonceInPolicy = (policy: string) => /style-src 'self' 'nonce-([^']+)'/.exec(policy)?.[1];

describe('the page and its style nonce', () => {
  it('puts a fresh nonce in the page and in its policy, allows no other inline style, and is never stored', async () => {
    const { http } = testApp({ clientDist: clientDist() });
    const first = await http.get('/staff/fitments');
    const second = await http.get('/staff/fitments');
    for (const res of [first, second]) {
      expect(res.status).toBe(200);
      expect(res.headers['cache-control']).toBe('no-store');
      const policy = res.headers['content-security-policy'] as string;
      expect(policy).not.toContain('unsafe-inline');
      expect(nonceInPage(res.text)).toBe(nonceInPolicy(policy));
      expect(nonceInPage(res.text)).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
    }
    expect(nonceInPage(first.text)).not.toBe(nonceInPage(second.text));
  });

  it('fills the slot when the page is asked for by its file name too', async () => {
    const { http } = testApp({ clientDist: clientDist() });
    const res = await http.get('/index.html');
    expect(res.status).toBe(200);
    expect(res.text).not.toContain(nonceSlot);
    expect(nonceInPage(res.text)).toBe(nonceInPolicy(res.headers['content-security-policy'] as string));
  });
});

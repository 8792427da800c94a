import { describe, expect, it } from 'vitest';
import { testApp } from '../test/factories';

describe('health', () => {
  it('is ok while the database answers', async () => {
    const res = await testApp().http.get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', db: 'ok' });
  });

  it('sends security headers with a same-origin content policy', async () => {
    const res = await testApp().http.get('/api/health');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['content-security-policy']).not.toMatch(/https?:\/\//);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
  });

  it('an unknown API path is a JSON 404', async () => {
    const res = await testApp().http.get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.code).toBe('not-found');
  });
});

describe('health while the database is away', () => {
  it('says degraded with 503 while its connection pool is closed, and ok again once it reopens, from the same app', async () => {
    const { http } = testApp();
    const { AppDataSource } = await import('../db/data-source');
    await AppDataSource.destroy();
    try {
      const down = await http.get('/api/health');
      expect(down.status).toBe(503);
      expect(down.body).toEqual({ status: 'degraded', db: 'down' });
    } finally {
      await AppDataSource.initialize();
    }
    const up = await http.get('/api/health');
    expect(up.status).toBe(200);
    expect(up.body).toEqual({ status: 'ok', db: 'ok' });
  });
});

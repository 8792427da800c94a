import { describe, expect, it } from 'vitest';
import { testApp, userWithToken } from '../test/factories';

describe('a request the server cannot even read is the sender’s fault, never a 500', () => {
  it.each(['/api/fitments/%E0%A4%A', '/api/products/%E0%A4%A', '/files/product-images/%E0%A4%A'])('a path with a broken percent-escape (%s) is a 400 on the path', async (path) => {
    const res = await testApp().http.get(path);
    expect(res.status).toBe(400);
    expect(res.body).toMatchObject({ code: 'validation', fields: { path: expect.any(String) } });
  });

  it('a body marked as gzip that does not inflate is a 400 on the body', async () => {
    const { http, config } = testApp();
    const staff = await userWithToken(config, 'staff');
    const res = await http.post('/api/staff/spring-geometry').set(staff.auth).set('Content-Type', 'application/json').set('Content-Encoding', 'gzip').send('not gzip at all');
    expect(res.status).toBe(400);
    expect(res.body).toMatchObject({ code: 'validation', fields: { body: expect.any(String) } });
  });
});

import { describe, expect, it } from 'vitest';
import { rearSpringExample } from '../../shared/engine/examples';
import { testApp } from '../test/factories';

describe('keys naming object machinery are a 400 on their field, over HTTP too', () => {
  it('a constructor object where the wheelbase belongs: 400 on wheelbaseMm.constructor, not a 500', async () => {
    const text = JSON.stringify({ ...rearSpringExample(), wheelbaseMm: { constructor: { prototype: { x: 1 } } } });
    const res = await testApp().http.post('/api/calculations/rear-spring').set('Content-Type', 'application/json').send(text);
    expect(res.status).toBe(400);
    expect(res.body).toEqual({ code: 'validation', message: 'Some fields need attention.', fields: { 'wheelbaseMm.constructor': '“constructor” is not a field this request accepts.' } });
    expect(({} as Record<string, unknown>).x).toBeUndefined();
  });

  it('a __proto__ key in a body and a constructor parameter in a query string are refused by name', async () => {
    const { http } = testApp();
    const body = await http.post('/api/calculations/rear-spring').set('Content-Type', 'application/json').send(`{"__proto__":{"polluted":"yes"}}`);
    expect(body.status).toBe(400);
    expect(Object.entries(body.body.fields as object)).toEqual([['__proto__', '“__proto__” is not a field this request accepts.']]);
    const query = await http.get('/api/products?constructor=x');
    expect(query.status).toBe(400);
    expect(Object.keys(query.body.fields)).toEqual(['constructor']);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });
});

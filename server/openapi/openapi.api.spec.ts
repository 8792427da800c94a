import { Validator } from '@seriousme/openapi-schema-validator';
import { getMetadataStorage } from 'class-validator';
import { describe, expect, it } from 'vitest';
import { specOf } from '../http/endpoint';
import { isClientPage } from '../http/route-meta';
import { testApp } from '../test/factories';

type Doc = { openapi: string; paths: Record<string, Record<string, { summary: string; 'x-roles'?: string[]; security?: unknown; responses: Record<string, unknown>; requestBody?: { content: Record<string, { schema: { $ref?: string } }> } }>>; components: { schemas: Record<string, { properties?: Record<string, unknown> }> } };
type Layer = { handle: Function & { stack?: Layer[] }; rawPath?: unknown; method?: string; route?: { path: string; stack: Layer[] } };

/** Every method and path in the router stack, walked here on its own so the document is checked against Express itself. */
function routesInStack(stack: Layer[], prefix = ''): { key: string; handlers: Function[] }[] {
  return stack.flatMap((layer) => {
    const at = `${prefix}${typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : ''}`;
    if (layer.route) {
      const path = `${prefix}${layer.route.path === '/' ? '' : layer.route.path}` || '/';
      const methods = [...new Set(layer.route.stack.map((l) => l.method).filter(Boolean))];
      return methods.map((m) => ({ key: `${m!.toUpperCase()} ${path}`, handlers: layer.route!.stack.map((l) => l.handle) }));
    }
    return layer.handle.stack ? routesInStack(layer.handle.stack, at) : [];
  });
}

describe('the API describes itself as OpenAPI 3.1, from its routes and DTO classes', () => {
  it('serves a document that a standard OpenAPI 3.1 validator accepts', async () => {
    const res = await testApp().http.get('/api/openapi.json');
    expect(res.status).toBe(200);
    expect(res.body.openapi).toBe('3.1.0');
    const result = await new Validator().validate(res.body as Parameters<Validator["validate"]>[0]);
    expect(result.errors ?? []).toEqual([]);
    expect(result.valid).toBe(true);
  });

  it('lists every route the app mounts, and nothing else, each with its own summary', async () => {
    const { app, http } = testApp();
    const doc = (await http.get('/api/openapi.json')).body as Doc;
    const mounted = routesInStack((app as unknown as { router: { stack: Layer[] } }).router.stack).filter((r) => !r.handlers.some(isClientPage));
    const described = Object.entries(doc.paths).flatMap(([path, ops]) => Object.keys(ops).map((m) => `${m.toUpperCase()} ${path}`));
    expect(described.sort()).toEqual(mounted.map((r) => r.key.replace(/:(\w+)/g, '{$1}')).sort());
    expect(described.length).toBeGreaterThanOrEqual(45);
    // Each route says what it does through its endpoint spec, so none is listed without a description.
    for (const r of mounted) expect(r.handlers.some((h) => specOf(h)), r.key).toBe(true);
  });

  it('describes each JSON body by exactly the fields its DTO class decorates', async () => {
    const doc = (await testApp().http.get('/api/openapi.json')).body as Doc;
    const storage = getMetadataStorage();
    let bodies = 0;
    for (const ops of Object.values(doc.paths)) {
      for (const op of Object.values(ops)) {
        const ref = op.requestBody?.content['application/json']?.schema.$ref;
        if (!ref) continue;
        bodies++;
        const name = ref.slice(ref.lastIndexOf('/') + 1);
        const decorated = [...new Set(storage.getTargetValidationMetadatas(dtoClass(name), '', false, false).map((m) => m.propertyName))].sort();
        expect(Object.keys(doc.components.schemas[name]?.properties ?? {}).sort(), name).toEqual(decorated);
        expect(op.responses['400']).toBeDefined();
      }
    }
    expect(bodies).toBeGreaterThanOrEqual(20);
  });

  it('marks who may call each route: staff routes name their roles and answer 401 and 403, the calculators need no sign-in', async () => {
    const doc = (await testApp().http.get('/api/openapi.json')).body as Doc;
    const staff = doc.paths['/api/staff/products/{id}']!.put!;
    expect(staff['x-roles']).toEqual(['staff', 'admin']);
    expect(staff.responses['401']).toBeDefined();
    expect(staff.responses['403']).toBeDefined();
    expect(staff.responses['404']).toBeDefined();
    const calc = doc.paths['/api/calculations/rear-spring']!.post!;
    expect(calc.security).toBeUndefined();
    expect(calc.responses['429']).toBeDefined();
    // Mounted before the origin check, so never refused as cross-site; a signed-out write behind it can be.
    expect(calc.responses['403']).toBeUndefined();
    expect(doc.paths['/api/auth/logout']!.post!.responses['403']).toBeDefined();
    expect(doc.paths['/api/auth/me']!.get!.security).toBeDefined();
  });

  it('has a browsable page under the same policy as the app: one nonce-carrying style, no script', async () => {
    const { http } = testApp();
    const res = await http.get('/api/docs');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    const nonce = /style-src[^;]*'nonce-([^']+)'/.exec(String(res.headers['content-security-policy']))?.[1];
    expect(nonce).toBeTruthy();
    expect(res.text).toContain(`<style nonce="${nonce}">`);
    expect(res.text).not.toMatch(/<script|style="/i);
    const doc = (await http.get('/api/openapi.json')).body as Doc;
    for (const path of Object.keys(doc.paths)) expect(res.text).toContain(`<code>${path}</code>`);
  });
});

const classes = new Map<string, Function>();
function dtoClass(name: string): Function {
  if (!classes.size) {
    const storage = getMetadataStorage() as unknown as { validationMetadatas: Map<Function, unknown> };
    for (const cls of storage.validationMetadatas.keys()) classes.set(cls.name, cls);
  }
  return classes.get(name)!;
}

import { randomUUID } from 'node:crypto';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { requestSchemas } from '../openapi/request-schemas';
import { fitmentInput, springInput } from '../test/catalogue-factories';
import { createUser, testApp, userWithToken } from '../test/factories';
import { requestExamples } from '../test/request-examples';
import { bodiesFor, brokenJson, fitting, hostile, toJsonText } from '../test/request-arbitraries';
import { apiRoutes, type MountedRoute } from './route-registry';

/**
 * Whatever arrives at a route that takes a body or a query, the answer is never a 5xx and Object.prototype is left
 * alone. The routes come from the app's router stack and the bodies from the DTO classes' schemas, so a route or a
 * field added later is fuzzed without touching this file. FUZZ_RUNS sets the cases per route (300 by default).
 */

const runs = Number(process.env.FUZZ_RUNS ?? 300);
// Requests in flight at once: the database's waits overlap, so the default run stays short on two cores.
const batch = 6;
// A longer run takes longer per route: sign-in and registration hash passwords, so a case can take 150 ms on a busy two-core machine.
const timeoutMs = Math.max(60_000, runs * 150);
// Limits high enough that the fuzzer reaches validation instead of the rate limiter.
const { app, config } = testApp({ calcRateLimitPerMinute: 100_000_000, loginLimitPerIp: 1_000_000, loginLimitPerAccount: 1_000_000 });
const routes = apiRoutes(app).filter((r) => r.spec?.body || r.spec?.query || r.spec?.content);
const schemas = requestSchemas();

// Known good bodies to mutate, beside the ones made from the schemas (cross-field rules make those often invalid).
const examples = requestExamples;

let server: Server;
let base: string;
beforeAll(async () => {
  server = app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(() => new Promise<void>((r) => server.close(() => r())));

const prototypeNames = () => [Object, Array, Function, String, Number].map((c) => Object.getOwnPropertyNames(c.prototype).sort().join(','));
const pristine = prototypeNames();

function expectNoPollution(): void {
  expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  expect(Object.getPrototypeOf({})).toBe(Object.prototype);
  expect(prototypeNames()).toEqual(pristine);
}

/** Records the path parameters can name, so a body is checked rather than refused for its id. */
async function idsFor(route: MountedRoute, auth: Record<string, string>): Promise<Record<string, string>> {
  const ids: Record<string, string> = {};
  for (const [name, what] of Object.entries(route.spec?.ids ?? {})) {
    if (what === 'The fitment') ids[name] = (await post('/api/staff/fitments', fitmentInput(), auth)).id as string;
    else if (what === 'The product' || what === 'The spring') ids[name] = (await post('/api/staff/products', springInput(), auth)).id as string;
    else if (what === 'The account') ids[name] = (await createUser()).id;
    else ids[name] = randomUUID();
  }
  return ids;
}

async function post(path: string, body: unknown, auth: Record<string, string>): Promise<Record<string, unknown>> {
  const res = await fetch(base + path, { method: 'POST', headers: { 'content-type': 'application/json', ...auth }, body: JSON.stringify(body) });
  expect(res.status).toBe(201);
  return (await res.json()) as Record<string, unknown>;
}

function queryText(q: unknown): string {
  const p = new URLSearchParams();
  if (q === null || typeof q !== 'object') return (p.append('q', String(q)), p.toString());
  for (const [k, v] of Object.entries(q)) for (const x of Array.isArray(v) ? v : [v]) p.append(k, typeof x === 'object' && x !== null ? JSON.stringify(x) : String(x));
  return p.toString();
}

const rawQueries = fc.constantFrom('%', '%E0%A4%A=1', 'page=%00', '&&&', '=x', 'page=1&page=2', '__proto__=1', 'constructor=x', 'constructor[prototype][x]=1', 'a[b][c]=d', `q=${'x'.repeat(5000)}`);

type Case = { kind: 'json'; text: string } | { kind: 'raw'; text: string; type: string } | { kind: 'query'; text: string };

function casesFor(route: MountedRoute): fc.Arbitrary<Case> {
  const spec = route.spec!;
  if (spec.query) {
    const schema = schemas[spec.query.name]!;
    const asStrings = fitting(schema, schemas).map((q) => Object.fromEntries(Object.entries(q as object).map(([k, v]) => [k, typeof v === 'object' && v !== null ? JSON.stringify(v) : String(v)])));
    return fc.oneof(
      asStrings.map((q) => ({ kind: 'query' as const, text: queryText(q) })),
      bodiesFor(schema, schemas).map((q) => ({ kind: 'query' as const, text: queryText(q) })),
      rawQueries.map((text) => ({ kind: 'query' as const, text })),
    );
  }
  const json = spec.body
    ? bodiesFor(schemas[spec.body.name]!, schemas, examples[spec.body.name]?.() ?? [])
    : hostile;
  return fc.oneof(
    { weight: 8, arbitrary: json.map((b) => ({ kind: 'json' as const, text: toJsonText(b) })) },
    { weight: 1, arbitrary: brokenJson.map((text) => ({ kind: 'raw' as const, text, type: 'application/json' })) },
    ...(spec.content ? [{ weight: 3, arbitrary: fc.string({ maxLength: 400 }).map((text) => ({ kind: 'raw' as const, text, type: spec.content!.type })) }] : []),
  );
}

const tally = new Map<string, Map<number, number>>();

describe('no request body or query string reaches a 5xx', () => {
  it('finds routes to fuzz in the app itself', () => {
    expect(routes.length).toBeGreaterThanOrEqual(20);
  });

  it.each(routes.map((r) => [`${r.method} ${r.path}`, r] as const))('%s answers every fuzzed request with a 4xx or a success, never a 5xx', async (name, route) => {
    const role = route.roles?.[0] ?? (route.spec?.signedIn ? 'rider' : undefined);
    const auth = role ? (await userWithToken(config, role)).auth : {};
    const fixtureAuth = (await userWithToken(config, 'admin')).auth;
    const ids = await idsFor(route, fixtureAuth);
    const path = route.path.replace(/:(\w+)/g, (_m, p: string) => ids[p] ?? randomUUID());
    const statuses = new Map<number, number>();
    tally.set(name, statuses);
    const send = async (c: Case): Promise<void> => {
      const res =
        c.kind === 'query'
          ? await fetch(`${base}${path}?${c.text}`, { method: route.method, headers: auth })
          : await fetch(base + path, { method: route.method, headers: { 'content-type': c.kind === 'json' ? 'application/json' : c.type, ...auth }, body: c.text });
      await res.arrayBuffer();
      statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
      expect(res.status, `${route.method} ${path} answered ${res.status} to ${c.text.slice(0, 300)}`).toBeLessThan(500);
    };
    await fc.assert(
      fc.asyncProperty(fc.array(casesFor(route), { minLength: batch, maxLength: batch }), async (cases) => {
        await Promise.all(cases.map(send));
        expectNoPollution();
      }),
      { numRuns: Math.ceil(runs / batch) },
    );
    // Still answering: nothing took the server down.
    expect((await fetch(`${base}/api/health`)).status).toBe(200);
  }, timeoutMs);

  afterAll(() => {
    const lines = [...tally].map(([name, s]) => `${name}: ${[...s].sort((a, b) => a[0] - b[0]).map(([k, v]) => `${k}×${v}`).join(' ')}`);
    console.log(`request fuzz: ${Math.ceil(runs / batch) * batch} cases on each of ${tally.size} routes\n  ${lines.join('\n  ')}`);
  });
});

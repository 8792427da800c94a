import 'reflect-metadata';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { requestSchemas } from '../../openapi/request-schemas';
import { testApp } from '../../test/factories';
import { bodiesFor, fitting, toJsonText } from '../../test/request-arbitraries';
import { requestExamples } from '../../test/request-examples';
import { apiRoutes } from '../route-registry';
import { toDto, unreadableFields } from '../validate';
import { classValidatorParse } from './class-validator-parse';
import { isCompilable, listsWhereObjectsBelong } from './compiled-validator';

/**
 * The compiled runner must answer exactly as class-transformer + class-validator do: the same valid/invalid verdict,
 * the same failing field paths with the same messages, and for a valid body an equal DTO. Every request DTO the
 * app's routes take is checked, on bodies made from its schema, its known good examples and mutations of both.
 */

const { app } = testApp();
const schemas = requestSchemas();
const routes = apiRoutes(app);
const dtos = new Map<string, { cls: new () => object; query: boolean }>();
for (const r of routes) {
  if (r.spec?.body) dtos.set(r.spec.body.name, { cls: r.spec.body as new () => object, query: false });
  if (r.spec?.query) dtos.set(r.spec.query.name, { cls: r.spec.query as new () => object, query: true });
}
const runs = Number(process.env.AGREEMENT_RUNS ?? 400);

type Obj = Record<string, unknown>;
const isObj = (v: unknown): v is Obj => v !== null && typeof v === 'object' && !Array.isArray(v);

/** A query string arrives as text, in an object without a prototype (as Node's query parser makes it). */
const asQuery = (v: unknown): unknown =>
  isObj(v) ? Object.assign(Object.create(null) as object, Object.fromEntries(Object.entries(v).map(([k, x]) => [k, typeof x === 'object' && x !== null ? JSON.stringify(x) : String(x)]))) : v;
/** A body arrives as JSON text and is read by JSON.parse, as express.json does. */
const asBody = (v: unknown): unknown => JSON.parse(toJsonText(v));

/** The libraries' path behind the same refusals that come before any validator (unreadable text, depth, object machinery, lists in lists). */
function viaLibraries(cls: new () => object, body: Obj) {
  const refused = unreadableFields(body);
  if (Object.keys(refused).length) return { ok: false as const, fields: refused };
  const misplaced = listsWhereObjectsBelong(cls, body);
  if (Object.keys(misplaced).length) return { ok: false as const, fields: misplaced };
  return classValidatorParse(cls, body);
}

function viaCompiled(cls: new () => object, body: Obj) {
  const refused = unreadableFields(body);
  return Object.keys(refused).length ? { ok: false as const, fields: refused } : toDto(cls, body);
}

describe('the compiled runner and class-validator agree on every request DTO', () => {
  it('finds the request DTOs in the routes the app mounts', () => {
    expect(dtos.size).toBeGreaterThanOrEqual(15);
    for (const { cls } of dtos.values()) expect(isCompilable(cls), cls.name).toBe(true);
  });

  it.each([...dtos].map(([name, d]) => [name, d] as const))('%s: same verdict, same fields and messages, equal DTOs', (name, { cls, query }) => {
    const schema = schemas[name]!;
    const examples = requestExamples[name]?.() ?? [];
    const corpus = fc.oneof(bodiesFor(schema, schemas, examples), fitting(schema, schemas), ...(examples.length ? [fc.constantFrom(...examples)] : []));
    let valid = 0;
    let invalid = 0;
    fc.assert(
      fc.property(corpus, (generated) => {
        const body = query ? asQuery(generated) : asBody(generated);
        if (!isObj(body)) return;
        const expected = viaLibraries(cls, body);
        const actual = viaCompiled(cls, body);
        expect(actual.ok).toBe(expected.ok);
        if (expected.ok && actual.ok) {
          valid++;
          expect(actual.value).toStrictEqual(expected.value);
        } else if (!expected.ok && !actual.ok) {
          invalid++;
          expect(actual.fields).toEqual(expected.fields);
          expect(Object.keys(actual.fields).sort()).toEqual(Object.keys(expected.fields).sort());
        }
      }),
      { numRuns: runs },
    );
    // The corpus must hold both kinds, or agreement on one of them would go unchecked.
    expect(valid, `${name}: no valid body in the corpus; add one to server/test/request-examples.ts`).toBeGreaterThan(0);
    expect(invalid).toBeGreaterThan(0);
  });

  it('agrees on the fields of a body with many things wrong at once, nested lists included', () => {
    const body = {
      wheelbaseMm: 'long',
      sprungMassKg: -1,
      loads: [{ massKg: 'x' }, null, 3, { positionMm: 1e9, extra: true }],
      leverageRatio: [{ wheelTravelMm: 0, ratio: 2 }, { wheelTravelMm: 0, ratio: 2 }],
      wheelTravelMm: 10,
      shockStrokeMm: 0,
      targets: { staticSagMm: 30, riderSagMm: 20 },
      preloadRangeMm: [],
      springs: [{ id: '', rateNPerMm: 0 }, { id: '', rateNPerMm: 0 }],
      adjusterPitchMm: null,
      colour: 'red',
    };
    const cls = dtos.get('RearSpringRequestDto')!.cls;
    const expected = classValidatorParse(cls, body);
    const actual = toDto(cls, body);
    expect(expected.ok).toBe(false);
    expect(actual).toEqual(expected);
    if (!actual.ok) expect(Object.keys(actual.fields).length).toBeGreaterThanOrEqual(10);
  });
});

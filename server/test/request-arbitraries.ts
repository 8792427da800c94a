import fc from 'fast-check';

/**
 * Request bodies for property tests, derived from the JSON Schemas of the DTO classes (the same ones the API
 * description publishes): values that fit the schema, and hostile variations of them.
 */

type Schema = Record<string, unknown>;
type Json = unknown;

/** A value that fits the schema's types, ranges, lengths, enums and formats (cross-field rules are not known here). */
export function fitting(schema: Schema | undefined, all: Record<string, Schema>, depth = 0): fc.Arbitrary<Json> {
  if (!schema || depth > 8) return fc.constant(null);
  if (typeof schema.$ref === 'string') return fitting(all[schema.$ref.slice(schema.$ref.lastIndexOf('/') + 1)], all, depth + 1);
  if (Array.isArray(schema.oneOf)) return fc.oneof(...(schema.oneOf as Schema[]).map((s) => fitting(s, all, depth + 1)));
  if (Array.isArray(schema.enum)) return fc.constantFrom(...(schema.enum as Json[]));
  const type = Array.isArray(schema.type) ? schema.type[0] : schema.type;
  switch (type) {
    case 'object': {
      const props = (schema.properties ?? {}) as Record<string, Schema>;
      const required = (schema.required as string[] | undefined) ?? [];
      const model: Record<string, fc.Arbitrary<Json>> = {};
      for (const [k, s] of Object.entries(props)) model[k] = fitting(s, all, depth + 1);
      return fc.record(model, { requiredKeys: required.filter((k) => k in props) });
    }
    case 'array': {
      const min = Number(schema.minItems ?? 0);
      return fc.array(fitting(schema.items as Schema, all, depth + 1), { minLength: min, maxLength: Math.max(min, Math.min(Number(schema.maxItems ?? 4), 4)) });
    }
    case 'string': {
      if (schema.format === 'uuid') return fc.uuid();
      if (schema.format === 'email') return fc.emailAddress();
      const minLength = Number(schema.minLength ?? 0);
      const maxLength = Math.min(Number(schema.maxLength ?? 40), minLength + 40);
      if (typeof schema.pattern === 'string') {
        const re = new RegExp(schema.pattern);
        const anchored = schema.pattern.startsWith('^') && schema.pattern.endsWith('$');
        const base = anchored ? fc.stringMatching(re) : fc.string({ minLength: Math.max(minLength, 1), maxLength }).map((s) => (re.test(s) ? s : `${s}A`.slice(-maxLength)));
        return base.filter((s) => s.length >= minLength && s.length <= Number(schema.maxLength ?? Infinity) && re.test(s));
      }
      return fc.string({ minLength, maxLength });
    }
    case 'integer':
      return fc.integer({ min: Math.ceil(Number(schema.minimum ?? schema.exclusiveMinimum ?? -1e6)), max: Math.floor(Number(schema.maximum ?? 1e6)) }).filter((n) => schema.exclusiveMinimum === undefined || n > Number(schema.exclusiveMinimum));
    case 'number': {
      const excl = schema.exclusiveMinimum !== undefined;
      return fc.double({ min: Number(schema.minimum ?? schema.exclusiveMinimum ?? -1e6), max: Number(schema.maximum ?? 1e6), minExcluded: excl, noNaN: true, noDefaultInfinity: true });
    }
    case 'boolean':
      return fc.boolean();
    default:
      return fc.jsonValue({ maxDepth: 2 });
  }
}

/** Own property, even for "__proto__": assigning would swap the prototype instead. */
const define = (o: object, k: string, v: Json) => Object.defineProperty(o, k, { value: v, enumerable: true, writable: true, configurable: true });

/** Stands for a number JSON can write but a JavaScript value cannot hold (1e999 parses to Infinity). */
export const overflowMarker = '@@overflow@@';

const nested = (levels: number, leaf: Json): Json => (levels === 0 ? leaf : [nested(levels - 1, leaf)]);
const machineryKeys = ['__proto__', 'constructor', 'prototype', 'toString', 'valueOf', 'hasOwnProperty', '__defineGetter__'];

/** Values that have broken servers: prototype keys, wrong types, extremes of size and depth. */
export const hostile: fc.Arbitrary<Json> = fc.oneof(
  fc.constantFrom<Json>(null, true, false, 0, -0, -1, 1.5, '', ' ', 'abc', [], {}, [1, 2], { a: 1 }, [{}], [[]], [null]),
  fc.constantFrom<Json>(1e308, -1e308, 5e-324, Number.MAX_SAFE_INTEGER + 2, 123456789012345678901234567890, overflowMarker),
  fc.constantFrom(...machineryKeys).map((k) => define({}, k, { prototype: { polluted: 'yes' }, polluted: 'yes' })),
  fc.constantFrom(...machineryKeys).map((k) => define({}, k, define({}, '__proto__', { polluted: 'yes' }))),
  fc.constantFrom('x'.repeat(70_000), '\u0000', 'a\u0000b', '\ud800', '\udfff x', '😀'.repeat(500), '%E0%A4%A', '<script>', "'; DROP TABLE users; --"),
  fc.integer({ min: 1, max: 45 }).map((n) => nested(n, 1)),
  fc.integer({ min: 1, max: 40 }).map((n) => {
    let o: Json = { polluted: 'yes' };
    for (let i = 0; i < n; i++) o = define({}, machineryKeys[i % machineryKeys.length]!, o);
    return o;
  }),
  fc.jsonValue({ maxDepth: 4 }),
  fc.array(fc.jsonValue({ maxDepth: 2 }), { maxLength: 60 }),
);

/** Every place in a value where something can be put or taken away: [container, key]. */
function places(root: Json): [Record<string, Json> | Json[], string | number][] {
  const out: [Record<string, Json> | Json[], string | number][] = [];
  const walk = (v: Json): void => {
    if (Array.isArray(v)) v.forEach((x, i) => (out.push([v, i]), walk(x)));
    else if (v !== null && typeof v === 'object') for (const [k, x] of Object.entries(v)) out.push([v as Record<string, Json>, k]), walk(x);
  };
  walk(root);
  return out;
}

function containers(root: Json): (Record<string, Json> | Json[])[] {
  const out: (Record<string, Json> | Json[])[] = [];
  const walk = (v: Json): void => {
    if (v === null || typeof v !== 'object') return;
    out.push(v as Record<string, Json>);
    Object.values(v).forEach(walk);
  };
  walk(root);
  return out;
}

type Mutation = { kind: 'replace' | 'remove' | 'add'; at: number; key: string; value: Json };

const mutation: fc.Arbitrary<Mutation> = fc.record({
  kind: fc.constantFrom<Mutation['kind']>('replace', 'replace', 'remove', 'add'),
  at: fc.nat(),
  key: fc.oneof(fc.constantFrom(...machineryKeys), fc.string({ maxLength: 12 })),
  value: hostile,
});

/** A deep copy that keeps own "__proto__" keys as keys (JSON.parse of JSON.stringify would too, but not the overflow marker's place). */
function copy(v: Json): Json {
  if (Array.isArray(v)) return v.map(copy);
  if (v === null || typeof v !== 'object') return v;
  const out = {};
  for (const [k, x] of Object.entries(v)) define(out, k, copy(x));
  return out;
}

/** Applies mutations to a copy of a fitting value: a wrong type or hostile value in one place, a key gone, a key added. */
export function mutate(base: Json, mutations: Mutation[]): Json {
  let root: Json = copy(base);
  for (const { value, ...m } of mutations.map((x) => ({ ...x, value: copy(x.value) }))) {
    if (m.kind === 'add') {
      const all = containers(root);
      const target = all[m.at % Math.max(all.length, 1)];
      if (target && !Array.isArray(target)) define(target, m.key, value);
      else if (Array.isArray(target)) target.push(value);
      continue;
    }
    const all = places(root);
    if (!all.length) {
      root = value;
      continue;
    }
    const [container, key] = all[m.at % all.length]!;
    if (m.kind === 'remove') {
      if (Array.isArray(container)) container.splice(Number(key), 1);
      else delete container[key];
    } else if (Array.isArray(container)) container[Number(key)] = value;
    else define(container, String(key), value);
  }
  return root;
}

/** Bodies for one DTO: fitting ones, mutated ones (most), and arbitrary JSON. */
export function bodiesFor(schema: Schema, all: Record<string, Schema>, examples: Json[] = []): fc.Arbitrary<Json> {
  const base = examples.length ? fc.oneof(fitting(schema, all), fc.constantFrom(...examples)) : fitting(schema, all);
  return fc.oneof(
    { weight: 1, arbitrary: base },
    { weight: 7, arbitrary: fc.tuple(base, fc.array(mutation, { minLength: 1, maxLength: 3 })).map(([b, ms]) => mutate(b, ms)) },
    { weight: 2, arbitrary: hostile },
  );
}

/** JSON text of a body, with the overflow marker written as a number no double holds. */
export function toJsonText(body: Json): string {
  return (JSON.stringify(body) ?? 'null').replaceAll(`"${overflowMarker}"`, '1e999');
}

/** Text that is not JSON at all, or stops half-way. */
export const brokenJson: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom('{', '{"a":', 'nul', '[1,2', '"\\u12"', '{"a":1,}', '\u0000', '{"a":1}{"b":2}', ''),
  fc.string({ maxLength: 30 }),
);

import { createRequire } from 'node:module';
import { ValidationTypes } from 'class-validator';
import { validationMetadatasToSchemas } from 'class-validator-jsonschema';
import type { DescribedConstraint } from '../../shared/dto/validation';

type Schema = Record<string, unknown>;

// class-validator-jsonschema reads nested types from class-transformer's own storage, as its documentation shows.
const { defaultMetadataStorage } = createRequire(import.meta.url)('class-transformer/cjs/storage') as { defaultMetadataStorage: object };

export const schemaRef = (name: string) => `#/components/schemas/${name}`;

let cached: Record<string, Schema> | undefined;

/**
 * JSON Schema (2020-12, as OpenAPI 3.1 uses) of every DTO class, from the same class-validator decorators the server
 * validates with. A custom constraint contributes the fragment it carries (see DescribedConstraint); cross-field
 * rules contribute nothing. Unknown fields are refused, so every object says additionalProperties: false.
 */
export function requestSchemas(): Record<string, Schema> {
  if (cached) return cached;
  const schemas = validationMetadatasToSchemas({
    classTransformerMetadataStorage: defaultMetadataStorage as never,
    refPointerPrefix: '#/components/schemas/',
    additionalConverters: {
      // Without a fragment, a custom rule says nothing (the library would guess from TypeScript's emitted type).
      [ValidationTypes.CUSTOM_VALIDATION]: (meta) => ((meta.constraints as unknown[] | undefined)?.[0] as DescribedConstraint | undefined)?.jsonSchema ?? {},
    },
  }) as Record<string, Schema>;
  for (const schema of Object.values(schemas)) schema.additionalProperties = false;
  cached = schemas;
  return schemas;
}

/** The schema names a schema refers to, itself included, following $ref. */
export function reachableSchemas(roots: string[], all: Record<string, Schema>): Set<string> {
  const seen = new Set<string>();
  const visit = (v: unknown): void => {
    if (Array.isArray(v)) return v.forEach(visit);
    if (v === null || typeof v !== 'object') return;
    for (const [k, x] of Object.entries(v)) {
      if (k === '$ref' && typeof x === 'string') add(x.slice(x.lastIndexOf('/') + 1));
      else visit(x);
    }
  };
  const add = (name: string): void => {
    if (seen.has(name) || !all[name]) return;
    seen.add(name);
    visit(all[name]);
  };
  roots.forEach(add);
  return seen;
}

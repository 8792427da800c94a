import type { ValidationError } from 'class-validator';

/**
 * A custom constraint (ValidateBy) may describe its rule as a JSON Schema fragment in its first constraint, so the
 * API description states the rule the decorator checks; cross-field rules carry none.
 * @example ValidateBy({ name: 'ratio', constraints: [describedAs({ type: 'number', maximum: 10 })], validator })
 */
export interface DescribedConstraint {
  jsonSchema: Record<string, unknown>;
}

export const describedAs = (jsonSchema: Record<string, unknown>): DescribedConstraint => ({ jsonSchema });


/**
 * Maps class-validator errors to dotted field paths and the first message of each, e.g.
 * `{ "springs.0.rateNPerMm": "Spring rate must be more than 0 N/mm." }`. A field that is not allowed
 * (refused by `forbidNonWhitelisted`) gets a plain message instead of the library's wording.
 * @example flattenValidationErrors(await validate(dto, { whitelist: true, forbidNonWhitelisted: true }))
 */
export function flattenValidationErrors(errors: readonly ValidationError[]): Record<string, string> {
  const out: Record<string, string> = {};
  const walk = (list: readonly ValidationError[], prefix: string): void => {
    for (const e of list) {
      const path = prefix === '' ? e.property : `${prefix}.${e.property}`;
      const constraints = e.constraints ?? {};
      const first = Object.entries(constraints)[0];
      if (first !== undefined && !Object.hasOwn(out, path)) {
        const [type, message] = first;
        Object.defineProperty(out, path, {
          value: type === 'whitelistValidation' ? `“${e.property}” is not a field this request accepts.` : message,
          enumerable: true,
          writable: true,
          configurable: true,
        });
      }
      if (e.children !== undefined && e.children.length > 0) walk(e.children, path);
    }
  };
  walk(errors, '');
  return out;
}

// NUL, or a surrogate half without its partner.
const notStorable = /\u0000|[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;

/**
 * False for text PostgreSQL cannot store (a NUL character) or that is not Unicode (a lone surrogate half).
 * @example isStorableText('Fork cap') // true; isStorableText('a\u0000b') // false
 */
export function isStorableText(s: string): boolean {
  return !notStorable.test(s);
}

export const unstorableTextMessage = 'Contains a character that is not allowed in text.';

import type { ClassConstructor } from 'class-transformer';
import { isStorableText, unstorableTextMessage } from '../../shared/dto/validation';
import { AppError } from '../errors';
import { classValidatorParse } from './validation/class-validator-parse';
import { compiledParse, isCompilable, listsWhereObjectsBelong, type Parsed } from './validation/compiled-validator';

// Far deeper than any request DTO nests; class-transformer recurses per level and would overflow the stack.
const maxDepth = 32;

/**
 * Keys that name JavaScript's own object machinery (`__proto__`, `constructor`, `toString`, …, and `prototype`).
 * No request field is named so; left in, they swap prototypes or make class-transformer call a user object as a
 * class (`targetType is not a constructor`, a 500), or are dropped unseen. So they are refused wherever they appear.
 */
const machineryKeys: ReadonlySet<string> = new Set([...Object.getOwnPropertyNames(Object.prototype), 'prototype']);

export const isMachineryKey = (key: string): boolean => machineryKeys.has(key);

/**
 * Per-field problems no DTO constraint can report: nesting deep enough to overflow the transformer, keys that name
 * object machinery, and text PostgreSQL cannot store (NUL) or that is not Unicode (a lone surrogate, which also
 * throws inside isEmail). Walks with its own stack so a hostile body cannot overflow this check either.
 */
export function unreadableFields(root: unknown): Record<string, string> {
  const out: Record<string, string> = {};
  const stack: { value: unknown; path: string; depth: number }[] = [{ value: root, path: '', depth: 0 }];
  while (stack.length) {
    const { value, path, depth } = stack.pop()!;
    if (typeof value === 'string') {
      if (!isStorableText(value)) setField(out, path || 'body', unstorableTextMessage);
      continue;
    }
    if (value === null || typeof value !== 'object') continue;
    if (depth >= maxDepth) {
      // Reported on the top-level field: a path thirty levels long helps nobody find the problem.
      setField(out, path.split('.')[0] || 'body', 'Is nested too deeply.');
      continue;
    }
    for (const [k, v] of Object.entries(value)) {
      const at = path ? `${path}.${k}` : k;
      if (!Array.isArray(value) && isMachineryKey(k)) setField(out, at, notAFieldMessage(k));
      else stack.push({ value: v, path: at, depth: depth + 1 });
    }
  }
  return out;
}

const notAFieldMessage = (key: string) => `“${key}” is not a field this request accepts.`;

// Defined, not assigned, so a field named "__proto__" is reported rather than swapping the object's prototype.
const setField = (o: Record<string, string>, k: string, v: string) => Object.defineProperty(o, k, { value: v, enumerable: true, writable: true, configurable: true });

/** The same walk without building paths: the common, clean request pays a few microseconds, not a path per value. */
export function hasUnreadable(root: unknown): boolean {
  const values: unknown[] = [root];
  const depths: number[] = [0];
  while (values.length) {
    const value = values.pop();
    const depth = depths.pop()!;
    if (typeof value === 'string') {
      if (!isStorableText(value)) return true;
      continue;
    }
    if (value === null || typeof value !== 'object') continue;
    if (depth >= maxDepth) return true;
    if (Array.isArray(value)) {
      for (const v of value) {
        values.push(v);
        depths.push(depth + 1);
      }
      continue;
    }
    for (const k in value) {
      if (machineryKeys.has(k)) return true;
      values.push((value as Record<string, unknown>)[k]);
      depths.push(depth + 1);
    }
  }
  return false;
}

function refuseUnreadable(input: unknown, message: string): void {
  if (hasUnreadable(input)) throw AppError.validation(message, unreadableFields(input));
}

/**
 * A checked plain object as an instance of the DTO class, or its per-field messages: through the form compiled once
 * per class, or through class-transformer and class-validator for a class that form cannot mirror.
 */
export function toDto<T extends object>(cls: ClassConstructor<T>, input: Record<string, unknown>): Parsed<T> {
  if (!isCompilable(cls)) return classValidatorParse(cls as new () => T, input);
  const misplaced = listsWhereObjectsBelong(cls, input);
  if (Object.keys(misplaced).length) return { ok: false, fields: misplaced };
  return compiledParse(cls as new () => T, input);
}

/** Parses req.body into the DTO class and refuses it with per-field messages when it does not fit. */
export async function parseBody<T extends object>(cls: ClassConstructor<T>, body: unknown): Promise<T> {
  return bodyAs(cls, body);
}

/** parseBody without the promise, for the endpoint wrapper on the hot routes. */
export function bodyAs<T extends object>(cls: ClassConstructor<T>, body: unknown): T {
  if (body === null || typeof body !== 'object' || Array.isArray(body)) {
    throw AppError.validation('The request body must be a JSON object.', { body: 'must be a JSON object' });
  }
  refuseUnreadable(body, 'Some fields need attention.');
  const parsed = toDto(cls, body as Record<string, unknown>);
  if (!parsed.ok) throw AppError.validation('Some fields need attention.', parsed.fields);
  return parsed.value;
}

/** Parses a query string into the DTO class; repeated or unknown parameters are refused per field. */
export async function parseQuery<T extends object>(cls: ClassConstructor<T>, query: unknown): Promise<T> {
  return queryAs(cls, query);
}

/** parseQuery without the promise. */
export function queryAs<T extends object>(cls: ClassConstructor<T>, query: unknown): T {
  const q = (query ?? {}) as Record<string, unknown>;
  const repeated = Object.entries(q).filter(([, v]) => typeof v !== 'string');
  if (repeated.length) {
    throw AppError.validation('Some query parameters need attention.', Object.fromEntries(repeated.map(([k]) => [k, 'give this parameter once, as plain text'])));
  }
  refuseUnreadable(q, 'Some query parameters need attention.');
  const parsed = toDto(cls, q);
  if (!parsed.ok) throw AppError.validation('Some query parameters need attention.', parsed.fields);
  return parsed.value;
}

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** A route's id parameter; anything that is not a UUID cannot name a record, so it is a 404, not a database error. */
export function uuidParam(value: unknown, what: string): string {
  if (typeof value !== 'string' || !uuidPattern.test(value)) throw AppError.notFound(what);
  return value.toLowerCase();
}

import type { RequestHandler } from 'express';
import { plainToInstance, type ClassConstructor } from 'class-transformer';
import { validateSync, type ValidatorOptions } from 'class-validator';
import { flattenValidationErrors, isStorableText, unstorableTextMessage } from '../../shared/dto/validation';
import { AppError } from '../errors';
import { memoiseValidationMetadata } from './validation-metadata-cache';

memoiseValidationMetadata();

// No request DTO has an asynchronous constraint, so the synchronous validator skips a promise per request.
const options: ValidatorOptions = { whitelist: true, forbidNonWhitelisted: true, forbidUnknownValues: true };

// Far deeper than any request DTO nests; class-transformer recurses per level and would overflow the stack.
const maxDepth = 32;

/**
 * Per-field problems no DTO constraint can report: nesting deep enough to overflow the transformer, and text
 * PostgreSQL cannot store (NUL) or that is not Unicode (a lone surrogate, which also throws inside isEmail).
 * Walks with its own stack so a hostile body cannot overflow this check either.
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
    for (const [k, v] of Object.entries(value)) stack.push({ value: v, path: path ? `${path}.${k}` : k, depth: depth + 1 });
  }
  return out;
}

// Defined, not assigned, so a field named "__proto__" is reported rather than swapping the object's prototype.
const setField = (o: Record<string, string>, k: string, v: string) => Object.defineProperty(o, k, { value: v, enumerable: true, writable: true, configurable: true });

/** The same walk without building paths: the common, clean request pays a few microseconds, not a path per value. */
function hasUnreadable(root: unknown): boolean {
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
    for (const v of Array.isArray(value) ? value : Object.values(value)) {
      values.push(v);
      depths.push(depth + 1);
    }
  }
  return false;
}

function refuseUnreadable(input: unknown, message: string): void {
  if (hasUnreadable(input)) throw AppError.validation(message, unreadableFields(input));
}

/** Parses req.body into the DTO class and refuses it with per-field messages when it does not fit. */
export async function parseBody<T extends object>(cls: ClassConstructor<T>, body: unknown): Promise<T> {
  if (body === null || typeof body !== 'object' || Array.isArray(body)) {
    throw AppError.validation('The request body must be a JSON object.', { body: 'must be a JSON object' });
  }
  refuseUnreadable(body, 'Some fields need attention.');
  const dto = plainToInstance(cls, body);
  const errors = validateSync(dto, options);
  if (errors.length) {
    throw AppError.validation('Some fields need attention.', flattenValidationErrors(errors));
  }
  return dto;
}

export function body<T extends object>(cls: ClassConstructor<T>): RequestHandler {
  return async (req, _res, next) => {
    req.body = await parseBody(cls, req.body);
    next();
  };
}

/** Parses a query string into the DTO class; repeated or unknown parameters are refused per field. */
export async function parseQuery<T extends object>(cls: ClassConstructor<T>, query: unknown): Promise<T> {
  const q = (query ?? {}) as Record<string, unknown>;
  const repeated = Object.entries(q).filter(([, v]) => typeof v !== 'string');
  if (repeated.length) {
    throw AppError.validation('Some query parameters need attention.', Object.fromEntries(repeated.map(([k]) => [k, 'give this parameter once, as plain text'])));
  }
  refuseUnreadable(q, 'Some query parameters need attention.');
  const dto = plainToInstance(cls, q);
  const errors = validateSync(dto, options);
  if (errors.length) throw AppError.validation('Some query parameters need attention.', flattenValidationErrors(errors));
  return dto;
}

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** A route's id parameter; anything that is not a UUID cannot name a record, so it is a 404, not a database error. */
export function uuidParam(value: unknown, what: string): string {
  if (typeof value !== 'string' || !uuidPattern.test(value)) throw AppError.notFound(what);
  return value.toLowerCase();
}

import type { ValidationArguments } from 'class-validator';
import { join, planOf, toInstance, type Check, type Obj, type PropertyPlan, type ValidationMetadata } from './class-plan';
import { setField } from './fields';

export { isCompilable, listInListMessage, listsWhereObjectsBelong } from './class-plan';

/**
 * Runs the class-validator decorators of a DTO class without class-transformer and class-validator's general
 * executor, along the plan read once per class (class-plan.ts): the rules stay the decorators; each decorator's own
 * check runs and its own message is built, with class-validator's semantics (whitelist, forbidden unknown fields,
 * ValidateIf, IsDefined, each, nested lists), so the answers are the same; an agreement test holds it to that.
 */

export type Parsed<T> = { ok: true; value: T } | { ok: false; fields: Record<string, string> };

const unknownValueMessage = 'an unknown value was passed to the validate function';

/** class-validator's own token replacement ($value, $property, $target, $constraintN). */
function renderMessage(message: unknown, args: ValidationArguments): string {
  let text: string | undefined = typeof message === 'function' ? (message as (a: ValidationArguments) => string)(args) : typeof message === 'string' ? message : undefined;
  if (text && Array.isArray(args.constraints)) {
    args.constraints.forEach((c: unknown, i: number) => {
      text = text!.replace(new RegExp(`\\$constraint${i + 1}`, 'g'), Array.isArray(c) ? c.join(', ') : typeof c === 'symbol' ? String(c.description) : `${c}`);
    });
  }
  if (text && args.value !== undefined && args.value !== null && ['string', 'boolean', 'number'].includes(typeof args.value)) text = text.replace(/\$value/g, args.value as string);
  if (text) text = text.replace(/\$property/g, args.property);
  if (text) text = text.replace(/\$target/g, args.targetName);
  return text as string;
}

function argsOf(object: object, meta: ValidationMetadata, value: unknown): ValidationArguments {
  return { targetName: object.constructor ? object.constructor.name : (undefined as unknown as string), property: meta.propertyName, object, value, constraints: meta.constraints };
}

function messageOf(object: object, value: unknown, check: Check): string {
  const args = argsOf(object, check.meta, value);
  let message: unknown = check.meta.message || '';
  if (!check.meta.message && check.constraint.instance.defaultMessage instanceof Function) message = check.constraint.instance.defaultMessage(args);
  return renderMessage(message, args);
}

const isCollection = (v: unknown): v is unknown[] | Set<unknown> | Map<unknown, unknown> => Array.isArray(v) || v instanceof Set || v instanceof Map;

/** One property's failures: class-validator keeps the first constraint type to fail, with the last message given for it. */
class Failure {
  type: string | undefined;
  message = '';
  add(type: string, message: () => string): void {
    if (this.type === undefined) this.type = type;
    else if (this.type !== type) return;
    this.message = message();
  }
}

/**
 * Runs the checks in order. With `detail`, returns the property's failure (made only when one fails); without it,
 * stops at the first failure: the quick pass every request takes before any message or path is built.
 */
function runChecks(object: object, value: unknown, checks: Check[], failure: Failure | undefined, detail: boolean): Failure | undefined {
  const args = sharedArgs;
  args.targetName = object.constructor ? object.constructor.name : (undefined as unknown as string);
  args.object = object;
  args.value = value;
  for (let c = 0; c < checks.length; c++) {
    const check = checks[c]!;
    if (check.validateIf !== undefined && !check.validateIf(object, value)) continue;
    args.property = check.meta.propertyName;
    args.constraints = check.constraints as unknown[];
    let ok = true;
    if (!check.each || !isCollection(value)) {
      const r = check.validate(value, args);
      ok = !!r || isThenable(r);
    } else {
      for (const item of value instanceof Map ? value.values() : value) {
        const r = check.validate(item, args);
        if (!r && !isThenable(r)) ok = false;
      }
    }
    if (!ok) {
      failure ??= new Failure();
      if (!detail) return failure;
      failure.add(check.type, () => messageOf(object, value, check));
    }
  }
  return failure;
}

/** One arguments object for every check: each check reads it during its call only (messages get their own). */
const sharedArgs: ValidationArguments = { targetName: '', property: '', object: {}, value: undefined, constraints: [] };

const isThenable = (r: unknown): boolean => typeof r === 'object' && r !== null && typeof (r as { then?: unknown }).then === 'function';

/** Where failures go: `fields` gets each message by path; without it the walk only answers whether all is well. */
type Out = Record<string, string> | undefined;

function validateProperty(object: object, value: unknown, prop: PropertyPlan, prefix: string, out: Out): boolean {
  for (const condition of prop.conditions) if (!condition(object, value)) return true;
  const detail = out !== undefined;
  let failure = runChecks(object, value, prop.defined, undefined, detail);
  if (failure && !detail) return false;
  failure = runChecks(object, value, prop.custom, failure, detail);
  if (failure && !detail) return false;
  const path = detail ? join(prefix, prop.name) : '';
  if (failure !== undefined) setField(out!, path, failure.message);
  let ok = failure === undefined;
  if (prop.nested.length) {
    failure ??= new Failure();
    if (!validateNested(value, prop.nested, path, failure, out)) ok = false;
    if (failure.type !== undefined) {
      if (!detail) return false;
      setField(out!, path, failure.message);
      ok = false;
    }
  }
  return ok;
}

function validateNested(value: unknown, nested: ValidationMetadata[], path: string, failure: Failure, out: Out): boolean {
  if (value === undefined) return true;
  let ok = true;
  for (const meta of nested) {
    if (Array.isArray(value)) {
      for (let index = 0; index < value.length; index++) {
        const item: unknown = value[index];
        const itemFailure = new Failure();
        const itemPath = out ? join(path, String(index)) : '';
        if (!validateNested(item, nested, itemPath, itemFailure, out)) ok = false;
        if (itemFailure.type !== undefined) {
          ok = false;
          if (out) setField(out, itemPath, itemFailure.message);
        }
        if (!ok && !out) return false;
      }
    } else if (isCollection(value)) {
      let index = 0;
      for (const item of value instanceof Map ? value.values() : value) {
        // Each item is validated as a property named by its index, with the nested rules only.
        const itemFailure = new Failure();
        const itemPath = out ? join(path, String(index)) : '';
        index++;
        if (!validateNested(item, nested, itemPath, itemFailure, out)) ok = false;
        if (itemFailure.type !== undefined) {
          ok = false;
          if (out) setField(out, itemPath, itemFailure.message);
        }
        if (!ok && !out) return false;
      }
    } else if (value instanceof Object) {
      if (!validateObject(value, path, out)) ok = false;
    } else {
      // A value that is neither an object nor a list: the failure goes on the property itself (set by the caller).
      const target = meta.target as Function;
      failure.add(meta.type, () => (out ? renderMessage(meta.message || '', argsOf(target, meta, value)) : ''));
      ok = false;
    }
    if (!ok && !out) return false;
  }
  return ok;
}

function validateObject(object: object, prefix: string, out: Out): boolean {
  const plan = planOf(object.constructor);
  if (!plan.hasMetadata) {
    if (out) setField(out, join(prefix, 'undefined'), unknownValueMessage);
    return false;
  }
  let ok = true;
  for (const key in object) {
    // Own keys only, as Object.keys gives class-validator (an instance inherits no enumerable ones).
    if (plan.known.has(key) || !Object.hasOwn(object, key)) continue;
    if (!out) return false;
    setField(out, join(prefix, key), `“${key}” is not a field this request accepts.`);
    ok = false;
  }
  const props = plan.props;
  for (let i = 0; i < props.length; i++) {
    const prop = props[i]!;
    if (!validateProperty(object, (object as Obj)[prop.name], prop, prefix, out)) {
      if (!out) return false;
      ok = false;
    }
  }
  return ok;
}

/** The instance class-transformer would build (the first half of compiledParse; the benchmark times it alone). */
export const compiledTransform = <T extends object>(cls: new () => T, input: Obj): T => toInstance(planOf(cls), input) as T;

/** Whether the instance passes every rule, stopping at the first failure (the second half's quick pass). */
export const compiledIsValid = (dto: object): boolean => validateObject(dto, '', undefined);

/**
 * A plain JSON object (already free of object-machinery keys) as an instance of `cls`, or the per-field messages
 * class-validator would give, flattened to dotted paths.
 */
export function compiledParse<T extends object>(cls: new () => T, input: Obj): Parsed<T> {
  const dto = compiledTransform(cls, input);
  if (compiledIsValid(dto)) return { ok: true, value: dto as T };
  // Something failed: walk again, this time naming each failing field as class-validator would.
  const fields: Record<string, string> = {};
  validateObject(dto, '', fields);
  return { ok: false, fields };
}

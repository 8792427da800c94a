import { createRequire } from 'node:module';
import { getMetadataStorage, ValidationTypes, type ValidationArguments } from 'class-validator';
import { TransformationType } from 'class-transformer';
import type { MetadataStorage as TransformerStorage } from 'class-transformer/types/MetadataStorage';
import { setField } from './fields';

/**
 * Runs the class-validator decorators of a DTO class without class-transformer and class-validator's general
 * executor: each class is read once into a plan (its properties, their conditions, constraints and nested types)
 * and every request walks that plan. The rules stay the decorators; the plan calls each decorator's own check and
 * builds its own message, with class-validator's semantics (whitelist, forbidden unknown fields, ValidateIf,
 * IsDefined, each, nested lists), so the answers are the same; an agreement test holds it to that.
 */

type Obj = Record<string, unknown>;
type Ctor = new () => object;
type ValidationMetadata = ReturnType<ReturnType<typeof getMetadataStorage>['getTargetValidationMetadatas']>[number];
type ConstraintMetadata = ReturnType<ReturnType<typeof getMetadataStorage>['getTargetValidatorConstraints']>[number];

// class-transformer keeps its @Type metadata in a module of its own; class-validator-jsonschema reads it the same way.
const { defaultMetadataStorage: transformerStorage } = createRequire(import.meta.url)('class-transformer/cjs/storage') as {
  defaultMetadataStorage: TransformerStorage;
};

interface Check {
  meta: ValidationMetadata;
  constraint: ConstraintMetadata;
  /** The constraint's name as class-validator reports it (e.g. "isString"). */
  type: string;
  // Copied from meta and constraint once, so the per-request loop reads one small object of one shape.
  validate: (value: unknown, args: ValidationArguments) => unknown;
  each: boolean;
  validateIf: ((object: object, value: unknown) => boolean) | undefined;
  constraints: unknown[] | undefined;
}

interface PropertyPlan {
  name: string;
  conditions: ((object: object, value: unknown) => boolean)[];
  defined: Check[];
  custom: Check[];
  nested: ValidationMetadata[];
}

interface ClassPlan {
  cls: Ctor;
  hasMetadata: boolean;
  /** Properties that carry any decorator: every other key is refused. */
  known: Set<string>;
  props: PropertyPlan[];
  /** Keys class-transformer never copies onto an instance (methods, read-only accessors, object machinery). */
  skip: Set<string>;
  /** @Type conversions by property. */
  convert: Map<string, (value: unknown) => unknown>;
  /** Properties whose @Type is a class: where objects of that class belong. */
  nestedClass: Map<string, Function>;
}

export type Parsed<T> = { ok: true; value: T } | { ok: false; fields: Record<string, string> };

/** Thrown at compile time for a class this runner cannot mirror exactly (then class-validator itself runs). */
class NotCompilable extends Error {}

const storage = getMetadataStorage();
const plans = new Map<Function, ClassPlan>();

function planOf(cls: Function): ClassPlan {
  let plan = plans.get(cls);
  if (!plan) {
    plan = { cls: cls as Ctor, hasMetadata: false, known: new Set(), props: [], skip: new Set(), convert: new Map(), nestedClass: new Map() };
    // Registered before it is filled, so a class that nests itself finds its own plan.
    plans.set(cls, plan);
    try {
      fillPlan(plan);
    } catch (e) {
      plans.delete(cls);
      throw e;
    }
  }
  return plan;
}

function fillPlan(plan: ClassPlan): void {
  const cls = plan.cls;
  const metas = storage.getTargetValidationMetadatas(cls, '', false, false, undefined);
  const grouped = storage.groupByPropertyName(metas);
  plan.hasMetadata = metas.length > 0;
  if (cls !== Object && cls.prototype !== undefined) {
    if (transformerStorage.getExposedMetadatas(cls).length || transformerStorage.getExcludedMetadatas(cls).length) {
      throw new NotCompilable(`${cls.name} uses @Expose/@Exclude`);
    }
  }
  for (const [name, list] of Object.entries(grouped)) {
    if (list.length === 0) continue;
    plan.known.add(name);
    const prop: PropertyPlan = { name, conditions: [], defined: [], custom: [], nested: [] };
    for (const meta of list) {
      if (meta.type === ValidationTypes.CONDITIONAL_VALIDATION) prop.conditions.push(meta.constraints[0] as PropertyPlan['conditions'][number]);
      else if (meta.type === ValidationTypes.NESTED_VALIDATION || meta.type === ValidationTypes.PROMISE_VALIDATION) prop.nested.push(meta);
      else if (meta.type === ValidationTypes.WHITELIST) continue;
      else {
        // As validateSync: asynchronous constraints are not run.
        const checks = storage
          .getTargetValidatorConstraints(meta.constraintCls)
          .filter((c) => !c.async)
          .map((constraint): Check => ({
            meta,
            constraint,
            type: constraint.name || meta.type,
            validate: constraint.instance.validate.bind(constraint.instance) as Check['validate'],
            each: meta.each === true,
            validateIf: meta.validateIf,
            constraints: meta.constraints,
          }));
        (meta.type === ValidationTypes.IS_DEFINED ? prop.defined : prop.custom).push(...checks);
      }
    }
    plan.props.push(prop);
    if (transformerStorage.findTransformMetadatas(cls, name, TransformationType.PLAIN_TO_CLASS).length) throw new NotCompilable(`${cls.name}.${name} uses @Transform`);
    const typeMeta = transformerStorage.findTypeMetadata(cls, name);
    if (typeMeta) {
      if (typeMeta.options?.discriminator) throw new NotCompilable(`${cls.name}.${name} uses a discriminator`);
      const type = typeMeta.typeFunction({ newObject: {}, object: {}, property: name }) as Function;
      plan.convert.set(name, converterFor(type));
      if (![Number, String, Boolean, Date].includes(type as never)) {
        plan.nestedClass.set(name, type);
        // Planned now, so a nested class the runner cannot mirror sends the whole DTO the libraries' way.
        planOf(type);
      }
    }
  }
  plan.skip = skippedKeys(cls);
}

/** What class-transformer leaves out of an instance: what its prototype holds without a setter, anything that reads as a function, and object machinery. */
function skippedKeys(cls: Function): Set<string> {
  const skip = new Set(['__proto__', 'constructor']);
  if (!cls.prototype) return skip;
  for (const k of Object.getOwnPropertyNames(cls.prototype)) if (!Object.getOwnPropertyDescriptor(cls.prototype, k)!.set) skip.add(k);
  const probe = new (cls as Ctor)() as Obj;
  for (let o: object | null = probe; o; o = Object.getPrototypeOf(o)) {
    for (const k of Object.getOwnPropertyNames(o)) if (k !== '__proto__' && (probe[k] as unknown) instanceof Function) skip.add(k);
  }
  return skip;
}

/** The value class-transformer gives a property declared with @Type(() => type). */
function converterFor(type: Function): (value: unknown) => unknown {
  const primitive = type === Number ? Number : type === String ? String : type === Boolean ? Boolean : type === Date ? (v: unknown) => new Date(v as string) : undefined;
  if (primitive) {
    const convert = (v: unknown): unknown => (Array.isArray(v) ? v.map(convert) : v === null || v === undefined ? v : primitive(v));
    return convert;
  }
  const convert = (v: unknown): unknown => (Array.isArray(v) ? v.map(convert) : typeof v === 'object' && v !== null ? toInstance(planOf(type), v as Obj) : v);
  return convert;
}

function toInstance(plan: ClassPlan, source: Obj): object {
  const out = new plan.cls() as Obj;
  for (const key of Object.keys(source)) {
    if (plan.skip.has(key)) continue;
    const convert = plan.convert.get(key);
    const value = convert ? convert(source[key]) : source[key];
    if (value !== undefined) out[key] = value;
  }
  return out;
}

// ---------- validation ----------

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

const join = (prefix: string, key: string): string => (prefix ? `${prefix}.${key}` : key);

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

export const listInListMessage = 'Must be an object, not a list.';

/**
 * Where a DTO expects objects of a nested class, a list inside the list: class-validator descends into it and
 * finds nothing wrong (an empty one passes whole), so the use case would get a list for an object. Refused by
 * path, before either validator runs.
 */
export function listsWhereObjectsBelong(cls: Function, input: Obj): Record<string, string> {
  const out: Record<string, string> = {};
  const walk = (plan: ClassPlan, o: Obj, prefix: string): void => {
    for (const [key, nested] of plan.nestedClass) {
      const v = o[key];
      if (v === null || typeof v !== 'object') continue;
      const at = join(prefix, key);
      if (!Array.isArray(v)) {
        walk(planOf(nested), v as Obj, at);
        continue;
      }
      v.forEach((item, i) => {
        if (Array.isArray(item)) setField(out, `${at}.${i}`, listInListMessage);
        else if (item !== null && typeof item === 'object') walk(planOf(nested), item as Obj, `${at}.${i}`);
      });
    }
  };
  walk(planOf(cls), input, '');
  return out;
}

const compilable = new Map<Function, boolean>();

/** False when the class uses a class-transformer feature the compiled runner does not mirror. */
export function isCompilable(cls: Function): boolean {
  let ok = compilable.get(cls);
  if (ok === undefined) {
    try {
      planOf(cls);
      ok = true;
    } catch (e) {
      if (!(e instanceof NotCompilable)) throw e;
      ok = false;
    }
    compilable.set(cls, ok);
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

import { createRequire } from 'node:module';
import { getMetadataStorage, ValidationTypes, type ValidationArguments } from 'class-validator';
import { TransformationType } from 'class-transformer';
import type { MetadataStorage as TransformerStorage } from 'class-transformer/types/MetadataStorage';
import { setField } from './fields';

/**
 * What a DTO class's decorators say, read once per class into a plan: its properties with their conditions,
 * constraints and nested types, the keys class-transformer would copy, and its @Type conversions. The compiled
 * runner (compiled-validator.ts) walks these plans per request.
 */

export type Obj = Record<string, unknown>;
type Ctor = new () => object;
export type ValidationMetadata = ReturnType<ReturnType<typeof getMetadataStorage>['getTargetValidationMetadatas']>[number];
type ConstraintMetadata = ReturnType<ReturnType<typeof getMetadataStorage>['getTargetValidatorConstraints']>[number];

// class-transformer keeps its @Type metadata in a module of its own; class-validator-jsonschema reads it the same way.
const { defaultMetadataStorage: transformerStorage } = createRequire(import.meta.url)('class-transformer/cjs/storage') as {
  defaultMetadataStorage: TransformerStorage;
};

export interface Check {
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

export interface PropertyPlan {
  name: string;
  conditions: ((object: object, value: unknown) => boolean)[];
  defined: Check[];
  custom: Check[];
  nested: ValidationMetadata[];
}

export interface ClassPlan {
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

/** Thrown at compile time for a class this runner cannot mirror exactly (then class-validator itself runs). */
class NotCompilable extends Error {}

const storage = getMetadataStorage();
const plans = new Map<Function, ClassPlan>();

export function planOf(cls: Function): ClassPlan {
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

export function toInstance(plan: ClassPlan, source: Obj): object {
  const out = new plan.cls() as Obj;
  for (const key of Object.keys(source)) {
    if (plan.skip.has(key)) continue;
    const convert = plan.convert.get(key);
    const value = convert ? convert(source[key]) : source[key];
    if (value !== undefined) out[key] = value;
  }
  return out;
}

export const join = (prefix: string, key: string): string => (prefix ? `${prefix}.${key}` : key);

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

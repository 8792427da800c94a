import 'reflect-metadata';
import { getMetadataStorage, IsInt, IsString, MetadataStorage, Min, registerDecorator, validateSync } from 'class-validator';
import { describe, expect, it } from 'vitest';
import * as catalogue from '../../shared/catalogue';
import * as auth from '../../shared/dto/auth.dto';
import * as calculations from '../../shared/dto/calculations.dto';
import { memoiseValidationMetadata } from './validation-metadata-cache';

/** Every DTO class the API validates, taken from the modules' exports. */
const dtoClasses = [catalogue, auth, calculations]
  .flatMap((m) => Object.values(m))
  .filter((v): v is new () => object => typeof v === 'function' && /Dto$/.test(v.name));

const lookupArgs = (target: new () => object) => [target, undefined as unknown as string, false, false, undefined] as const;

describe('memoised class-validator metadata', () => {
  it('gives, for every request DTO, the same metadata as the library computes', () => {
    const storage = getMetadataStorage();
    memoiseValidationMetadata(storage);
    const plain = MetadataStorage.prototype.getTargetValidationMetadatas;
    expect(dtoClasses.length).toBeGreaterThan(20);
    for (const cls of dtoClasses) {
      const memoised = storage.getTargetValidationMetadatas(...lookupArgs(cls));
      expect(memoised, cls.name).toEqual(plain.call(storage, ...lookupArgs(cls)));
      expect(storage.getTargetValidationMetadatas(...lookupArgs(cls))).toBe(memoised);
      expect(Object.isFrozen(memoised)).toBe(true);
    }
  });

  it('sees a constraint added after a lookup, and an inherited one', () => {
    const storage = new MetadataStorage();
    memoiseValidationMetadata(storage);
    // Registered on a private storage by hand, the way the decorators register on the global one.
    class Base {
      name = '';
    }
    class Child extends Base {
      count = 0;
    }
    const add = (target: object, property: string, type: string) =>
      storage.addValidationMetadata({ target, propertyName: property, type, constraints: [], validationTypeOptions: {}, each: false, always: undefined, groups: [] } as never);
    add(Base, 'name', 'isString');
    expect(storage.getTargetValidationMetadatas(...lookupArgs(Child)).map((m) => m.propertyName)).toEqual(['name']);
    add(Child, 'count', 'isInt');
    expect(storage.getTargetValidationMetadatas(...lookupArgs(Child)).map((m) => m.propertyName).sort()).toEqual(['count', 'name']);
  });

  it('still refuses what the decorators forbid, with the same messages', () => {
    memoiseValidationMetadata();
    class Sample {
      @IsString() label!: string;
      @IsInt() @Min(1) count!: number;
    }
    const bad = Object.assign(new Sample(), { label: 3, count: 0 });
    const errors = validateSync(bad, { whitelist: true, forbidNonWhitelisted: true });
    expect(Object.fromEntries(errors.map((e) => [e.property, Object.keys(e.constraints ?? {})]))).toEqual({ label: ['isString'], count: ['min'] });
    expect(validateSync(Object.assign(new Sample(), { label: 'a', count: 2 }))).toEqual([]);
  });

  it('finds no asynchronous constraint on a request DTO, which the synchronous validator would skip', () => {
    const storage = getMetadataStorage();
    const asyncOnes = dtoClasses.flatMap((cls) =>
      storage
        .getTargetValidationMetadatas(...lookupArgs(cls))
        .filter((m) => m.constraintCls && storage.getTargetValidatorConstraints(m.constraintCls).some((c) => c.async))
        .map((m) => `${cls.name}.${m.propertyName}`),
    );
    expect(asyncOnes).toEqual([]);
    // The check itself can see an asynchronous constraint.
    class WithAsync {
      value!: string;
    }
    registerDecorator({ name: 'later', target: WithAsync, propertyName: 'value', async: true, validator: { validate: async () => true } });
    const found = storage.getTargetValidationMetadatas(...lookupArgs(WithAsync));
    expect(found.some((m) => m.constraintCls && storage.getTargetValidatorConstraints(m.constraintCls).some((c) => c.async))).toBe(true);
  });
});

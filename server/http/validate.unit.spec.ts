import 'reflect-metadata';
import { plainToInstance } from 'class-transformer';
import { describe, expect, it } from 'vitest';
import { AdapterNeedsDto, ProductListQueryDto } from '../../shared/catalogue';
import { RearSpringRequestDto } from '../../shared/dto/calculations.dto';
import { rearSpringExample } from '../../shared/engine/examples';
import { AppError } from '../errors';
import { listInListMessage } from './validation/compiled-validator';
import { parseBody, parseQuery } from './validate';

const prototypeNames = () => Object.getOwnPropertyNames(Object.prototype).sort();
const pristine = prototypeNames();

async function fieldsOf(p: Promise<unknown>): Promise<Record<string, string>> {
  const e = await p.then(() => undefined, (x: unknown) => x);
  expect(e).toBeInstanceOf(AppError);
  expect((e as AppError).kind).toBe('validation');
  return (e as AppError).fields ?? {};
}

// JSON.parse makes "__proto__" an own key, as express.json does with a request body.
const json = (text: string) => JSON.parse(text) as Record<string, unknown>;

describe('bodies become DTOs in one place, and keys naming object machinery are refused there', () => {
  it('a constructor key where a number belongs is a field message, where class-transformer alone throws', async () => {
    const text = JSON.stringify({ ...rearSpringExample(), wheelbaseMm: { constructor: { prototype: { x: 1 } } } });
    expect(() => plainToInstance(RearSpringRequestDto, json(text))).toThrow(/not a constructor/);
    expect(await fieldsOf(parseBody(RearSpringRequestDto, json(text)))).toEqual({ 'wheelbaseMm.constructor': '“constructor” is not a field this request accepts.' });
    expect(prototypeNames()).toEqual(pristine);
  });

  it('__proto__, prototype and inherited method names are refused at any depth and Object.prototype stays as it was', async () => {
    const text = `{"targets":{"__proto__":{"polluted":"yes"}},"springs":[{"toString":1}],"prototype":{"x":1},"loads":[{"valueOf":{"__proto__":{"polluted":1}}}]}`;
    const fields = await fieldsOf(parseBody(RearSpringRequestDto, json(text)));
    expect(Object.keys(fields).sort()).toEqual(['loads.0.valueOf', 'prototype', 'springs.0.toString', 'targets.__proto__']);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect(prototypeNames()).toEqual(pristine);
  });

  it('a query parameter named like object machinery is refused by name', async () => {
    const q = Object.assign(Object.create(null) as object, { constructor: 'x', page: '1' });
    expect(await fieldsOf(parseQuery(ProductListQueryDto, q))).toEqual({ constructor: '“constructor” is not a field this request accepts.' });
  });

  it('a list inside a list where nested objects belong is refused by path (class-validator lets an empty one through)', async () => {
    expect(await fieldsOf(parseBody(AdapterNeedsDto, { adapters: [[]] }))).toEqual({ 'adapters.0': listInListMessage });
  });

  it('a valid body becomes an instance of its DTO class, nested objects included', async () => {
    const dto = await parseBody(RearSpringRequestDto, json(JSON.stringify(rearSpringExample())));
    expect(dto).toBeInstanceOf(RearSpringRequestDto);
    expect(dto.targets.constructor.name).toBe('SagTargetsDto');
    expect(dto.loads?.[0]?.constructor.name).toBe('LoadDto');
  });
});

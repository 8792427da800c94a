// Tests for shared/dto/calculations.dto.ts and shared/dto/validation.ts (kept here with the engine they feed).
import { describe, expect, it } from 'vitest';
import { plainToInstance, type ClassConstructor } from 'class-transformer';
import { validate } from 'class-validator';
import {
  ForkSpringRequestDto,
  LoadDto,
  RearSpringRequestDto,
  SagCheckRequestDto,
  SpringGeometryRequestDto,
  leverageRatioProblem,
} from '../dto/calculations.dto';
import { flattenValidationErrors } from './validation';
import { forkSpringExample, rearSpringExample } from '../engine/examples';
import { checkSag, computeForkSpring, computeRearSpring, computeSpringGeometry, isCasesResult } from '../engine/index';

/** Validates the way the server does, returning dotted path → first message. */
async function check<T extends object>(cls: ClassConstructor<T>, body: unknown): Promise<Record<string, string>> {
  const dto = plainToInstance(cls, body);
  const errors = await validate(dto as object, { whitelist: true, forbidNonWhitelisted: true, forbidUnknownValues: true });
  return flattenValidationErrors(errors);
}

const rearBody = () => ({ ...rearSpringExample(), leverageRatio: 2.1 as unknown, springs: rearSpringExample().springs as unknown[] });
const forkBody = forkSpringExample;

describe('rear-spring request', () => {
  it('accepts the issue’s example and hands the engine a ready input', async () => {
    expect(await check(RearSpringRequestDto, rearBody())).toEqual({});
    const dto = plainToInstance(RearSpringRequestDto, rearBody());
    expect(dto.loads?.[0]).toBeInstanceOf(LoadDto);
    const result = computeRearSpring(dto);
    expect(isCasesResult(result)).toBe(false);
  });

  it('accepts a leverage curve in place of a single ratio', async () => {
    const body = { ...rearBody(), leverageRatio: [{ wheelTravelMm: 0, ratio: 2.5 }, { wheelTravelMm: 200, ratio: 1.9 }] };
    expect(await check(RearSpringRequestDto, body)).toEqual({});
  });

  it('reports every missing field by name', async () => {
    const errors = await check(RearSpringRequestDto, {});
    expect(errors.wheelbaseMm).toBe('Wheelbase is required.');
    expect(errors.loads).toBe('Give the loads (rider, passenger, luggage) or a list of load cases.');
    expect(errors.leverageRatio).toBe('Leverage ratio is required.');
    expect(errors.targets).toBe('Sag targets are required.');
    expect(Object.keys(errors)).toEqual(
      expect.arrayContaining(['sprungMassKg', 'wheelTravelMm', 'shockStrokeMm', 'preloadRangeMm', 'adjusterPitchMm']),
    );
    expect(errors).not.toHaveProperty('cases');
  });

  it('refuses strings, NaN and Infinity where numbers belong', async () => {
    const errors = await check(RearSpringRequestDto, { ...rearBody(), wheelbaseMm: '1500', sprungMassKg: NaN, shockStrokeMm: Infinity });
    expect(errors.wheelbaseMm).toBe('Wheelbase must be a number.');
    expect(errors.sprungMassKg).toBe('Sprung mass must be a number.');
    expect(errors.shockStrokeMm).toBe('Shock stroke must be a number.');
  });

  it('refuses zero or negative masses and lengths, with the path of the nested field', async () => {
    const body = { ...rearBody(), loads: [{ massKg: 0, positionMm: 900 }], springs: [{ id: 'R', rateNPerMm: -5, freeLengthMm: 229 }] };
    const errors = await check(RearSpringRequestDto, body);
    expect(errors['loads.0.massKg']).toBe('Mass must be more than 0 kg.');
    expect(errors['springs.0.rateNPerMm']).toBe('Spring rate must be more than 0 N/mm.');
  });

  it('refuses a static-sag target that is not below the rider-sag target', async () => {
    const errors = await check(RearSpringRequestDto, { ...rearBody(), targets: { staticSagMm: 66, riderSagMm: 66 } });
    expect(errors['targets.riderSagMm']).toBe('Rider sag target must be more than the static sag target.');
  });

  it('refuses a rider-sag target beyond the wheel travel and a preload range upside down', async () => {
    const errors = await check(RearSpringRequestDto, { ...rearBody(), wheelTravelMm: 60, preloadRangeMm: { min: 10, max: 5 } });
    expect(errors.wheelTravelMm).toBe('Wheel travel must be more than the rider sag target.');
    expect(errors['preloadRangeMm.max']).toBe('Maximum preload must not be less than the minimum preload.');
  });

  it('refuses an empty curve, unsorted or duplicate wheel travel, a zero ratio and unknown point fields', async () => {
    const curve = (leverageRatio: unknown) => check(RearSpringRequestDto, { ...rearBody(), leverageRatio });
    expect((await curve([])).leverageRatio).toBe('The leverage curve needs at least one point.');
    expect((await curve([{ wheelTravelMm: 100, ratio: 2 }, { wheelTravelMm: 50, ratio: 2 }])).leverageRatio).toBe(
      'Point 2 of the leverage curve: wheel travel must be greater than at point 1.',
    );
    expect((await curve([{ wheelTravelMm: 0, ratio: 2 }, { wheelTravelMm: 0, ratio: 2.1 }])).leverageRatio).toMatch(/Point 2/);
    expect((await curve([{ wheelTravelMm: 0, ratio: 0 }])).leverageRatio).toBe('Point 1 of the leverage curve: ratio must be more than 0 and at most 10.');
    expect((await curve([{ wheelTravelMm: 0, ratio: 2, note: 'x' }])).leverageRatio).toMatch(/exactly wheelTravelMm and ratio/);
    expect((await curve(-1)).leverageRatio).toBe('Leverage ratio must be more than 0 and at most 10.');
    expect((await curve('2.1')).leverageRatio).toMatch(/a number or a list of points/);
    expect(leverageRatioProblem([{ wheelTravelMm: 0, ratio: 2.5 }])).toBeUndefined();
  });

  it('refuses more than 50 springs and more than 20 loads', async () => {
    const springs = Array.from({ length: 51 }, (_, i) => ({ id: `S${i}`, rateNPerMm: 50, freeLengthMm: 229 }));
    const loads = Array.from({ length: 21 }, () => ({ massKg: 1, positionMm: 900 }));
    const errors = await check(RearSpringRequestDto, { ...rearBody(), springs, loads });
    expect(errors.springs).toBe('Give at most 50 springs.');
    expect(errors.loads).toBe('Give at most 20 loads.');
  });

  it('refuses duplicate spring ids and a solid length not below the free length', async () => {
    const springs = [
      { id: 'A', rateNPerMm: 50, freeLengthMm: 229 },
      { id: 'A', rateNPerMm: 60, freeLengthMm: 229, solidLengthMm: 229 },
    ];
    const errors = await check(RearSpringRequestDto, { ...rearBody(), springs });
    expect(errors.springs).toBe('Each spring needs a different id.');
    expect(errors['springs.1.solidLengthMm']).toBe('Solid length must be less than the free length.');
  });

  it('refuses unknown fields at the top and inside nested objects', async () => {
    const body = { ...rearBody(), colour: 'red', springs: [{ id: 'R', rateNPerMm: 58, freeLengthMm: 229, brand: 'x' }] };
    const errors = await check(RearSpringRequestDto, body);
    expect(errors.colour).toMatch(/not a field this request accepts/);
    expect(errors['springs.0.brand']).toMatch(/not a field this request accepts/);
  });

  it('takes either loads or load cases, not both', async () => {
    const cases = [{ name: 'solo', loads: [{ massKg: 80, positionMm: 900 }] }];
    expect((await check(RearSpringRequestDto, { ...rearBody(), cases })).loads).toBe('Give either loads or load cases, not both.');
    const { loads: _l, ...noLoads } = rearBody();
    expect(await check(RearSpringRequestDto, { ...noLoads, cases })).toEqual({});
    const dup = [...cases, { name: 'solo', loads: [{ massKg: 90, positionMm: 900 }] }];
    expect((await check(RearSpringRequestDto, { ...noLoads, cases: dup })).cases).toBe('Each load case needs a different name.');
    expect((await check(RearSpringRequestDto, { ...noLoads, cases: [{ name: 'empty', loads: [] }] }))['cases.0.loads']).toBe(
      'Give at least 1 load.',
    );
    const dto = plainToInstance(RearSpringRequestDto, { ...noLoads, cases });
    expect(isCasesResult(computeRearSpring(dto))).toBe(true);
  });

  it('says plainly when a list item is not an object', async () => {
    const errors = await check(RearSpringRequestDto, { ...rearBody(), springs: [42] });
    expect(errors['springs.0']).toBe('Each spring must be an object.');
  });
});

describe('fork-spring request', () => {
  it('accepts a fork without adjuster pitch or spring count and feeds the engine', async () => {
    expect(await check(ForkSpringRequestDto, forkBody())).toEqual({});
    expect(isCasesResult(computeForkSpring(plainToInstance(ForkSpringRequestDto, forkBody())))).toBe(false);
  });

  it('refuses a fractional spring count, a steep fork angle and fork travel below the rider-sag target', async () => {
    const errors = await check(ForkSpringRequestDto, { ...forkBody(), springCount: 1.5, forkAngleDeg: 75, forkTravelMm: 30 });
    expect(errors.springCount).toBe('Spring count must be a whole number.');
    expect(errors.forkAngleDeg).toBe('Fork angle must be at most 60 degrees.');
    expect(errors.forkTravelMm).toBe('Fork travel must be more than the rider sag target.');
  });
});

describe('spring-geometry request', () => {
  const body = { wireDiameterMm: 2.5, outsideDiameterMm: 31, totalCoils: 14, endType: 'plain-ground', material: 'music-wire' };

  it('accepts a material or a shear modulus and feeds the engine', async () => {
    expect(await check(SpringGeometryRequestDto, body)).toEqual({});
    const { material: _m, ...noMaterial } = body;
    expect(await check(SpringGeometryRequestDto, { ...noMaterial, shearModulusMPa: 79_000, freeLengthMm: 100, loadN: 50 })).toEqual({});
    expect(computeSpringGeometry(plainToInstance(SpringGeometryRequestDto, body)).activeCoils).toBe(13);
  });

  it('refuses an unknown material, both material and modulus, and neither', async () => {
    expect((await check(SpringGeometryRequestDto, { ...body, material: 'cheese' })).material).toMatch(/^Material must be one of: music-wire/);
    expect((await check(SpringGeometryRequestDto, { ...body, shearModulusMPa: 80_000 })).material).toBe(
      'Give either a material or a shear modulus, not both.',
    );
    const { material: _m, ...neither } = body;
    expect((await check(SpringGeometryRequestDto, neither)).material).toBe('Give a material or a shear modulus.');
  });

  it('refuses an unknown end type, too few coils, an outside diameter under two wires and a free length below solid', async () => {
    const errors = await check(SpringGeometryRequestDto, { ...body, endType: 'squared', totalCoils: 2, outsideDiameterMm: 5, freeLengthMm: 5 });
    expect(errors.totalCoils).toMatch(/active coils/);
    expect(errors.outsideDiameterMm).toBe('Outside diameter must be more than twice the wire diameter.');
    expect(errors.freeLengthMm).toBe('Free length must be more than the solid length (7.5 mm).');
    expect((await check(SpringGeometryRequestDto, { ...body, endType: 'pigtail' })).endType).toMatch(/^End type must be one of/);
  });
});

describe('sag-check request', () => {
  const rear = {
    end: 'rear',
    extendedMm: 600,
    staticMm: 575,
    riderMm: { down: 526, up: 532 },
    targets: { staticSagMm: 25, riderSagMm: 66 },
    leverageRatio: 2,
    adjusterPitchMm: 1,
  };

  it('accepts a rear check with a reading pair and feeds the engine', async () => {
    expect(await check(SagCheckRequestDto, rear)).toEqual({});
    expect(checkSag(plainToInstance(SagCheckRequestDto, rear)).riderSagMm).toBe(71);
  });

  it('needs the leverage ratio and adjuster pitch at the rear, and refuses them where they do not apply', async () => {
    const { leverageRatio: _lr, adjusterPitchMm: _p, ...bare } = rear;
    const errors = await check(SagCheckRequestDto, bare);
    expect(errors.leverageRatio).toBe('Leverage ratio is required for the rear.');
    expect(errors.adjusterPitchMm).toBe('Adjuster pitch is required.');
    const front = await check(SagCheckRequestDto, { ...rear, end: 'front', forkAngleDeg: 25 });
    expect(front.leverageRatio).toBe('Leverage ratio applies to the rear only.');
    expect((await check(SagCheckRequestDto, { ...rear, end: 'front' })).forkAngleDeg).toBe('Fork angle is required.');
  });

  it('refuses a half reading pair and readings that go the wrong way', async () => {
    expect((await check(SagCheckRequestDto, { ...rear, riderMm: { down: 526 } })).riderMm).toBe(
      'The reading with the rider aboard must be a number, or a pair with down and up.',
    );
    expect((await check(SagCheckRequestDto, { ...rear, riderMm: 580 })).riderMm).toBe(
      'The reading with the rider aboard must not be longer than the reading on the bike’s own weight.',
    );
    expect((await check(SagCheckRequestDto, { ...rear, staticMm: 610 })).staticMm).toMatch(/not be longer than the fully extended/);
    expect((await check(SagCheckRequestDto, { ...rear, end: 'middle' })).end).toBe('End must be "rear" or "front".');
  });
});

describe('flattenValidationErrors', () => {
  it('maps nested errors to dotted paths with the first message only', () => {
    const flat = flattenValidationErrors([
      {
        property: 'springs',
        children: [{ property: '0', children: [{ property: 'rateNPerMm', constraints: { a: 'first', b: 'second' }, children: [] }] }],
      },
      { property: '__proto__', constraints: { whitelistValidation: 'property __proto__ should not exist' } },
    ]);
    expect(flat['springs.0.rateNPerMm']).toBe('first');
    expect(Object.keys(flat)).toEqual(['springs.0.rateNPerMm', '__proto__']);
    expect(Object.getPrototypeOf(flat)).toBe(Object.prototype);
  });
});

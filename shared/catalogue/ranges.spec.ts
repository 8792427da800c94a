import 'reflect-metadata';
import { getMetadataStorage } from 'class-validator';
import { describe, expect, it } from 'vitest';
import { LeveragePointInputDto, LoadStationInputDto, SagPairInputDto, TorqueInputDto, FitmentInputDto } from './fitment.dto';
import { SpringDetailsInputDto } from './product.dto';
import { fitmentRanges, springRanges, withUnit, type FieldRange } from './ranges';

/** The min and max each property of a DTO class enforces, read from its class-validator metadata. */
function enforcedRanges(cls: new () => object): Record<string, { min?: number; max?: number }> {
  const out: Record<string, { min?: number; max?: number }> = {};
  for (const m of getMetadataStorage().getTargetValidationMetadatas(cls, '', false, false)) {
    const name = m.name ?? (m.constraintCls as { name?: string } | undefined)?.name;
    if (name !== 'min' && name !== 'max') continue;
    (out[m.propertyName] ??= {})[name] = m.constraints[0] as number;
  }
  return out;
}

const pick = (r: FieldRange) => ({ min: r.min, max: r.max });

describe('one table of numeric ranges', () => {
  it('is what the fitment DTOs enforce, field by field, with no range written anywhere else', () => {
    const nested: [new () => object, Record<string, keyof typeof fitmentRanges>][] = [
      [LoadStationInputDto, { positionMm: 'stationPositionMm', maxLoadKg: 'stationMaxLoadKg' }],
      [LeveragePointInputDto, { wheelTravelMm: 'curveWheelTravelMm', ratio: 'curveRatio' }],
      [SagPairInputDto, { static: 'staticSag', rider: 'riderSag' }],
      [TorqueInputDto, { torqueNm: 'torqueNm' }],
    ];
    const top = enforcedRanges(FitmentInputDto);
    expect(Object.keys(top).length).toBeGreaterThan(25);
    for (const [prop, range] of Object.entries(top)) {
      expect(range, prop).toEqual(pick(fitmentRanges[prop as keyof typeof fitmentRanges]));
    }
    for (const [cls, keys] of nested) {
      for (const [prop, range] of Object.entries(enforcedRanges(cls))) expect(range, `${cls.name}.${prop}`).toEqual(pick(fitmentRanges[keys[prop]!]));
    }
  });

  it('is what the spring DTO enforces', () => {
    const enforced = enforcedRanges(SpringDetailsInputDto);
    expect(Object.keys(enforced).sort()).toEqual(Object.keys(springRanges).sort());
    for (const [prop, range] of Object.entries(enforced)) expect(range, prop).toEqual(pick(springRanges[prop as keyof typeof springRanges]));
  });

  it('writes a bare number without a dangling space', () => {
    expect(withUnit(1950, '')).toBe('1950');
    expect(withUnit(2000, 'mm')).toBe('2000 mm');
  });
});

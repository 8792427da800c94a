import 'reflect-metadata';
import { plainToInstance } from 'class-transformer';
import { validateSync } from 'class-validator';
import { describe, expect, it } from 'vitest';
import { checkRange, shopSettingLabels, shopSettingRanges, type RangedSetting } from './shop-settings';
import { ShopSettingsInputDto } from './shop-settings.dto';

const valid = {
  shopName: 'Test Works',
  shopAddress: '1 Test Row, Testford',
  currency: 'EUR',
  vatRateBasisPoints: 2000,
  shippingFlatCents: 690,
  freeShippingThresholdCents: 15_000,
  reservationMinutes: 30,
  exchangeWindowDays: 30,
  lowStockThreshold: 3,
};

const dtoMessage = (key: RangedSetting, value: unknown): string | undefined => {
  const errors = validateSync(plainToInstance(ShopSettingsInputDto, { ...valid, [key]: value }));
  const e = errors.find((x) => x.property === key);
  return e ? Object.values(e.constraints ?? {})[0] : undefined;
};

describe('shop setting ranges', () => {
  const keys = Object.keys(shopSettingRanges) as RangedSetting[];
  it.each(keys)('the settings page’s early check and the request DTO agree on %s at and beyond each end', (key) => {
    const { min, max } = shopSettingRanges[key];
    for (const value of [min - 1, min, min + 0.5, max, max + 1]) {
      const page = checkRange(shopSettingLabels[key], key, value);
      expect(page, `${key} = ${value}`).toBe(dtoMessage(key, value));
    }
  });

  it('the whole demo row passes', () => {
    expect(validateSync(plainToInstance(ShopSettingsInputDto, valid))).toEqual([]);
  });

  it('only the reservation time may be left empty (the server setting then stands)', () => {
    expect(checkRange(shopSettingLabels.reservationMinutes, 'reservationMinutes', null)).toBeUndefined();
    expect(dtoMessage('reservationMinutes', null)).toBeUndefined();
    expect(checkRange(shopSettingLabels.lowStockThreshold, 'lowStockThreshold', null)).toBe('Enter low-stock threshold.');
    expect(dtoMessage('lowStockThreshold', null)).toBeDefined();
  });
});

import { IsIn, IsInt, IsString, Length, Matches, Max, Min, ValidateIf } from 'class-validator';
import { rangeMessage, shopAddressLength, shopCurrencies, shopNameLength, shopSettingLabels, shopSettingRanges, type RangedSetting } from './shop-settings';

const ranged = (key: RangedSetting): PropertyDecorator => {
  const message = rangeMessage(shopSettingLabels[key], key);
  const r = shopSettingRanges[key];
  return (t, k) => [IsInt({ message }), Min(r.min, { message }), Max(r.max, { message })].forEach((d) => d(t, k));
};

/** The whole settings row as the admin saves it (every field, so a save never half-applies). */
export class ShopSettingsInputDto {
  @IsString({ message: 'Enter the shop name.' })
  @Length(shopNameLength.min, shopNameLength.max, { message: `The shop name has ${shopNameLength.min} to ${shopNameLength.max} characters.` })
  @Matches(/\S/, { message: 'Enter the shop name.' })
  shopName!: string;

  @IsString({ message: 'Enter the shop address.' })
  @Length(shopAddressLength.min, shopAddressLength.max, { message: `The shop address has ${shopAddressLength.min} to ${shopAddressLength.max} characters.` })
  @Matches(/\S/, { message: 'Enter the shop address.' })
  shopAddress!: string;

  @IsIn(shopCurrencies as unknown as string[], { message: `The currency is one of ${shopCurrencies.join(', ')}.` })
  currency!: (typeof shopCurrencies)[number];

  @ranged('vatRateBasisPoints')
  vatRateBasisPoints!: number;

  @ranged('shippingFlatCents')
  shippingFlatCents!: number;

  @ranged('freeShippingThresholdCents')
  freeShippingThresholdCents!: number;

  // Null hands the hold time back to the server's RESERVATION_MINUTES.
  @ValidateIf((_o, v) => v !== null)
  @ranged('reservationMinutes')
  reservationMinutes!: number | null;

  @ranged('exchangeWindowDays')
  exchangeWindowDays!: number;

  @ranged('lowStockThreshold')
  lowStockThreshold!: number;
}

import { Type } from 'class-transformer';
import { IsEmail, IsObject, IsOptional, IsString, Length, Matches, MaxLength, ValidateNested } from 'class-validator';

const text = (what: string, min: number, max: number) => [
  IsString({ message: `Enter ${what}.` }),
  Length(min, max, { message: `${what[0]!.toUpperCase()}${what.slice(1)} has ${min} to ${max} characters.` }),
  Matches(/\S/, { message: `Enter ${what}.` }),
];
const applyAll = (ds: PropertyDecorator[]): PropertyDecorator => (t, k) => ds.forEach((d) => d(t, k));

export class ShippingAddressDto {
  @applyAll(text('the name to ship to', 1, 120))
  name!: string;

  @applyAll(text('the street and number', 1, 120))
  line1!: string;

  @IsOptional()
  @IsString({ message: 'The second address line is text.' })
  @MaxLength(120, { message: 'The second address line has at most 120 characters.' })
  line2?: string;

  @IsString({ message: 'Enter the postal code.' })
  @Matches(/^[A-Za-z0-9][A-Za-z0-9 -]{1,10}$/, { message: 'Enter a postal code of 2 to 11 letters, digits, spaces or dashes.' })
  postalCode!: string;

  @applyAll(text('the city', 1, 80))
  city!: string;

  @IsString({ message: 'Choose the country.' })
  @Matches(/^[A-Z]{2}$/, { message: 'The country is a two-letter code, e.g. DE.' })
  country!: string;
}

/** POST /api/checkout */
export class CheckoutDto {
  @IsEmail({}, { message: 'Enter a valid e-mail address.' })
  @MaxLength(254, { message: 'An e-mail address has at most 254 characters.' })
  email!: string;

  @IsObject({ message: 'Enter the shipping address.' })
  @ValidateNested()
  @Type(() => ShippingAddressDto)
  shippingAddress!: ShippingAddressDto;
}

export interface CheckoutResultDto {
  orderId: string;
  orderNumber: string;
  paymentUrl: string;
  /** Opens the order without signing in (the guest's link). */
  accessToken: string;
}

import { Type } from 'class-transformer';
import { IsNumber, IsOptional, IsString, IsUUID, Max, MaxLength, Min } from 'class-validator';
import { isIn } from '../catalogue/common';
import { ridingStyles, type RidingStyle } from '../catalogue/constants';
import { riderRanges } from '../catalogue/ranges';

const kg = (what: string, min: number, max: number): PropertyDecorator => (target, key) => {
  Type(() => Number)(target, key);
  IsNumber({ allowNaN: false, allowInfinity: false }, { message: `${what} is a number (kg).` })(target, key);
  Min(min, { message: `${what} is at least ${min} kg.` })(target, key);
  Max(max, { message: `${what} is at most ${max} kg.` })(target, key);
};

/**
 * GET /api/setup-sheet and /api/setup-sheet/pdf: a bike, a load and the chosen springs, flat so the sheet has a
 * plain link (the finder and a saved bike both build it).
 * @example /api/setup-sheet?fitmentId=…&ridingStyle=road&riderKg=95&gearKg=8&panniersKg=20&forkId=…&shockId=…
 */
export class SetupSheetQueryDto {
  @IsUUID('all', { message: 'Choose a bike.' })
  fitmentId!: string;

  @isIn(ridingStyles, 'Riding style')
  ridingStyle!: RidingStyle;

  @kg('Rider mass', riderRanges.massKg.min, riderRanges.massKg.max)
  riderKg!: number;

  @IsOptional()
  @kg('Gear mass', riderRanges.gearKg.min, riderRanges.gearKg.max)
  gearKg?: number;

  @IsOptional()
  @kg('Passenger mass', 0, 250)
  passengerKg?: number;

  @IsOptional()
  @kg('Tank bag', 0, 250)
  tankBagKg?: number;

  @IsOptional()
  @kg('Panniers', 0, 250)
  panniersKg?: number;

  @IsOptional()
  @kg('Top case', 0, 250)
  topCaseKg?: number;

  @IsOptional()
  @IsUUID('all', { message: 'The fork spring is a product id.' })
  forkId?: string;

  @IsOptional()
  @IsUUID('all', { message: 'The shock spring is a product id.' })
  shockId?: string;
}

/** GET /api/setup-sheet/orders/:id(/pdf): an order's spring set as bought. */
export class OrderSheetQueryDto {
  @IsOptional()
  @IsString({ message: 'The order link’s token is text.' })
  @MaxLength(200, { message: 'The order link’s token is at most 200 characters.' })
  token?: string;

  @IsOptional()
  @IsUUID('all', { message: 'The spring set is an id from the order.' })
  setId?: string;
}

/** The flat query for a plan, so client links and server reads agree on the names. */
export type SetupSheetQuery = Omit<SetupSheetQueryDto, never>;

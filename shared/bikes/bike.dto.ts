import { Type } from 'class-transformer';
import { ArrayMaxSize, ArrayMinSize, IsArray, IsDefined, IsIn, IsObject, IsOptional, IsString, IsUUID, Length, Matches, ValidateBy, ValidateNested, type ValidationArguments } from 'class-validator';
import { isIn, ridingStyles, type RidingStyle } from '../catalogue/common';
import { LoadCaseInputDto, LoadSetInputDto } from '../catalogue/recommendation.dto';
import { sagReadingProblem } from '../dto/calculations.dto';
import type { SagCheckResult, SagReading } from '../engine/types';

const MAX_READING_MM = 3000;
const notBlank = /\S/;

/** The rider's name for a bike: shown on its card, so short and not blank. */
export class BikeNicknameDto {
  @IsString({ message: 'Give the bike a nickname.' })
  @Length(1, 60, { message: 'A nickname has 1 to 60 characters.' })
  @Matches(notBlank, { message: 'Give the bike a nickname.' })
  nickname!: string;
}

/** A saved bike as the rider sends it: the finder's state (bike, style, load, load cases, chosen springs) and a nickname. */
export class SaveBikeDto extends BikeNicknameDto {
  @IsUUID('all', { message: 'Choose a bike.' })
  fitmentId!: string;

  @isIn(ridingStyles, 'Riding style')
  ridingStyle!: RidingStyle;

  // The same load-set shape as a recommendation request, so the finder reopens with exactly what was saved.
  @IsDefined({ message: 'Give the load: the rider and gear masses.' })
  @IsObject({ message: 'The load is an object with the rider and gear masses.' })
  @ValidateNested()
  @Type(() => LoadSetInputDto)
  load!: LoadSetInputDto;

  @IsOptional()
  @IsArray({ message: 'Cases are a list.' })
  @ArrayMinSize(1, { message: 'Give at least one case, or leave cases out.' })
  @ArrayMaxSize(5, { message: 'At most 5 cases.' })
  @ValidateNested({ each: true })
  @Type(() => LoadCaseInputDto)
  cases?: LoadCaseInputDto[];

  @IsOptional()
  @IsUUID('all', { message: 'The fork spring is a product id.' })
  forkSpringId?: string;

  @IsOptional()
  @IsUUID('all', { message: 'The shock spring is a product id.' })
  shockSpringId?: string;
}

const isReading = (label: string): PropertyDecorator =>
  ValidateBy(
    { name: 'sagReading', validator: { validate: (v: unknown) => sagReadingProblem(v, label) === undefined } },
    { message: (args: ValidationArguments) => sagReadingProblem(args.value, label) ?? `${label} is not valid.` },
  );

const readingValue = (v: unknown): number | undefined =>
  typeof v === 'number' ? v : typeof v === 'object' && v !== null && 'down' in v && 'up' in v ? ((v as { down: number }).down + (v as { up: number }).up) / 2 : undefined;

/** Only the readings: targets, leverage and loads come from the saved bike on the server, and the verdict is computed there. */
export class BikeSagCheckInputDto {
  @IsIn(['rear', 'front'], { message: 'End must be "rear" or "front".' })
  @IsDefined({ message: 'End ("rear" or "front") is required.' })
  end!: 'rear' | 'front';

  @ValidateBy(
    { name: 'extendedReading', validator: { validate: (v: unknown) => typeof v === 'number' && Number.isFinite(v) && v > 0 && v <= MAX_READING_MM } },
    { message: `The fully extended reading must be a number more than 0 and at most ${MAX_READING_MM} mm.` },
  )
  extendedMm!: number;

  @ValidateBy(
    {
      name: 'staticNotLongerThanExtended',
      validator: {
        validate: (v: unknown, a?: ValidationArguments) => {
          const r = readingValue(v);
          const e = (a?.object as { extendedMm?: unknown } | undefined)?.extendedMm;
          return r === undefined || typeof e !== 'number' || r <= e;
        },
      },
    },
    { message: 'The reading on the bike’s own weight must not be longer than the fully extended reading.' },
  )
  @isReading('The reading on the bike’s own weight')
  @IsDefined({ message: 'The reading on the bike’s own weight is required.' })
  staticMm!: SagReading;

  @ValidateBy(
    {
      name: 'riderNotLongerThanStatic',
      validator: {
        validate: (v: unknown, a?: ValidationArguments) => {
          const r = readingValue(v);
          const s = readingValue((a?.object as { staticMm?: unknown } | undefined)?.staticMm);
          return r === undefined || s === undefined || r <= s;
        },
      },
    },
    { message: 'The reading with the rider aboard must not be longer than the reading on the bike’s own weight.' },
  )
  @isReading('The reading with the rider aboard')
  @IsDefined({ message: 'The reading with the rider aboard is required.' })
  riderMm!: SagReading;
}

// ---------- replies ----------

export interface BikeSpringDto {
  id: string;
  name: string;
  sku: string;
  rateNPerMm: number | null;
}

export interface BikeSummaryDto {
  id: string;
  nickname: string;
  /** Null when the staff removed the bike from the fitment table since. */
  fitmentId: string | null;
  bikeLabel: string;
  ridingStyle: RidingStyle;
  forkSpring: BikeSpringDto | null;
  shockSpring: BikeSpringDto | null;
  sagCheckCount: number;
  lastCheck: { checkedAt: string; end: 'rear' | 'front'; springVerdict: SagCheckResult['springVerdict'] } | null;
  createdAt: string;
  updatedAt: string;
}

export interface BikeDto extends BikeSummaryDto {
  load: LoadSetInputDto;
  cases: LoadCaseInputDto[];
}

export interface BikeSagCheckDto {
  id: string;
  checkedAt: string;
  end: 'rear' | 'front';
  readings: { extendedMm: number; staticMm: SagReading; riderMm: SagReading };
  targets: { staticSagMm: number; riderSagMm: number; toleranceMm: number };
  /** The engine's answer as the server computed it from the readings and the bike. */
  result: SagCheckResult;
}

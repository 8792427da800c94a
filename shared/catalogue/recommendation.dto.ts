import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  ArrayMinSize,
  IsArray,
  IsNumber,
  IsObject,
  IsOptional,
  IsString,
  IsUUID,
  Length,
  Max,
  Min,
  ValidateNested,
} from 'class-validator';
import type { AdapterNeedDto } from './compatibility.dto';
import { isIn, luggageStations, ridingStyles, type CurrencyCode, type LoadStationKind, type LuggageStation, type RateInUnitsDto, type RidingStyle } from './common';
import type { FitmentSummaryDto } from './fitment.dto';
import { riderRanges } from './ranges';
import type { SpringCandidateResult, SpringVerdict } from '../engine/types';

// ---------- request ----------

const num = (what: string) => IsNumber({ allowNaN: false, allowInfinity: false }, { message: `${what} is a number (kg).` });

export class RiderInputDto {
  @num('Rider mass')
  @Min(riderRanges.massKg.min, { message: `Rider mass is at least ${riderRanges.massKg.min} kg.` })
  @Max(riderRanges.massKg.max, { message: `Rider mass is at most ${riderRanges.massKg.max} kg.` })
  massKg!: number;

  @num('Gear mass')
  @Min(riderRanges.gearKg.min, { message: 'Gear mass is not negative.' })
  @Max(riderRanges.gearKg.max, { message: `Gear mass is at most ${riderRanges.gearKg.max} kg.` })
  gearKg!: number;
}

export class LuggageInputDto {
  @isIn(luggageStations, 'Luggage station')
  station!: LuggageStation;

  @num('Luggage mass')
  @Min(0, { message: 'Luggage mass is not negative.' })
  @Max(250, { message: 'Luggage mass is at most 250 kg.' })
  massKg!: number;
}

/** Who rides and what the bike carries: the part a request and each of its load cases share. */
export class LoadSetInputDto {
  // ValidateNested alone lets a list through (it validates each item), so the shape is checked first.
  @IsObject({ message: 'Give the rider and gear masses.' })
  @ValidateNested()
  @Type(() => RiderInputDto)
  rider!: RiderInputDto;

  @IsOptional()
  @num('Passenger mass')
  @Min(0, { message: 'Passenger mass is not negative.' })
  @Max(250, { message: 'Passenger mass is at most 250 kg.' })
  passengerKg?: number;

  @IsOptional()
  @IsArray({ message: 'Luggage is a list.' })
  @ArrayMaxSize(10, { message: 'At most 10 pieces of luggage.' })
  @ValidateNested({ each: true })
  @Type(() => LuggageInputDto)
  luggage?: LuggageInputDto[];
}

/** One named load set, e.g. "two-up touring". */
export class LoadCaseInputDto extends LoadSetInputDto {
  @IsString({ message: 'Name the case.' })
  @Length(1, 60, { message: 'A case name has 1 to 60 characters.' })
  name!: string;
}

/** POST /api/recommendations/shown body: the finder showed a rider an answer it worked out in the browser for this bike. */
export class RecommendationShownDto {
  @IsUUID('all', { message: 'Choose a bike.' })
  fitmentId!: string;
}

/**
 * POST /api/recommendations body. With `cases`, the top-level load is evaluated as a case named
 * "as entered" followed by the given cases, and `fork`/`shock` come in the cases shape.
 */
export class RecommendationRequestDto extends LoadSetInputDto {
  @IsUUID('all', { message: 'Choose a bike.' })
  fitmentId!: string;

  @isIn(ridingStyles, 'Riding style')
  ridingStyle!: RidingStyle;

  @IsOptional()
  @IsArray({ message: 'Cases are a list.' })
  @ArrayMinSize(1, { message: 'Give at least one case, or leave cases out.' })
  @ArrayMaxSize(5, { message: 'At most 5 cases.' })
  @ValidateNested({ each: true })
  @Type(() => LoadCaseInputDto)
  cases?: LoadCaseInputDto[];
}


// ---------- response (the engine's fork-spring / rear-spring shapes, enriched) ----------

export type SpringVerdictDto = SpringVerdict;

/** The engine's answer for one spring, as it crosses the wire. */
export type SpringCandidateDto = SpringCandidateResult;

/** A catalogue spring's answer: `id` is the product id. */
export interface RecommendedSpringDto extends SpringCandidateDto {
  sku: string;
  name: string;
  priceCents: number;
  currency: CurrencyCode;
  inStock: boolean;
  freeLengthMm: number;
  /** Adapters this spring needs on this bike; they go in the cart with it. */
  adapters: AdapterNeedDto[];
}

interface EndCommon {
  bikeLoadN: number;
  /** Per spring (each of the fork pair, each of twin shocks): the rate that meets both sag targets exactly. */
  requiredRate: RateInUnitsDto;
  /** Per spring: the rates some preload in the adjuster's range sets right for the stock spring's free length; absent when none does. */
  rateBand?: { min: RateInUnitsDto; max: RateInUnitsDto };
  /** How far static sag may sit from its target for a spring to be ok, mm. */
  staticSagToleranceMm: number;
  /** Best first: ok ones closest to the required rate. */
  candidates: RecommendedSpringDto[];
  /** The bike's stock spring through the same engine, for comparison (id 'stock'). */
  stock: SpringCandidateDto;
}

export interface ForkRecommendationDto extends EndCommon {
  frontLoadN: number;
}

export interface ShockRecommendationDto extends EndCommon {
  rearLoadN: number;
}

/** The engine's cases shape: `coversAllCases` lists product ids ok in every case. */
export interface CasesRecommendationDto<R> {
  cases: Array<{ name: string } & R>;
  coversAllCases: string[];
  uncoveredBy: Record<string, string>;
}

export interface ResolvedLoadDto {
  station: LoadStationKind;
  massKg: number;
  positionMm: number;
}

export interface EndTargetsDto {
  staticSagMm: number;
  riderSagMm: number;
  staticSagToleranceMm: number;
}

export interface RecommendationDto {
  fitment: FitmentSummaryDto;
  ridingStyle: RidingStyle;
  /** The sag targets used, mm (converted from % of travel where the fitment keeps them so), with the static-sag tolerance. */
  targets: { fork: EndTargetsDto; shock: EndTargetsDto };
  /** The top-level load as placed on the bike's stations. */
  loads: ResolvedLoadDto[];
  fork: ForkRecommendationDto | CasesRecommendationDto<ForkRecommendationDto>;
  shock: ShockRecommendationDto | CasesRecommendationDto<ShockRecommendationDto>;
}

/** Tells the cases shape from the single-load one. */
export function isCasesRecommendation<R>(x: R | CasesRecommendationDto<R>): x is CasesRecommendationDto<R> {
  return typeof x === 'object' && x !== null && 'cases' in x;
}

import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  ArrayMinSize,
  IsArray,
  IsIn,
  IsInt,
  IsNumber,
  IsObject,
  IsOptional,
  IsString,
  Length,
  Matches,
  Max,
  MaxLength,
  Min,
  ValidateIf,
  ValidateNested,
} from 'class-validator';
import { fitmentSortFields, isIn, loadStationKinds, PageQueryDto, sortValues, type LoadStationKind, type RateInUnitsDto } from './common';
import { fitmentRanges, withUnit, type FieldRange } from './ranges';

// ---------- responses ----------

/** One row of the bike picker and of the staff fitment table. */
export interface FitmentSummaryDto {
  id: string;
  make: string;
  model: string;
  /** Trim or version within the model, '' when there is only one. */
  variant: string;
  yearFrom: number;
  yearTo: number;
  updatedAt: string;
}

export interface LoadStationDto {
  station: LoadStationKind;
  /** Rearward from the front axle, mm; beyond the wheelbase is behind the rear axle. */
  positionMm: number;
  maxLoadKg: number;
}

export interface LeveragePointDto {
  wheelTravelMm: number;
  ratio: number;
}

export interface SagPairDto {
  static: number;
  rider: number;
}

/** Sag targets of one end by riding style, in mm or in % of that end's travel. */
export interface SagEndDto {
  unit: 'mm' | 'pct';
  road: SagPairDto;
  adventure: SagPairDto;
  offRoad: SagPairDto;
}

export interface TorqueDto {
  fastener: string;
  torqueNm: number;
}

/** Stored in N·m; ft·lbf is given beside it for the setup sheet. */
export interface TorqueOutDto extends TorqueDto {
  torqueFtLbf: number;
}

/** Everything the engine needs about one bike variant. All quantities SI: kg, mm, N/mm, degrees, N·m. */
export interface FitmentDto extends FitmentSummaryDto {
  /** 'sprung': the sprung masses were entered; 'wet': derived from wet mass, front share and unsprung masses. */
  massInput: 'sprung' | 'wet';
  frontSprungMassKg: number;
  rearSprungMassKg: number;
  wetMassKg: number | null;
  frontStaticSharePct: number | null;
  frontUnsprungMassKg: number | null;
  rearUnsprungMassKg: number | null;
  /** Most the bike may carry on top of itself (riders, gear, luggage), kg. */
  ratedLoadKg: number;
  wheelbaseMm: number;
  loadStations: LoadStationDto[];
  /** Exactly one of rearLeverageRatio and rearLeverageCurve is set. */
  rearLeverageRatio: number | null;
  rearLeverageCurve: LeveragePointDto[] | null;
  rearWheelTravelMm: number;
  shockStrokeMm: number;
  /** Shocks side by side (1, or 2 on a twin-shock bike); rates are per spring and the wheel sees their sum. */
  shockCount: number;
  rearPreloadMinMm: number;
  rearPreloadMaxMm: number;
  rearAdjusterPitchMm: number;
  shockSpringInnerDiameterMm: number;
  shockSpringFreeLengthMinMm: number;
  shockSpringFreeLengthMaxMm: number;
  forkAngleDeg: number;
  forkTravelMm: number;
  forkSpringCount: number;
  forkPreloadMinMm: number;
  forkPreloadMaxMm: number;
  /** null for forks without a preload adjuster. */
  forkAdjusterPitchMm: number | null;
  /** Length of the stock preload spacer, mm; null when not known (it matters on forks without an adjuster). */
  forkStockSpacerMm: number | null;
  /** Preload of the stock fork spring as delivered, mm. */
  forkStockPreloadMm: number;
  forkSpringInnerDiameterMm: number;
  forkSpringFreeLengthMinMm: number;
  forkSpringFreeLengthMaxMm: number;
  sag: { front: SagEndDto; rear: SagEndDto };
  /** How far the predicted static sag may sit from its target, mm, on the targets' own axis (fork tube, rear wheel). */
  frontStaticSagToleranceMm: number;
  rearStaticSagToleranceMm: number;
  stockForkRateNPerMm: number;
  stockForkFreeLengthMm: number;
  stockShockRateNPerMm: number;
  stockShockFreeLengthMm: number;
  stockForkRate: RateInUnitsDto;
  stockShockRate: RateInUnitsDto;
  torques: TorqueOutDto[];
  tools: string[];
  notes: string;
}

/** Makes and their models, for the picker's first two selects. */
export interface MakeDto {
  make: string;
  models: string[];
}

// ---------- requests ----------

/** GET /api/fitments and GET /api/staff/fitments query. */
export class FitmentListQueryDto extends PageQueryDto {
  @IsOptional()
  @IsString({ message: 'Make is text.' })
  @MaxLength(60, { message: 'Make has at most 60 characters.' })
  make?: string;

  @IsOptional()
  @IsString({ message: 'Model is text.' })
  @MaxLength(60, { message: 'Model has at most 60 characters.' })
  model?: string;

  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'Year is a whole number.' })
  @Min(1950, { message: 'Year is from 1950.' })
  @Max(2100, { message: 'Year is at most 2100.' })
  year?: number;

  /** Free text matched against make, model and variant. */
  @IsOptional()
  @IsString({ message: 'Search is text.' })
  @MaxLength(100, { message: 'Search has at most 100 characters.' })
  q?: string;

  @IsOptional()
  @IsIn(sortValues(fitmentSortFields), { message: `Sort is one of ${sortValues(fitmentSortFields).join(', ')}.` })
  sort?: string;
}

const num = (what: string) => IsNumber({ allowNaN: false, allowInfinity: false }, { message: `${what} is a number.` });
/** The field's range from the shared table, in the words the back-office form also uses. */
function InRange(range: FieldRange): PropertyDecorator {
  return (target, key) => {
    Min(range.min, { message: `Must be at least ${withUnit(range.min, range.unit)}.` })(target, key);
    Max(range.max, { message: `Must be at most ${withUnit(range.max, range.unit)}.` })(target, key);
  };
}

export class LoadStationInputDto {
  @isIn(loadStationKinds, 'Station')
  station!: LoadStationKind;

  @num('Position')
  @InRange(fitmentRanges.stationPositionMm)
  positionMm!: number;

  @num('Maximum load')
  @InRange(fitmentRanges.stationMaxLoadKg)
  maxLoadKg!: number;
}

export class LeveragePointInputDto {
  @num('Wheel travel')
  @InRange(fitmentRanges.curveWheelTravelMm)
  wheelTravelMm!: number;

  @num('Ratio')
  @InRange(fitmentRanges.curveRatio)
  ratio!: number;
}

export class SagPairInputDto {
  @num('Static sag')
  @InRange(fitmentRanges.staticSag)
  static!: number;

  @num('Rider sag')
  @InRange(fitmentRanges.riderSag)
  rider!: number;
}

export class SagEndInputDto {
  @IsIn(['mm', 'pct'], { message: 'Unit is mm or pct.' })
  unit!: 'mm' | 'pct';

  @IsObject({ message: 'Road sag is static and rider sag.' })
  @ValidateNested()
  @Type(() => SagPairInputDto)
  road!: SagPairInputDto;

  @IsObject({ message: 'Adventure sag is static and rider sag.' })
  @ValidateNested()
  @Type(() => SagPairInputDto)
  adventure!: SagPairInputDto;

  @IsObject({ message: 'Off-road sag is static and rider sag.' })
  @ValidateNested()
  @Type(() => SagPairInputDto)
  offRoad!: SagPairInputDto;
}

export class SagInputDto {
  @IsObject({ message: 'Give the front sag targets.' })
  @ValidateNested()
  @Type(() => SagEndInputDto)
  front!: SagEndInputDto;

  @IsObject({ message: 'Give the rear sag targets.' })
  @ValidateNested()
  @Type(() => SagEndInputDto)
  rear!: SagEndInputDto;
}

/** Names used inside the CSV's "a=1 | b=2" cells may not contain those separators. */
const listItem = /^[^|=\r\n]+$/;
// Names are trimmed before they are saved, so one of only spaces would be stored empty.
const notBlank = /\S/;

export class TorqueInputDto {
  @IsString({ message: 'Name the fastener.' })
  @Length(1, 80, { message: 'A fastener name has 1 to 80 characters.' })
  @Matches(listItem, { message: 'A fastener name may not contain | or =.' })
  @Matches(notBlank, { message: 'Name the fastener.' })
  fastener!: string;

  @num('Torque')
  @InRange(fitmentRanges.torqueNm)
  torqueNm!: number;
}

/**
 * POST /api/staff/fitments and PUT /api/staff/fitments/:id body (a full replacement).
 * Cross-field rules (year order, windows, sag below travel, mass mode) are in `fitmentProblems`.
 */
export class FitmentInputDto {
  @IsString({ message: 'Enter the make.' })
  @Length(1, 60, { message: 'A make has 1 to 60 characters.' })
  @Matches(notBlank, { message: 'Enter the make.' })
  make!: string;

  @IsString({ message: 'Enter the model.' })
  @Length(1, 60, { message: 'A model has 1 to 60 characters.' })
  @Matches(notBlank, { message: 'Enter the model.' })
  model!: string;

  @IsOptional()
  @IsString({ message: 'Variant is text.' })
  @MaxLength(60, { message: 'A variant has at most 60 characters.' })
  variant?: string;

  @IsInt({ message: 'First year is a whole number.' })
  @InRange(fitmentRanges.yearFrom)
  yearFrom!: number;

  @IsInt({ message: 'Last year is a whole number.' })
  @InRange(fitmentRanges.yearTo)
  yearTo!: number;

  @IsIn(['sprung', 'wet'], { message: 'Mass input is sprung or wet.' })
  massInput!: 'sprung' | 'wet';

  @ValidateIf((o: FitmentInputDto) => o.massInput !== 'wet' || o.frontSprungMassKg != null)
  @num('Front sprung mass')
  @InRange(fitmentRanges.frontSprungMassKg)
  frontSprungMassKg?: number | null;

  @ValidateIf((o: FitmentInputDto) => o.massInput !== 'wet' || o.rearSprungMassKg != null)
  @num('Rear sprung mass')
  @InRange(fitmentRanges.rearSprungMassKg)
  rearSprungMassKg?: number | null;

  @ValidateIf((o: FitmentInputDto) => o.massInput === 'wet' || o.wetMassKg != null)
  @num('Wet mass')
  @InRange(fitmentRanges.wetMassKg)
  wetMassKg?: number | null;

  @ValidateIf((o: FitmentInputDto) => o.massInput === 'wet' || o.frontStaticSharePct != null)
  @num('Front share')
  @InRange(fitmentRanges.frontStaticSharePct)
  frontStaticSharePct?: number | null;

  @ValidateIf((o: FitmentInputDto) => o.massInput === 'wet' || o.frontUnsprungMassKg != null)
  @num('Front unsprung mass')
  @InRange(fitmentRanges.frontUnsprungMassKg)
  frontUnsprungMassKg?: number | null;

  @ValidateIf((o: FitmentInputDto) => o.massInput === 'wet' || o.rearUnsprungMassKg != null)
  @num('Rear unsprung mass')
  @InRange(fitmentRanges.rearUnsprungMassKg)
  rearUnsprungMassKg?: number | null;

  @num('Rated load')
  @InRange(fitmentRanges.ratedLoadKg)
  ratedLoadKg!: number;

  @num('Wheelbase')
  @InRange(fitmentRanges.wheelbaseMm)
  wheelbaseMm!: number;

  @IsArray({ message: 'Load stations are a list.' })
  @ArrayMinSize(1, { message: 'Give at least the rider seat.' })
  @ArrayMaxSize(5, { message: 'At most one of each of the five stations.' })
  @ValidateNested({ each: true })
  @Type(() => LoadStationInputDto)
  loadStations!: LoadStationInputDto[];

  @ValidateIf((o: FitmentInputDto) => o.rearLeverageCurve == null)
  @num('Leverage ratio')
  @InRange(fitmentRanges.rearLeverageRatio)
  rearLeverageRatio?: number | null;

  @ValidateIf((o: FitmentInputDto) => o.rearLeverageCurve != null)
  @IsArray({ message: 'The leverage curve is a list of points.' })
  @ArrayMinSize(2, { message: 'A curve has at least 2 points.' })
  @ArrayMaxSize(30, { message: 'A curve has at most 30 points.' })
  @ValidateNested({ each: true })
  @Type(() => LeveragePointInputDto)
  rearLeverageCurve?: LeveragePointInputDto[] | null;

  @num('Rear wheel travel')
  @InRange(fitmentRanges.rearWheelTravelMm)
  rearWheelTravelMm!: number;

  @num('Shock stroke')
  @InRange(fitmentRanges.shockStrokeMm)
  shockStrokeMm!: number;

  @IsOptional()
  @IsInt({ message: 'Number of shocks is 1 or 2.' })
  @InRange(fitmentRanges.shockCount)
  shockCount?: number | null;

  @num('Rear preload minimum')
  @InRange(fitmentRanges.rearPreloadMinMm)
  rearPreloadMinMm!: number;

  @num('Rear preload maximum')
  @InRange(fitmentRanges.rearPreloadMaxMm)
  rearPreloadMaxMm!: number;

  @num('Adjuster pitch')
  @InRange(fitmentRanges.rearAdjusterPitchMm)
  rearAdjusterPitchMm!: number;

  @num('Shock spring inner diameter')
  @InRange(fitmentRanges.shockSpringInnerDiameterMm)
  shockSpringInnerDiameterMm!: number;

  @num('Shock spring shortest free length')
  @InRange(fitmentRanges.shockSpringFreeLengthMinMm)
  shockSpringFreeLengthMinMm!: number;

  @num('Shock spring longest free length')
  @InRange(fitmentRanges.shockSpringFreeLengthMaxMm)
  shockSpringFreeLengthMaxMm!: number;

  @num('Fork angle')
  @InRange(fitmentRanges.forkAngleDeg)
  forkAngleDeg!: number;

  @num('Fork travel')
  @InRange(fitmentRanges.forkTravelMm)
  forkTravelMm!: number;

  @IsInt({ message: 'Number of fork springs is 1 or 2.' })
  @InRange(fitmentRanges.forkSpringCount)
  forkSpringCount!: number;

  @num('Fork preload minimum')
  @InRange(fitmentRanges.forkPreloadMinMm)
  forkPreloadMinMm!: number;

  @num('Fork preload maximum')
  @InRange(fitmentRanges.forkPreloadMaxMm)
  forkPreloadMaxMm!: number;

  @IsOptional()
  @num('Fork adjuster pitch')
  @InRange(fitmentRanges.forkAdjusterPitchMm)
  forkAdjusterPitchMm?: number | null;

  @IsOptional()
  @num('Stock fork spacer')
  @InRange(fitmentRanges.forkStockSpacerMm)
  forkStockSpacerMm?: number | null;

  /** The minimum of the fork preload range when left out. */
  @IsOptional()
  @num('Stock fork preload')
  @InRange(fitmentRanges.forkStockPreloadMm)
  forkStockPreloadMm?: number | null;

  @num('Fork spring inner diameter')
  @InRange(fitmentRanges.forkSpringInnerDiameterMm)
  forkSpringInnerDiameterMm!: number;

  @num('Fork spring shortest free length')
  @InRange(fitmentRanges.forkSpringFreeLengthMinMm)
  forkSpringFreeLengthMinMm!: number;

  @num('Fork spring longest free length')
  @InRange(fitmentRanges.forkSpringFreeLengthMaxMm)
  forkSpringFreeLengthMaxMm!: number;

  // ValidateNested alone lets a list through (it validates each item), so the shape is checked first.
  @IsObject({ message: 'Give the sag targets.' })
  @ValidateNested()
  @Type(() => SagInputDto)
  sag!: SagInputDto;

  /** 3 mm when left out. */
  @IsOptional()
  @num('Front static sag tolerance')
  @InRange(fitmentRanges.frontStaticSagToleranceMm)
  frontStaticSagToleranceMm?: number | null;

  /** 3 mm when left out. */
  @IsOptional()
  @num('Rear static sag tolerance')
  @InRange(fitmentRanges.rearStaticSagToleranceMm)
  rearStaticSagToleranceMm?: number | null;

  @num('Stock fork spring rate')
  @InRange(fitmentRanges.stockForkRateNPerMm)
  stockForkRateNPerMm!: number;

  @num('Stock fork spring free length')
  @InRange(fitmentRanges.stockForkFreeLengthMm)
  stockForkFreeLengthMm!: number;

  @num('Stock shock spring rate')
  @InRange(fitmentRanges.stockShockRateNPerMm)
  stockShockRateNPerMm!: number;

  @num('Stock shock spring free length')
  @InRange(fitmentRanges.stockShockFreeLengthMm)
  stockShockFreeLengthMm!: number;

  @IsOptional()
  @IsArray({ message: 'Torques are a list.' })
  @ArrayMaxSize(30, { message: 'At most 30 torque values.' })
  @ValidateNested({ each: true })
  @Type(() => TorqueInputDto)
  torques?: TorqueInputDto[];

  @IsOptional()
  @IsArray({ message: 'Tools are a list.' })
  @ArrayMaxSize(30, { message: 'At most 30 tools.' })
  @IsString({ each: true, message: 'Each tool is text.' })
  @Length(1, 80, { each: true, message: 'A tool name has 1 to 80 characters.' })
  @Matches(listItem, { each: true, message: 'A tool name may not contain | or =.' })
  @Matches(notBlank, { each: true, message: 'A tool name has 1 to 80 characters.' })
  tools?: string[];

  @IsOptional()
  @IsString({ message: 'Notes are text.' })
  @MaxLength(4000, { message: 'Notes have at most 4000 characters.' })
  notes?: string;
}

// The cross-field rules live in a decorator-free module the client loads too; re-exported for the server.
export { fitmentProblems, fitmentWarnings, sprungFromWet, sprungFromWetOrNull, strokeUse, type FitmentRuleFields } from './fitment-rules';

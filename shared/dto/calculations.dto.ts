import 'reflect-metadata';
import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  ArrayMinSize,
  ArrayUnique,
  IsArray,
  IsDefined,
  IsIn,
  IsObject,
  IsOptional,
  IsString,
  Length,
  ValidateBy,
  ValidateIf,
  ValidateNested,
  type ValidationArguments,
} from 'class-validator';
import { endCoils, SPRING_END_TYPES, SPRING_MATERIAL_KEYS } from '../engine/geometry';
import { describedAs } from './validation';
import type {
  ForkSpacerInput,
  ForkSpringInput,
  InstalledLengthWindow,
  LeverageRatioInput,
  Load,
  LoadCase,
  PreloadRange,
  RearSpringInput,
  SagCheckInput,
  SagReading,
  SagTargets,
  SpringCandidateInput,
  SpringEndType,
  SpringGeometryInput,
} from '../engine/types';

export const MAX_SPRINGS = 50;
export const MAX_LOADS = 20;
export const MAX_CASES = 20;
export const MAX_LEVERAGE_POINTS = 50;
const MAX_RATIO = 10;
const MAX_CURVE_TRAVEL_MM = 1000;
const MAX_READING_MM = 3000;

type Obj = Record<string, unknown>;
const isObj = (v: unknown): v is Obj => typeof v === 'object' && v !== null && !Array.isArray(v);
const isFiniteNumber = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);
const hasOnlyKeys = (o: Obj, keys: readonly string[]): boolean =>
  Object.keys(o).every((k) => keys.includes(k)) && keys.every((k) => k in o);

interface NumberRule {
  min: number;
  max: number;
  /** `min` is excluded (used with 0 for "more than 0"). */
  exclusiveMin?: boolean;
  unit?: string;
  optional?: boolean;
  int?: boolean;
}

/** What is wrong with one numeric field, in the order a person would fix it, or undefined. */
function numberProblem(label: string, rule: NumberRule, v: unknown): string | undefined {
  const u = rule.unit === undefined ? '' : ` ${rule.unit}`;
  if (v === undefined || v === null) return rule.optional ? undefined : `${label} is required.`;
  if (typeof v !== 'number' || !Number.isFinite(v)) return `${label} must be a number.`;
  if (rule.int && !Number.isInteger(v)) return `${label} must be a whole number.`;
  if (rule.exclusiveMin && rule.min === 0) {
    if (v <= 0) return `${label} must be more than 0${u}.`;
  } else if (v < rule.min) return `${label} must be at least ${rule.min}${u}.`;
  if (v > rule.max) return `${label} must be at most ${rule.max}${u}.`;
  return undefined;
}

/** The JSON Schema of a numeric field's rule, for the API description. */
const numberSchema = (label: string, rule: NumberRule) => ({
  type: rule.int ? 'integer' : 'number',
  ...(rule.exclusiveMin ? { exclusiveMinimum: rule.min } : { minimum: rule.min }),
  maximum: rule.max,
  description: rule.unit ? `${label}, ${rule.unit}` : label,
});

/**
 * One decorator for a numeric field: required (or optional), finite number, range; messages name the field.
 * A single constraint rather than four keeps validation cheap on the hot calculation routes.
 */
function NumberField(label: string, rule: NumberRule): PropertyDecorator {
  return (target, key) => {
    if (rule.optional) IsOptional()(target, key);
    ValidateBy(
      { name: 'numberField', constraints: [describedAs(numberSchema(label, rule))], validator: { validate: (v: unknown) => numberProblem(label, rule, v) === undefined } },
      { message: (args: ValidationArguments) => numberProblem(label, rule, args.value) ?? `${label} is not valid.` },
    )(target, key);
  };
}

/** A cross-field or shape check with a fixed or computed message. */
function Satisfies(
  name: string,
  test: (value: unknown, object: Obj) => boolean,
  message: string | ((args: ValidationArguments) => string),
): PropertyDecorator {
  return ValidateBy(
    { name, validator: { validate: (value: unknown, args?: ValidationArguments) => test(value, (args?.object ?? {}) as Obj) } },
    { message },
  );
}

interface ObjectRule {
  optional?: boolean;
  /** The label is plural ("Sag targets are required"). */
  plural?: boolean;
}

/** A nested object field: required, an object, validated as `cls`. */
function NestedField(label: string, cls: () => new () => object, rule: ObjectRule = {}): PropertyDecorator {
  return (target, key) => {
    if (rule.optional) IsOptional()(target, key);
    else IsDefined({ message: `${label} ${rule.plural ? 'are' : 'is'} required.` })(target, key);
    IsObject({ message: `${label} must be an object.` })(target, key);
    ValidateNested({ message: `${label} must be an object.` })(target, key);
    Type(cls)(target, key);
  };
}

interface ListRule {
  min: number;
  max: number;
  optional?: boolean;
  /** Noun for one item, e.g. "spring". */
  item: string;
  unique?: (item: Obj) => unknown;
  uniqueMessage?: string;
}

/** A list of nested objects with size limits; `required` is added by the caller when it is conditional. */
function ListField(label: string, cls: () => new () => object, rule: ListRule): PropertyDecorator {
  return (target, key) => {
    if (rule.optional) IsOptional()(target, key);
    IsArray({ message: `${label} must be a list.` })(target, key);
    if (rule.min > 0) {
      ArrayMinSize(rule.min, { message: `Give at least ${rule.min} ${rule.item}${rule.min === 1 ? '' : 's'}.` })(target, key);
    }
    ArrayMaxSize(rule.max, { message: `Give at most ${rule.max} ${rule.item}s.` })(target, key);
    if (rule.unique) {
      const pick = rule.unique;
      ArrayUnique((v: unknown) => (isObj(v) ? pick(v) : v), { message: rule.uniqueMessage ?? `Each ${rule.item} must be unique.` })(target, key);
    }
    ValidateNested({ each: true, message: `Each ${rule.item} must be an object.` })(target, key);
    Type(cls)(target, key);
  };
}

/**
 * What is wrong with a leverage ratio (a number or a list of `{wheelTravelMm, ratio}` points), in plain
 * English, or undefined when it is valid. Used by the validator and usable by forms.
 * @example leverageRatioProblem([{ wheelTravelMm: 0, ratio: 2.5 }, { wheelTravelMm: 0, ratio: 2 }]) // "Point 2 of the leverage curve: ..."
 */
export function leverageRatioProblem(value: unknown): string | undefined {
  const ratioText = `more than 0 and at most ${MAX_RATIO}`;
  if (typeof value === 'number') {
    return Number.isFinite(value) && value > 0 && value <= MAX_RATIO ? undefined : `Leverage ratio must be ${ratioText}.`;
  }
  if (!Array.isArray(value)) return 'Leverage ratio must be a number or a list of points with wheelTravelMm and ratio.';
  if (value.length < 1) return 'The leverage curve needs at least one point.';
  if (value.length > MAX_LEVERAGE_POINTS) return `The leverage curve can have at most ${MAX_LEVERAGE_POINTS} points.`;
  let previous = -Infinity;
  for (const [i, p] of value.entries()) {
    const at = `Point ${i + 1} of the leverage curve`;
    if (!isObj(p) || !hasOnlyKeys(p, ['wheelTravelMm', 'ratio'])) return `${at} must have exactly wheelTravelMm and ratio.`;
    const { wheelTravelMm: s, ratio } = p;
    if (!isFiniteNumber(s) || s < 0 || s > MAX_CURVE_TRAVEL_MM) {
      return `${at}: wheel travel must be a number from 0 to ${MAX_CURVE_TRAVEL_MM} mm.`;
    }
    if (!isFiniteNumber(ratio) || ratio <= 0 || ratio > MAX_RATIO) return `${at}: ratio must be ${ratioText}.`;
    if (s <= previous) return `${at}: wheel travel must be greater than at point ${i}.`;
    previous = s;
  }
  return undefined;
}

/**
 * What is wrong with a sag reading (a number or a `{down, up}` pair, mm), or undefined when it is valid.
 * @example sagReadingProblem({ down: 540 }, 'The rider reading') // "The rider reading must be a number, or a pair with down and up."
 */
export function sagReadingProblem(value: unknown, label: string): string | undefined {
  const inRange = (v: unknown): boolean => isFiniteNumber(v) && v >= 0 && v <= MAX_READING_MM;
  const range = `from 0 to ${MAX_READING_MM} mm`;
  if (typeof value === 'number') return inRange(value) ? undefined : `${label} must be a number ${range}.`;
  if (!isObj(value) || !hasOnlyKeys(value, ['down', 'up'])) return `${label} must be a number, or a pair with down and up.`;
  if (!inRange(value.down) || !inRange(value.up)) return `${label}: down and up must be numbers ${range}.`;
  return undefined;
}

const readingValue = (v: unknown): number | undefined =>
  isFiniteNumber(v) ? v : isObj(v) && isFiniteNumber(v.down) && isFiniteNumber(v.up) ? (v.down + v.up) / 2 : undefined;

const ratioSchema = { type: 'number', exclusiveMinimum: 0, maximum: MAX_RATIO };
const leverageSchema = {
  description: 'Wheel travel per shock travel: one number, or a curve of points with rising wheel travel.',
  oneOf: [
    ratioSchema,
    {
      type: 'array',
      minItems: 1,
      maxItems: MAX_LEVERAGE_POINTS,
      items: {
        type: 'object',
        additionalProperties: false,
        required: ['wheelTravelMm', 'ratio'],
        properties: { wheelTravelMm: { type: 'number', minimum: 0, maximum: MAX_CURVE_TRAVEL_MM }, ratio: ratioSchema },
      },
    },
  ],
};
const readingMm = { type: 'number', minimum: 0, maximum: MAX_READING_MM };
const sagReadingSchema = {
  oneOf: [readingMm, { type: 'object', additionalProperties: false, required: ['down', 'up'], properties: { down: readingMm, up: readingMm } }],
};

/** Number or leverage curve, validated as a whole (class-transformer cannot type a union). */
function LeverageRatioField(): PropertyDecorator {
  return ValidateBy(
    { name: 'leverageRatio', constraints: [describedAs(leverageSchema)], validator: { validate: (v: unknown) => leverageRatioProblem(v) === undefined } },
    { message: (args: ValidationArguments) => leverageRatioProblem(args.value) ?? 'Leverage ratio is not valid.' },
  );
}

function SagReadingField(label: string): PropertyDecorator {
  return ValidateBy(
    { name: 'sagReading', constraints: [describedAs({ ...sagReadingSchema, description: `${label}, mm: one reading, or the mean of one pushed down and one lifted up` })], validator: { validate: (v: unknown) => sagReadingProblem(v, label) === undefined } },
    { message: (args: ValidationArguments) => sagReadingProblem(args.value, label) ?? `${label} is not valid.` },
  );
}

const riderSagTarget = (o: Obj): number | undefined => {
  const t = o.targets;
  return isObj(t) && isFiniteNumber(t.riderSagMm) ? t.riderSagMm : undefined;
};

/** Full travel must exceed the rider-sag target (skipped while the target itself is invalid). */
const TravelAboveRiderSag = (label: string): PropertyDecorator =>
  Satisfies(
    'travelAboveRiderSag',
    (v, o) => {
      const target = riderSagTarget(o);
      return !isFiniteNumber(v) || target === undefined || v > target;
    },
    `${label} must be more than the rider sag target.`,
  );

export class LoadDto implements Load {
  @NumberField('Mass', { min: 0, exclusiveMin: true, max: 500, unit: 'kg' })
  massKg!: number;

  @NumberField('Position', { min: -1000, max: 5000, unit: 'mm' })
  positionMm!: number;
}

export class LoadCaseDto implements LoadCase {
  @IsDefined({ message: 'Each load case needs a name.' })
  @IsString({ message: 'The load case name must be text.' })
  @Length(1, 60, { message: 'The load case name must be 1 to 60 characters.' })
  name!: string;

  @IsDefined({ message: 'Each load case needs its loads.' })
  @ListField('Loads', () => LoadDto, { min: 1, max: MAX_LOADS, item: 'load' })
  loads!: LoadDto[];
}

export class SagTargetsDto implements SagTargets {
  @NumberField('Static sag target', { min: 0, max: 500, unit: 'mm' })
  staticSagMm!: number;

  @Satisfies(
    'riderSagAboveStatic',
    (v, o) => !isFiniteNumber(v) || !isFiniteNumber(o.staticSagMm) || v > o.staticSagMm,
    'Rider sag target must be more than the static sag target.',
  )
  @NumberField('Rider sag target', { min: 0, exclusiveMin: true, max: 500, unit: 'mm' })
  riderSagMm!: number;
}

export class PreloadRangeDto implements PreloadRange {
  @NumberField('Minimum preload', { min: 0, max: 100, unit: 'mm' })
  min!: number;

  @Satisfies(
    'maxNotBelowMin',
    (v, o) => !isFiniteNumber(v) || !isFiniteNumber(o.min) || v >= o.min,
    'Maximum preload must not be less than the minimum preload.',
  )
  @NumberField('Maximum preload', { min: 0, max: 100, unit: 'mm' })
  max!: number;
}

export class InstalledLengthWindowDto implements InstalledLengthWindow {
  @NumberField('Shortest installed length', { min: 0, exclusiveMin: true, max: 1000, unit: 'mm' })
  min!: number;

  @Satisfies(
    'maxNotBelowMin',
    (v, o) => !isFiniteNumber(v) || !isFiniteNumber(o.min) || v >= o.min,
    'The longest installed length must not be less than the shortest.',
  )
  @NumberField('Longest installed length', { min: 0, exclusiveMin: true, max: 1000, unit: 'mm' })
  max!: number;
}

export class ForkSpacerDto implements ForkSpacerInput {
  @NumberField('Stock spacer length', { min: 0, max: 500, unit: 'mm' })
  stockSpacerMm!: number;

  @NumberField('Stock spring free length', { min: 0, exclusiveMin: true, max: 1000, unit: 'mm' })
  stockFreeLengthMm!: number;

  @NumberField('Stock preload', { min: 0, max: 100, unit: 'mm' })
  stockPreloadMm!: number;
}

export class SpringDto implements SpringCandidateInput {
  @IsDefined({ message: 'Each spring needs an id.' })
  @IsString({ message: 'The spring id must be text.' })
  @Length(1, 64, { message: 'The spring id must be 1 to 64 characters.' })
  id!: string;

  @NumberField('Spring rate', { min: 0, exclusiveMin: true, max: 1000, unit: 'N/mm' })
  rateNPerMm!: number;

  @NumberField('Free length', { min: 0, exclusiveMin: true, max: 1000, unit: 'mm' })
  freeLengthMm!: number;

  @Satisfies(
    'solidBelowFree',
    (v, o) => !isFiniteNumber(v) || !isFiniteNumber(o.freeLengthMm) || v < o.freeLengthMm,
    'Solid length must be less than the free length.',
  )
  @NumberField('Solid length', { min: 0, exclusiveMin: true, max: 1000, unit: 'mm', optional: true })
  solidLengthMm?: number;
}

const loadsOrCases = {
  // Loads are checked when given, or when cases are missing (so "missing" is reported on loads).
  loads: (o: Obj): boolean => o.loads !== undefined || o.cases === undefined,
  cases: (o: Obj): boolean => o.cases !== undefined,
};

/** Fields shared by the rear-spring and fork-spring requests. */
abstract class SpringRequestBase {
  @NumberField('Wheelbase', { min: 300, max: 3000, unit: 'mm' })
  wheelbaseMm!: number;

  @NumberField('Sprung mass', { min: 0, exclusiveMin: true, max: 1000, unit: 'kg' })
  sprungMassKg!: number;

  @Satisfies('notBothLoadsAndCases', (_v, o) => o.cases === undefined, 'Give either loads or load cases, not both.')
  @IsDefined({ message: 'Give the loads (rider, passenger, luggage) or a list of load cases.' })
  @ListField('Loads', () => LoadDto, { min: 1, max: MAX_LOADS, item: 'load' })
  @ValidateIf(loadsOrCases.loads)
  loads?: LoadDto[];

  @ListField('Load cases', () => LoadCaseDto, {
    min: 1,
    max: MAX_CASES,
    item: 'load case',
    unique: (c) => c.name,
    uniqueMessage: 'Each load case needs a different name.',
  })
  @ValidateIf(loadsOrCases.cases)
  cases?: LoadCaseDto[];

  @NestedField('Sag targets', () => SagTargetsDto, { plural: true })
  targets!: SagTargetsDto;

  @Satisfies(
    'notBothPreloadForms',
    (_v, o) => o.adjusterInstalledLengthMm === undefined,
    'Give either the preload range or the adjuster’s installed-length window, not both.',
  )
  @NestedField('Preload range', () => PreloadRangeDto)
  @ValidateIf((o: Obj) => o.preloadRangeMm !== undefined || o.adjusterInstalledLengthMm === undefined)
  preloadRangeMm?: PreloadRangeDto;

  @NestedField('Adjuster installed-length window', () => InstalledLengthWindowDto, { optional: true })
  adjusterInstalledLengthMm?: InstalledLengthWindowDto;

  @Satisfies(
    'bandFreeLengthWithWindow',
    (_v, o) => o.adjusterInstalledLengthMm !== undefined,
    'A free length for the rate band applies only with the adjuster’s installed-length window.',
  )
  @NumberField('Free length for the rate band', { min: 0, exclusiveMin: true, max: 1000, unit: 'mm', optional: true })
  bandFreeLengthMm?: number;

  @NumberField('Static sag tolerance', { min: 0, exclusiveMin: true, max: 50, unit: 'mm', optional: true })
  staticSagToleranceMm?: number;

  @ListField('Springs', () => SpringDto, {
    min: 0,
    max: MAX_SPRINGS,
    optional: true,
    item: 'spring',
    unique: (s) => s.id,
    uniqueMessage: 'Each spring needs a different id.',
  })
  springs?: SpringDto[];
}

/** Body of POST /api/calculations/rear-spring. */
export class RearSpringRequestDto extends SpringRequestBase implements RearSpringInput {
  @IsDefined({ message: 'Leverage ratio is required.' })
  @LeverageRatioField()
  leverageRatio!: LeverageRatioInput;

  @TravelAboveRiderSag('Wheel travel')
  @NumberField('Wheel travel', { min: 0, exclusiveMin: true, max: 500, unit: 'mm' })
  wheelTravelMm!: number;

  @NumberField('Shock stroke', { min: 0, exclusiveMin: true, max: 300, unit: 'mm' })
  shockStrokeMm!: number;

  @NumberField('Adjuster pitch', { min: 0, exclusiveMin: true, max: 10, unit: 'mm per turn' })
  adjusterPitchMm!: number;

  @NumberField('Shock count', { min: 1, max: 2, int: true, optional: true })
  shockCount?: number;
}

/** Body of POST /api/calculations/fork-spring. */
export class ForkSpringRequestDto extends SpringRequestBase implements ForkSpringInput {
  @NumberField('Fork angle', { min: 0, max: 60, unit: 'degrees' })
  forkAngleDeg!: number;

  @NumberField('Spring count', { min: 1, max: 4, int: true, optional: true })
  springCount?: number;

  @TravelAboveRiderSag('Fork travel')
  @NumberField('Fork travel', { min: 0, exclusiveMin: true, max: 500, unit: 'mm' })
  forkTravelMm!: number;

  @NumberField('Adjuster pitch', { min: 0, exclusiveMin: true, max: 10, unit: 'mm per turn', optional: true })
  adjusterPitchMm?: number;

  @Satisfies('spacerWithoutAdjuster', (_v, o) => o.adjusterPitchMm === undefined, 'A preload spacer applies only to a fork without an adjuster.')
  @NestedField('Spacer', () => ForkSpacerDto, { optional: true })
  spacer?: ForkSpacerDto;
}

const solidLengthOf = (o: Obj): number | undefined => {
  const { endType, totalCoils, wireDiameterMm } = o;
  if (typeof endType !== 'string' || !SPRING_END_TYPES.includes(endType as SpringEndType)) return undefined;
  if (!isFiniteNumber(totalCoils) || !isFiniteNumber(wireDiameterMm)) return undefined;
  return endCoils(endType as SpringEndType, totalCoils, wireDiameterMm).solidLengthMm;
};

/** Body of POST /api/calculations/spring-geometry. */
export class SpringGeometryRequestDto implements SpringGeometryInput {
  @NumberField('Wire diameter', { min: 0, exclusiveMin: true, max: 50, unit: 'mm' })
  wireDiameterMm!: number;

  @Satisfies(
    'outsideAboveTwoWires',
    (v, o) => !isFiniteNumber(v) || !isFiniteNumber(o.wireDiameterMm) || v > 2 * o.wireDiameterMm,
    'Outside diameter must be more than twice the wire diameter.',
  )
  @NumberField('Outside diameter', { min: 0, exclusiveMin: true, max: 500, unit: 'mm' })
  outsideDiameterMm!: number;

  @Satisfies(
    'activeCoilsLeft',
    (v, o) => {
      const end = o.endType;
      if (!isFiniteNumber(v) || typeof end !== 'string' || !SPRING_END_TYPES.includes(end as SpringEndType)) return true;
      return endCoils(end as SpringEndType, v, 1).activeCoils > 0;
    },
    'Total coils must leave at least some active coils for this end type.',
  )
  @NumberField('Total coils', { min: 0, exclusiveMin: true, max: 200 })
  totalCoils!: number;

  @IsIn(SPRING_END_TYPES, { message: `End type must be one of: ${SPRING_END_TYPES.join(', ')}.` })
  @IsDefined({ message: 'End type is required.' })
  endType!: SpringEndType;

  @IsIn(SPRING_MATERIAL_KEYS, { message: `Material must be one of: ${SPRING_MATERIAL_KEYS.join(', ')}.` })
  @Satisfies('materialOrModulus', (_v, o) => o.shearModulusMPa === undefined, 'Give either a material or a shear modulus, not both.')
  @IsDefined({ message: 'Give a material or a shear modulus.' })
  @ValidateIf((o: Obj) => o.material !== undefined || o.shearModulusMPa === undefined)
  material?: string;

  @NumberField('Shear modulus', { min: 0, exclusiveMin: true, max: 300_000, unit: 'MPa', optional: true })
  shearModulusMPa?: number;

  @Satisfies(
    'freeAboveSolid',
    (v, o) => {
      const solid = solidLengthOf(o);
      return !isFiniteNumber(v) || solid === undefined || v > solid;
    },
    (args) => `Free length must be more than the solid length (${solidLengthOf(args.object as Obj)} mm).`,
  )
  @NumberField('Free length', { min: 0, exclusiveMin: true, max: 1000, unit: 'mm', optional: true })
  freeLengthMm?: number;

  @NumberField('Load', { min: 0, max: 100_000, unit: 'N', optional: true })
  loadN?: number;
}

const endIs = (end: 'rear' | 'front') => (o: Obj) => o.end === end;

/** Body of POST /api/calculations/sag-check. */
export class SagCheckRequestDto implements SagCheckInput {
  @IsIn(['rear', 'front'], { message: 'End must be "rear" or "front".' })
  @IsDefined({ message: 'End ("rear" or "front") is required.' })
  end!: 'rear' | 'front';

  @NumberField('Fully extended reading', { min: 0, exclusiveMin: true, max: MAX_READING_MM, unit: 'mm' })
  extendedMm!: number;

  @Satisfies(
    'staticNotLongerThanExtended',
    (v, o) => {
      const r = readingValue(v);
      return r === undefined || !isFiniteNumber(o.extendedMm) || r <= o.extendedMm;
    },
    'The reading on the bike’s own weight must not be longer than the fully extended reading.',
  )
  @SagReadingField('The reading on the bike’s own weight')
  @IsDefined({ message: 'The reading on the bike’s own weight is required.' })
  staticMm!: SagReading;

  @Satisfies(
    'riderNotLongerThanStatic',
    (v, o) => {
      const r = readingValue(v);
      const s = readingValue(o.staticMm);
      return r === undefined || s === undefined || r <= s;
    },
    'The reading with the rider aboard must not be longer than the reading on the bike’s own weight.',
  )
  @SagReadingField('The reading with the rider aboard')
  @IsDefined({ message: 'The reading with the rider aboard is required.' })
  riderMm!: SagReading;

  @NestedField('Sag targets', () => SagTargetsDto, { plural: true })
  targets!: SagTargetsDto;

  @NumberField('Tolerance', { min: 0, exclusiveMin: true, max: 50, unit: 'mm', optional: true })
  toleranceMm?: number;

  @Satisfies('leverageRearOnly', (_v, o) => o.end === 'rear', 'Leverage ratio applies to the rear only.')
  @LeverageRatioField()
  @IsDefined({ message: 'Leverage ratio is required for the rear.' })
  @ValidateIf((o: Obj) => endIs('rear')(o) || o.leverageRatio !== undefined)
  leverageRatio?: LeverageRatioInput;

  @Satisfies('forkAngleFrontOnly', (_v, o) => o.end === 'front', 'Fork angle applies to the front only.')
  @NumberField('Fork angle', { min: 0, max: 60, unit: 'degrees' })
  @ValidateIf((o: Obj) => endIs('front')(o) || o.forkAngleDeg !== undefined)
  forkAngleDeg?: number;

  @Satisfies('springCountFrontOnly', (_v, o) => o.end === 'front', 'Spring count applies to the front only.')
  @NumberField('Spring count', { min: 1, max: 4, int: true, optional: true })
  springCount?: number;

  @NumberField('Adjuster pitch', { min: 0, exclusiveMin: true, max: 10, unit: 'mm per turn' })
  @ValidateIf((o: Obj) => endIs('rear')(o) || o.adjusterPitchMm !== undefined)
  adjusterPitchMm?: number;

  @NumberField('Rider load', { min: 0, exclusiveMin: true, max: 20_000, unit: 'N', optional: true })
  riderLoadN?: number;

  @NumberField('Bike load', { min: 0, exclusiveMin: true, max: 20_000, unit: 'N', optional: true })
  bikeLoadN?: number;

  @Satisfies('shockCountRearOnly', (_v, o) => o.end === 'rear', 'Shock count applies to the rear only.')
  @NumberField('Shock count', { min: 1, max: 2, int: true, optional: true })
  shockCount?: number;
}

/** The request DTO class of each calculation endpoint, keyed by the last path segment. */
export const CALCULATION_REQUEST_DTOS = {
  'rear-spring': RearSpringRequestDto,
  'fork-spring': ForkSpringRequestDto,
  'spring-geometry': SpringGeometryRequestDto,
  'sag-check': SagCheckRequestDto,
} as const;

import type {
  CasesRecommendationDto,
  FitmentDto,
  ForkRecommendationDto,
  LoadCaseInputDto,
  RecommendationDto,
  RecommendationRequestDto,
  RecommendedSpringDto,
  ResolvedLoadDto,
  RidingStyle,
  SagEndDto,
  ShockRecommendationDto,
  SpringCandidateDto,
} from '../../shared/catalogue';
import { asEnteredCaseName } from '../../shared/catalogue';
import {
  computeForkSpring,
  computeRearSpring,
  EngineInputError,
  type ForkSpringInput,
  type Load,
  type LoadCase,
  type RearSpringInput,
  type SagTargets,
  type SpringCandidateInput,
  type SpringCandidateResult,
} from '../../shared/engine';
import { TtlCache } from '../catalogue/catalogue-cache';
import { fittingSprings, type FittingSpring } from '../catalogue/compatibility.service';
import { AppError } from '../errors';
import { findFitment, toFitmentDto, toFitmentSummary } from '../fitment/fitment.service';

interface BikeData {
  fitment: FitmentDto;
  summary: RecommendationDto['fitment'];
  springs: Map<string, FittingSpring>;
  fork: SpringCandidateInput[];
  shock: SpringCandidateInput[];
}

const stockId = 'stock';

async function loadBike(fitmentId: string): Promise<BikeData> {
  const f = await findFitment(fitmentId);
  if (!f) throw AppError.notFound('The bike');
  const springs = await fittingSprings(fitmentId);
  const asInput = (s: FittingSpring): SpringCandidateInput => ({ id: s.id, rateNPerMm: s.rateNPerMm, freeLengthMm: s.freeLengthMm, solidLengthMm: s.solidLengthMm });
  const fitment = toFitmentDto(f);
  return {
    fitment,
    summary: toFitmentSummary(f),
    springs: new Map(springs.map((s) => [s.id, s])),
    // The stock spring rides along in the same engine run, so it is judged exactly like the catalogue's.
    fork: [...springs.filter((s) => s.end === 'fork').map(asInput), { id: stockId, rateNPerMm: fitment.stockForkRateNPerMm, freeLengthMm: fitment.stockForkFreeLengthMm }],
    shock: [...springs.filter((s) => s.end === 'shock').map(asInput), { id: stockId, rateNPerMm: fitment.stockShockRateNPerMm, freeLengthMm: fitment.stockShockFreeLengthMm }],
  };
}

const styleKey: Record<RidingStyle, keyof Omit<SagEndDto, 'unit'>> = { road: 'road', adventure: 'adventure', 'off-road': 'offRoad' };

/** The fitment's sag targets for a riding style, in mm (a % target is taken of that end's travel). */
export function sagTargetsMm(end: SagEndDto, style: RidingStyle, travelMm: number): SagTargets {
  const pair = end[styleKey[style]];
  const mm = (v: number) => (end.unit === 'pct' ? (v / 100) * travelMm : v);
  return { staticSagMm: mm(pair.static), riderSagMm: mm(pair.rider) };
}

type LoadSet = Pick<LoadCaseInputDto, 'rider' | 'passengerKg' | 'luggage'>;

/**
 * Places a rider, passenger and luggage on the bike's stations; refuses, per field, a station the bike
 * does not have, a load over a station's limit, and a total over the bike's rated load.
 */
export function placeLoads(f: FitmentDto, set: LoadSet, prefix = ''): { loads: ResolvedLoadDto[]; problems: Record<string, string> } {
  const problems: Record<string, string> = {};
  const station = (s: string) => f.loadStations.find((x) => x.station === s);
  const loads: ResolvedLoadDto[] = [];
  const rider = station('rider')!;
  const riderKg = set.rider.massKg + set.rider.gearKg;
  if (riderKg > rider.maxLoadKg) problems[`${prefix}rider.massKg`] = `The rider seat takes at most ${rider.maxLoadKg} kg, rider and gear together; this is ${round(riderKg)} kg.`;
  loads.push({ station: 'rider', massKg: riderKg, positionMm: rider.positionMm });
  if (set.passengerKg) {
    const seat = station('passenger');
    if (!seat) problems[`${prefix}passengerKg`] = 'This bike has no passenger seat.';
    else if (set.passengerKg > seat.maxLoadKg) problems[`${prefix}passengerKg`] = `The passenger seat takes at most ${seat.maxLoadKg} kg.`;
    else loads.push({ station: 'passenger', massKg: set.passengerKg, positionMm: seat.positionMm });
  }
  const perStation = new Map<string, number>();
  for (const [i, l] of (set.luggage ?? []).entries()) {
    if (!l.massKg) continue;
    const st = station(l.station);
    if (!st) {
      problems[`${prefix}luggage.${i}.station`] = `This bike has no ${l.station.replace('-', ' ')} mount.`;
      continue;
    }
    const total = (perStation.get(l.station) ?? 0) + l.massKg;
    perStation.set(l.station, total);
    if (total > st.maxLoadKg) problems[`${prefix}luggage.${i}.massKg`] = `The ${l.station.replace('-', ' ')} takes at most ${st.maxLoadKg} kg; this makes ${round(total)} kg.`;
    loads.push({ station: l.station, massKg: l.massKg, positionMm: st.positionMm });
  }
  const total = loads.reduce((s, l) => s + l.massKg, 0);
  if (total > f.ratedLoadKg) problems[`${prefix}load`] = `The bike is rated for ${f.ratedLoadKg} kg of riders, gear and luggage; this is ${round(total)} kg.`;
  return { loads, problems };
}

const round = (n: number) => Math.round(n * 10) / 10;
const engineLoads = (loads: ResolvedLoadDto[]): Load[] => loads.map((l) => ({ massKg: l.massKg, positionMm: l.positionMm }));

// Field by field rather than spread: this runs for every candidate of every request.
function candidate(c: SpringCandidateResult): SpringCandidateDto {
  const out: SpringCandidateDto = {
    id: c.id,
    rateNPerMm: c.rateNPerMm,
    preloadNeededMm: c.preloadNeededMm,
    preloadMm: c.preloadMm,
    preloadRangeMm: c.preloadRangeMm,
    installedLengthMm: c.installedLengthMm,
    staticSagMm: c.staticSagMm,
    riderSagMm: c.riderSagMm,
    verdict: c.verdict,
    reason: c.reason,
  };
  if (c.adjusterTurns !== undefined) out.adjusterTurns = c.adjusterTurns;
  if (c.spacerLengthMm !== undefined) out.spacerLengthMm = c.spacerLengthMm;
  if (c.coilBindMarginMm !== undefined) out.coilBindMarginMm = c.coilBindMarginMm;
  return out;
}

function enrich(bike: BikeData, c: SpringCandidateResult): RecommendedSpringDto {
  const s = bike.springs.get(c.id)!;
  const out = candidate(c) as RecommendedSpringDto;
  out.sku = s.sku;
  out.name = s.name;
  out.priceCents = s.priceCents;
  out.currency = 'EUR';
  out.inStock = s.inStock;
  out.freeLengthMm = s.freeLengthMm;
  out.adapters = s.adapters;
  return out;
}

/** Splits the engine's candidates into the catalogue's (enriched) and the stock spring. */
function split(bike: BikeData, candidates: SpringCandidateResult[]): { candidates: RecommendedSpringDto[]; stock: SpringCandidateDto } {
  return {
    candidates: candidates.filter((c) => c.id !== stockId).map((c) => enrich(bike, c)),
    stock: candidate(candidates.find((c) => c.id === stockId)!),
  };
}

export type BikeCache = TtlCache<BikeData>;

/** Each app keeps its own copy of what recommendations read, for `ttlMs` at most. */
export function createBikeCache(ttlMs: number): BikeCache {
  return new TtlCache<BikeData>(ttlMs);
}

/**
 * The rider's spring choice: places the loads on the bike, takes the sag targets for the riding style,
 * runs the engine for fork and shock over the springs that fit, and adds SKU, price and adapters.
 */
export async function recommend(dto: RecommendationRequestDto, cache: BikeCache): Promise<RecommendationDto> {
  const bike = await cache.getOrLoad(dto.fitmentId, () => loadBike(dto.fitmentId));
  const f = bike.fitment;

  const main = placeLoads(f, dto);
  const problems = { ...main.problems };
  const cases: LoadCase[] | undefined = dto.cases && [
    { name: asEnteredCaseName, loads: engineLoads(main.loads) },
    ...dto.cases.map((c, i) => {
      const placed = placeLoads(f, c, `cases.${i}.`);
      Object.assign(problems, placed.problems);
      return { name: c.name, loads: engineLoads(placed.loads) };
    }),
  ];
  if (Object.keys(problems).length) throw AppError.validation(Object.values(problems)[0]!, problems);

  const forkTargets = sagTargetsMm(f.sag.front, dto.ridingStyle, f.forkTravelMm);
  const shockTargets = sagTargetsMm(f.sag.rear, dto.ridingStyle, f.rearWheelTravelMm);
  const loadsOrCases = cases ? { cases } : { loads: engineLoads(main.loads) };
  const forkInput: ForkSpringInput = {
    wheelbaseMm: f.wheelbaseMm,
    sprungMassKg: f.frontSprungMassKg,
    ...loadsOrCases,
    forkAngleDeg: f.forkAngleDeg,
    springCount: f.forkSpringCount,
    forkTravelMm: f.forkTravelMm,
    targets: forkTargets,
    preloadRangeMm: { min: f.forkPreloadMinMm, max: f.forkPreloadMaxMm },
    ...(f.forkAdjusterPitchMm === null ? {} : { adjusterPitchMm: f.forkAdjusterPitchMm }),
    springs: bike.fork,
  };
  const shockInput: RearSpringInput = {
    wheelbaseMm: f.wheelbaseMm,
    sprungMassKg: f.rearSprungMassKg,
    ...loadsOrCases,
    leverageRatio: f.rearLeverageCurve ?? f.rearLeverageRatio!,
    wheelTravelMm: f.rearWheelTravelMm,
    shockStrokeMm: f.shockStrokeMm,
    targets: shockTargets,
    preloadRangeMm: { min: f.rearPreloadMinMm, max: f.rearPreloadMaxMm },
    adjusterPitchMm: f.rearAdjusterPitchMm,
    springs: bike.shock,
  };

  let fork: RecommendationDto['fork'];
  let shock: RecommendationDto['shock'];
  try {
    const fr = computeForkSpring(forkInput);
    const rr = computeRearSpring(shockInput);
    if ('cases' in fr && 'cases' in rr) {
      fork = casesShape(bike, fr, (c) => ({ frontLoadN: c.frontLoadN, bikeLoadN: c.bikeLoadN, requiredRate: c.requiredRate, ...split(bike, c.candidates) }));
      shock = casesShape(bike, rr, (c) => ({ rearLoadN: c.rearLoadN, bikeLoadN: c.bikeLoadN, requiredRate: c.requiredRate, ...split(bike, c.candidates) }));
    } else if (!('cases' in fr) && !('cases' in rr)) {
      fork = { frontLoadN: fr.frontLoadN, bikeLoadN: fr.bikeLoadN, requiredRate: fr.requiredRate, ...split(bike, fr.candidates) } satisfies ForkRecommendationDto;
      shock = { rearLoadN: rr.rearLoadN, bikeLoadN: rr.bikeLoadN, requiredRate: rr.requiredRate, ...split(bike, rr.candidates) } satisfies ShockRecommendationDto;
    } else {
      throw new Error('The engine answered fork and shock in different shapes');
    }
  } catch (e) {
    // The bike's own figures (e.g. a leverage curve that cannot meet its sag targets) are for the shop to fix, not the rider.
    if (e instanceof EngineInputError && !e.field.endsWith('loads')) {
      throw new AppError('conflict', `This bike's suspension figures cannot give a recommendation yet; the shop needs to check them. ${e.message}`);
    }
    // Field checks passed but the physics did not (e.g. a load that lifts a wheel off the ground).
    if (e instanceof RangeError) throw AppError.validation(e.message, { load: e.message });
    throw e;
  }

  return {
    fitment: bike.summary,
    ridingStyle: dto.ridingStyle,
    targets: { fork: forkTargets, shock: shockTargets },
    loads: main.loads,
    fork,
    shock,
  };
}

function casesShape<C extends { name: string; candidates: SpringCandidateResult[] }, R>(
  _bike: BikeData,
  result: { cases: C[]; coversAllCases: string[]; uncoveredBy: Record<string, string> },
  map: (c: C) => R,
): CasesRecommendationDto<R> {
  const { [stockId]: _stock, ...uncoveredBy } = result.uncoveredBy;
  return {
    cases: result.cases.map((c) => ({ name: c.name, ...map(c) })),
    coversAllCases: result.coversAllCases.filter((id) => id !== stockId),
    uncoveredBy,
  };
}

import type {
  CasesRecommendationDto,
  FitmentDto,
  ForkRecommendationDto,
  RecommendationDto,
  RecommendationRequestDto,
  RecommendedSpringDto,
  ResolvedLoadDto,
  ShockRecommendationDto,
  SpringCandidateDto,
} from '../../shared/catalogue';
import { asEnteredCaseName } from '../../shared/catalogue';
import {
  computeForkSpring,
  computeRearSpring,
  EngineInputError,
  roundAnswer,
  type Load,
  type LoadCase,
  type RearSpringResult,
  type SpringCandidateInput,
  type SpringCandidateResult,
} from '../../shared/engine';
import { TtlCache } from '../catalogue/catalogue-cache';
import { fittingSprings, type FittingSpring } from '../catalogue/compatibility.service';
import { AppError } from '../errors';
import { findFitment, toFitmentDto, toFitmentSummary } from '../fitment/fitment.service';
import { engineInputs } from './engine-input';
import { placeLoads } from './place-loads';

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

/** What fork and shock answers share, from the engine. */
type EndResult = Pick<RearSpringResult, 'bikeLoadN' | 'requiredRate' | 'rateBand' | 'staticSagToleranceMm' | 'candidates'>;

function endOf(bike: BikeData, c: EndResult) {
  return {
    bikeLoadN: c.bikeLoadN,
    requiredRate: c.requiredRate,
    ...(c.rateBand === undefined ? {} : { rateBand: c.rateBand }),
    staticSagToleranceMm: c.staticSagToleranceMm,
    ...split(bike, c.candidates),
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

  const loadsOrCases = cases ? { cases } : { loads: engineLoads(main.loads) };
  const input = engineInputs(f, dto.ridingStyle, loadsOrCases, { fork: bike.fork, shock: bike.shock });
  const endShape = (c: EndResult) => endOf(bike, c);

  let fork: RecommendationDto['fork'];
  let shock: RecommendationDto['shock'];
  try {
    const fr = computeForkSpring(input.fork);
    const rr = computeRearSpring(input.shock);
    if ('cases' in fr && 'cases' in rr) {
      fork = casesShape(fr, (c) => ({ frontLoadN: c.frontLoadN, ...endShape(c) }));
      shock = casesShape(rr, (c) => ({ rearLoadN: c.rearLoadN, ...endShape(c) }));
    } else if (!('cases' in fr) && !('cases' in rr)) {
      fork = { frontLoadN: fr.frontLoadN, ...endShape(fr) } satisfies ForkRecommendationDto;
      shock = { rearLoadN: rr.rearLoadN, ...endShape(rr) } satisfies ShockRecommendationDto;
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

  // Rounded once, at the edge, by the same rule as the calculation API.
  return roundAnswer({
    fitment: bike.summary,
    ridingStyle: dto.ridingStyle,
    targets: {
      fork: { ...input.fork.targets, staticSagToleranceMm: input.fork.staticSagToleranceMm ?? 3 },
      shock: { ...input.shock.targets, staticSagToleranceMm: input.shock.staticSagToleranceMm ?? 3 },
    },
    loads: main.loads,
    fork,
    shock,
  });
}

function casesShape<C extends { name: string; candidates: SpringCandidateResult[] }, R>(
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

import type { AdapterNeedDto } from '../catalogue/compatibility.dto';
import { asEnteredCaseName, type SpringEnd } from '../catalogue/constants';
import type { FitmentDto, FitmentSummaryDto } from '../catalogue/fitment.dto';
import type {
  CasesRecommendationDto,
  ForkRecommendationDto,
  LoadCaseInputDto,
  RecommendationDto,
  RecommendationRequestDto,
  RecommendedSpringDto,
  ResolvedLoadDto,
  ShockRecommendationDto,
  SpringCandidateDto,
} from '../catalogue/recommendation.dto';
import { EngineInputError } from '../engine/errors';
import { computeForkSpring } from '../engine/fork';
import { computeRearSpring } from '../engine/rear';
import { roundAnswer } from '../engine/rounding';
import type { Load, LoadCase, RearSpringResult, SpringCandidateInput, SpringCandidateResult } from '../engine/types';
import { engineInputs, type EngineInputs } from './engine-input';
import { placeLoads } from './place-loads';

/** A catalogue spring that fits the bike, with the adapters it needs there. */
export interface FittingSpringDto {
  id: string;
  sku: string;
  name: string;
  end: SpringEnd;
  rateNPerMm: number;
  freeLengthMm: number;
  solidLengthMm: number;
  priceCents: number;
  inStock: boolean;
  adapters: AdapterNeedDto[];
}

/** Everything a recommendation reads about one bike: fetched once by the finder, cached by the server. */
export interface BikeForRecommendationDto {
  fitment: FitmentDto;
  summary: FitmentSummaryDto;
  springs: FittingSpringDto[];
}

/** A load set the rider entered (top level or one case); class-validator has checked it on the server. */
export type RecommendationRequest = Pick<RecommendationRequestDto, 'fitmentId' | 'ridingStyle' | 'rider' | 'passengerKg' | 'luggage'> & {
  cases?: Pick<LoadCaseInputDto, 'name' | 'rider' | 'passengerKg' | 'luggage'>[];
};

/** Why a load cannot be recommended for: the rider's figures (`validation`, per field) or the bike's (`conflict`). */
export class RecommendationProblem extends Error {
  constructor(
    readonly kind: 'validation' | 'conflict',
    message: string,
    readonly fields: Record<string, string> = {},
  ) {
    super(message);
  }
}

const stockId = 'stock';

interface Prepared {
  springs: Map<string, FittingSpringDto>;
  fork: SpringCandidateInput[];
  shock: SpringCandidateInput[];
}
// Derived once per bike object: the server reuses a cached bike for many requests, the finder for every keystroke.
const prepared = new WeakMap<BikeForRecommendationDto, Prepared>();

function prepare(bike: BikeForRecommendationDto): Prepared {
  const known = prepared.get(bike);
  if (known) return known;
  const f = bike.fitment;
  const asInput = (s: FittingSpringDto): SpringCandidateInput => ({ id: s.id, rateNPerMm: s.rateNPerMm, freeLengthMm: s.freeLengthMm, solidLengthMm: s.solidLengthMm });
  const p: Prepared = {
    springs: new Map(bike.springs.map((s) => [s.id, s])),
    // The stock spring rides along in the same engine run, so it is judged exactly like the catalogue's.
    fork: [...bike.springs.filter((s) => s.end === 'fork').map(asInput), { id: stockId, rateNPerMm: f.stockForkRateNPerMm, freeLengthMm: f.stockForkFreeLengthMm }],
    shock: [...bike.springs.filter((s) => s.end === 'shock').map(asInput), { id: stockId, rateNPerMm: f.stockShockRateNPerMm, freeLengthMm: f.stockShockFreeLengthMm }],
  };
  prepared.set(bike, p);
  return p;
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

function enrich(p: Prepared, c: SpringCandidateResult): RecommendedSpringDto {
  const s = p.springs.get(c.id)!;
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

/** What fork and shock answers share, from the engine. */
type EndResult = Pick<RearSpringResult, 'bikeLoadN' | 'requiredRate' | 'rateBand' | 'staticSagToleranceMm' | 'candidates'>;

function endOf(p: Prepared, c: EndResult) {
  return {
    bikeLoadN: c.bikeLoadN,
    requiredRate: c.requiredRate,
    ...(c.rateBand === undefined ? {} : { rateBand: c.rateBand }),
    staticSagToleranceMm: c.staticSagToleranceMm,
    candidates: c.candidates.filter((x) => x.id !== stockId).map((x) => enrich(p, x)),
    stock: candidate(c.candidates.find((x) => x.id === stockId)!),
  };
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

/**
 * The engine input for a rider's load on a bike: loads placed on the bike's stations (each case's too), sag targets
 * for the riding style, and the fitting springs with the stock one. Throws RecommendationProblem per field.
 */
export function recommendationInput(bike: BikeForRecommendationDto, dto: RecommendationRequest): { inputs: EngineInputs; loads: ResolvedLoadDto[] } {
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
  if (Object.keys(problems).length) throw new RecommendationProblem('validation', Object.values(problems)[0]!, problems);
  const p = prepare(bike);
  const loadsOrCases = cases ? { cases } : { loads: engineLoads(main.loads) };
  return { inputs: engineInputs(f, dto.ridingStyle, loadsOrCases, { fork: p.fork, shock: p.shock }), loads: main.loads };
}

/**
 * The rider's spring choice, the one rule for server and finder: places the loads, runs the engine for fork and shock
 * over the springs that fit, adds SKU, price and adapters, and rounds once at the edge like the calculation API.
 */
export function recommendFor(bike: BikeForRecommendationDto, dto: RecommendationRequest): RecommendationDto {
  const { inputs: input, loads } = recommendationInput(bike, dto);
  const p = prepare(bike);
  const endShape = (c: EndResult) => endOf(p, c);

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
      throw new RecommendationProblem('conflict', `This bike's suspension figures cannot give a recommendation yet; the shop needs to check them. ${e.message}`);
    }
    // Field checks passed but the physics did not (e.g. a load that lifts a wheel off the ground).
    if (e instanceof RangeError) throw new RecommendationProblem('validation', e.message, { load: e.message });
    throw e;
  }

  return roundAnswer({
    fitment: bike.summary,
    ridingStyle: dto.ridingStyle,
    targets: {
      fork: { ...input.fork.targets, staticSagToleranceMm: input.fork.staticSagToleranceMm ?? 3 },
      shock: { ...input.shock.targets, staticSagToleranceMm: input.shock.staticSagToleranceMm ?? 3 },
    },
    loads,
    fork,
    shock,
  });
}

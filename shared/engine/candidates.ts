import { EngineInputError } from './errors';
import { adjusterTurnsFromFullyOut, forkSpacerLength, springPreload, type PreloadSetting } from './preload';
import type {
  CasesResult,
  ForkSpacerInput,
  Load,
  LoadCase,
  PreloadRange,
  RateInUnitsLike,
  SagTargets,
  SpringCandidateInput,
  SpringCandidateResult,
} from './types';
import { judgeSpring } from './verdict';

/**
 * Clamps a needed preload to the adjuster's range.
 * @example clampPreload(25, { min: 2, max: 20 }) // 20
 */
export function clampPreload(preloadNeededMm: number, range: PreloadRange): number {
  return Math.min(range.max, Math.max(range.min, preloadNeededMm));
}

/**
 * Coil-bind margin: room left between the solid length and the spring's fullest compression.
 * @example coilBindMargin(229, 110, 10, 95) // 14
 */
export function coilBindMargin(freeLengthMm: number, solidLengthMm: number, preloadMm: number, strokeMm: number): number {
  return freeLengthMm - solidLengthMm - (preloadMm + strokeMm);
}

/** What an end (shock or fork) contributes to judging one spring. */
export interface CandidateContext {
  preload: PreloadSetting;
  adjusterPitchMm?: number;
  /** How far the spring compresses beyond preload at full travel (shock stroke, fork travel), mm. */
  strokeMm: number;
  targets: SagTargets;
  staticSagToleranceMm: number;
  spacer?: ForkSpacerInput;
}

/** The sags an end predicts for one preload set, and whether rider sag comes to rest on its target there. */
export interface PredictedSags {
  staticSagMm: number;
  riderSagMm: number;
  settles: boolean;
}

/**
 * Assembles one candidate's result from the preload it needs and the end's sag predictor, judged by `judgeSpring`.
 * @example buildCandidate(spring, 12, ctx, (p) => ({ staticSagMm: 25, riderSagMm: 66, settles: true }))
 */
export function buildCandidate(
  spring: SpringCandidateInput,
  preloadNeededMm: number,
  ctx: CandidateContext,
  sagsAt: (preloadMm: number) => PredictedSags,
): SpringCandidateResult {
  const { range, fullyOutMm } = springPreload(ctx.preload, spring.freeLengthMm);
  const preloadMm = clampPreload(preloadNeededMm, range);
  const margin =
    spring.solidLengthMm === undefined ? undefined : coilBindMargin(spring.freeLengthMm, spring.solidLengthMm, preloadMm, ctx.strokeMm);
  const sags = sagsAt(preloadMm);
  const { verdict, reason } = judgeSpring({
    preloadNeededMm,
    preloadRangeMm: range,
    settles: sags.settles,
    staticSagMm: sags.staticSagMm,
    targets: ctx.targets,
    staticSagToleranceMm: ctx.staticSagToleranceMm,
    coilBindMarginMm: margin,
  });
  // Keys in the documented order, optional ones only when known.
  return {
    id: spring.id,
    rateNPerMm: spring.rateNPerMm,
    preloadNeededMm,
    preloadMm,
    preloadRangeMm: range,
    ...(ctx.adjusterPitchMm === undefined ? {} : { adjusterTurns: adjusterTurnsFromFullyOut(preloadMm, fullyOutMm, ctx.adjusterPitchMm) }),
    ...(ctx.adjusterPitchMm === undefined && ctx.spacer !== undefined
      ? { spacerLengthMm: forkSpacerLength(ctx.spacer, spring.freeLengthMm, preloadMm) }
      : {}),
    installedLengthMm: spring.freeLengthMm - preloadMm,
    staticSagMm: sags.staticSagMm,
    riderSagMm: sags.riderSagMm,
    ...(margin === undefined ? {} : { coilBindMarginMm: margin }),
    verdict,
    reason,
  };
}

/**
 * Orders candidates best first: `ok` ones by closeness to the required rate, then the rest by closeness.
 * Stable, so equal candidates keep their input order. Returns a new array.
 * @example rankCandidates(results, 58)
 */
export function rankCandidates(candidates: readonly SpringCandidateResult[], requiredRateNPerMm: number): SpringCandidateResult[] {
  const key = (c: SpringCandidateResult): number => Math.abs(c.rateNPerMm - requiredRateNPerMm);
  return [...candidates].sort((a, b) => {
    const okA = a.verdict === 'ok' ? 0 : 1;
    const okB = b.verdict === 'ok' ? 0 : 1;
    return okA - okB || key(a) - key(b);
  });
}

interface CaseOutcome<R> {
  name: string;
  result: R & { candidates: SpringCandidateResult[] };
  requiredRateNPerMm: number;
}

/**
 * Merges per-case results: `coversAllCases` lists the spring ids that are `ok` in every case (by `judgeSpring`), ordered by
 * their summed distance from each case's required rate; `uncoveredBy` maps every other spring id to the
 * first case (in input order) that breaks it.
 * @example combineCases([{ name: 'solo', result, requiredRateNPerMm: 58 }], ['R-58'])
 */
export function combineCases<R extends { candidates: SpringCandidateResult[] }>(
  outcomes: readonly CaseOutcome<R>[],
  springIds: readonly string[],
): CasesResult<R> {
  // A Map, not an object, so ids such as "__proto__" stay plain data.
  const breaking = new Map<string, string>();
  const distance = new Map<string, number>();
  for (const id of springIds) distance.set(id, 0);
  for (const o of outcomes) {
    for (const c of o.result.candidates) {
      distance.set(c.id, (distance.get(c.id) ?? 0) + Math.abs(c.rateNPerMm - o.requiredRateNPerMm));
      if (c.verdict !== 'ok' && !breaking.has(c.id)) breaking.set(c.id, o.name);
    }
  }
  const coversAllCases = springIds
    .filter((id) => !breaking.has(id))
    .sort((a, b) => (distance.get(a) ?? 0) - (distance.get(b) ?? 0));
  return {
    cases: outcomes.map((o) => ({ name: o.name, ...o.result })),
    coversAllCases,
    uncoveredBy: Object.fromEntries(breaking),
  };
}

/**
 * Tells a load-cases result from a single-load one.
 * @example if (isCasesResult(result)) console.log(result.coversAllCases)
 */
export function isCasesResult<R extends object>(result: R | CasesResult<R>): result is CasesResult<R> {
  return 'coversAllCases' in result;
}

/**
 * Runs one end's computation per load case and merges the results with `combineCases`.
 * @example runCases(input.cases, input.springs ?? [], (loads) => rearForLoads(input, curve, loads))
 */
export function runCases<R extends { candidates: SpringCandidateResult[]; requiredRate: RateInUnitsLike }>(
  cases: readonly LoadCase[],
  springs: readonly SpringCandidateInput[],
  run: (loads: readonly Load[]) => R,
): CasesResult<R> {
  const outcomes = cases.map((c, i) => {
    let result: R;
    try {
      result = run(c.loads);
    } catch (e) {
      // Name the case, so the 400 points at the loads that broke the physics.
      if (e instanceof EngineInputError) {
        throw new EngineInputError(e.field === 'loads' ? `cases.${i}.loads` : e.field, `In the case “${c.name}”: ${e.message}`);
      }
      throw e;
    }
    return { name: c.name, result, requiredRateNPerMm: result.requiredRate.nPerMm };
  });
  return combineCases(outcomes, springs.map((s) => s.id));
}

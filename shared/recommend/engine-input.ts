import type { FitmentDto, RidingStyle, SagEndDto } from '../catalogue';
import type { ForkSpringInput, InstalledLengthWindow, Load, LoadCase, RearSpringInput, SagTargets, SpringCandidateInput } from '../engine';

const styleKey: Record<RidingStyle, keyof Omit<SagEndDto, 'unit'>> = { road: 'road', adventure: 'adventure', 'off-road': 'offRoad' };

/** The fitment's sag targets for a riding style, in mm (a % target is taken of that end's travel). */
export function sagTargetsMm(end: SagEndDto, style: RidingStyle, travelMm: number): SagTargets {
  const pair = end[styleKey[style]];
  const mm = (v: number) => (end.unit === 'pct' ? (v / 100) * travelMm : v);
  return { staticSagMm: mm(pair.static), riderSagMm: mm(pair.rider) };
}

/**
 * The adjuster's installed-length window from the stock spring and the fitment's preload range: fully out the stock
 * spring sits at free − min preload, fully in at free − max preload. Another spring's preload then follows its own free length.
 * @example adjusterWindow(170, 2, 16) // { min: 154, max: 168 }
 */
export function adjusterWindow(stockFreeLengthMm: number, preloadMinMm: number, preloadMaxMm: number): InstalledLengthWindow {
  return { min: stockFreeLengthMm - preloadMaxMm, max: stockFreeLengthMm - preloadMinMm };
}

export interface EngineInputs {
  fork: ForkSpringInput;
  shock: RearSpringInput;
}

/**
 * Builds the fork and shock engine requests from a fitment: sag targets for the riding style, each end's static-sag
 * tolerance, the adjuster window derived from the stock spring (with the rate band for the stock free length), the
 * number of shocks, and the spacer of a fork without an adjuster. The one place a fitment becomes engine input.
 */
export function engineInputs(
  f: FitmentDto,
  style: RidingStyle,
  loadsOrCases: { loads: Load[] } | { cases: LoadCase[] },
  springs: { fork: SpringCandidateInput[]; shock: SpringCandidateInput[] },
): EngineInputs {
  const spacer =
    f.forkAdjusterPitchMm === null && f.forkStockSpacerMm !== null && f.forkStockSpacerMm !== undefined
      ? { stockSpacerMm: f.forkStockSpacerMm, stockFreeLengthMm: f.stockForkFreeLengthMm, stockPreloadMm: f.forkStockPreloadMm ?? f.forkPreloadMinMm }
      : undefined;
  const fork: ForkSpringInput = {
    wheelbaseMm: f.wheelbaseMm,
    sprungMassKg: f.frontSprungMassKg,
    ...loadsOrCases,
    forkAngleDeg: f.forkAngleDeg,
    springCount: f.forkSpringCount,
    forkTravelMm: f.forkTravelMm,
    targets: sagTargetsMm(f.sag.front, style, f.forkTravelMm),
    adjusterInstalledLengthMm: adjusterWindow(f.stockForkFreeLengthMm, f.forkPreloadMinMm, f.forkPreloadMaxMm),
    bandFreeLengthMm: f.stockForkFreeLengthMm,
    staticSagToleranceMm: f.frontStaticSagToleranceMm ?? 3,
    ...(f.forkAdjusterPitchMm === null ? {} : { adjusterPitchMm: f.forkAdjusterPitchMm }),
    ...(spacer === undefined ? {} : { spacer }),
    springs: springs.fork,
  };
  const shock: RearSpringInput = {
    wheelbaseMm: f.wheelbaseMm,
    sprungMassKg: f.rearSprungMassKg,
    ...loadsOrCases,
    leverageRatio: f.rearLeverageCurve ?? f.rearLeverageRatio!,
    wheelTravelMm: f.rearWheelTravelMm,
    shockStrokeMm: f.shockStrokeMm,
    targets: sagTargetsMm(f.sag.rear, style, f.rearWheelTravelMm),
    adjusterInstalledLengthMm: adjusterWindow(f.stockShockFreeLengthMm, f.rearPreloadMinMm, f.rearPreloadMaxMm),
    bandFreeLengthMm: f.stockShockFreeLengthMm,
    staticSagToleranceMm: f.rearStaticSagToleranceMm ?? 3,
    adjusterPitchMm: f.rearAdjusterPitchMm,
    shockCount: f.shockCount ?? 1,
    springs: springs.shock,
  };
  return { fork, shock };
}

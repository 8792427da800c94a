import type { FitmentDto } from '../catalogue/fitment.dto';
import type { EndTargetsDto, RecommendationDto } from '../catalogue/recommendation.dto';
import type { SagCheckInput, SagReading } from '../engine/types';

export interface SagReadings {
  end: 'rear' | 'front';
  extendedMm: number;
  staticMm: SagReading;
  riderMm: SagReading;
}

type SagTargetsOfEnd = Pick<EndTargetsDto, 'staticSagMm' | 'riderSagMm'> & Partial<Pick<EndTargetsDto, 'staticSagToleranceMm'>>;

/**
 * What a sag check needs of the bike's load: the targets the finder used and the wheel loads it placed. Without the
 * wheel loads (no load entered) the check works from the readings alone; without a tolerance the engine's own applies.
 */
export interface SagLoadContext {
  targets: { fork: SagTargetsOfEnd; shock: SagTargetsOfEnd };
  fork?: { bikeLoadN: number; frontLoadN: number };
  shock?: { bikeLoadN: number; rearLoadN: number };
}

/** The load context of a recommendation: its targets and, outside the load-cases shape, the wheel loads it placed. */
export function sagLoadOf(r: Pick<RecommendationDto, 'targets' | 'fork' | 'shock'>): SagLoadContext {
  return { targets: r.targets, ...('frontLoadN' in r.fork ? { fork: r.fork } : {}), ...('rearLoadN' in r.shock ? { shock: r.shock } : {}) };
}

/** The bike's figures a sag check reads; an adjuster pitch may be unknown. */
export type BikeFigures = Pick<FitmentDto, 'rearLeverageRatio' | 'rearLeverageCurve' | 'shockCount' | 'forkAngleDeg' | 'forkAdjusterPitchMm' | 'forkSpringCount'> & {
  rearAdjusterPitchMm: number | null;
};

/**
 * The sag-check input for a known bike and load: the bike's own figures, the finder's targets and tolerance, and both
 * wheel loads (which make the check exact on a curved linkage).
 * @example sagCheckInputForBike(fitment, recommendation, { end: 'rear', extendedMm: 600, staticMm: 575, riderMm: 530 })
 */
export function sagCheckInputForBike(bike: BikeFigures, load: SagLoadContext, r: SagReadings): SagCheckInput {
  const t = r.end === 'rear' ? load.targets.shock : load.targets.fork;
  const common = {
    extendedMm: r.extendedMm,
    staticMm: r.staticMm,
    riderMm: r.riderMm,
    targets: { staticSagMm: t.staticSagMm, riderSagMm: t.riderSagMm },
    ...(t.staticSagToleranceMm === undefined ? {} : { toleranceMm: t.staticSagToleranceMm }),
  };
  if (r.end === 'front') {
    return {
      ...common,
      end: 'front',
      forkAngleDeg: bike.forkAngleDeg,
      springCount: bike.forkSpringCount,
      ...(bike.forkAdjusterPitchMm === null ? {} : { adjusterPitchMm: bike.forkAdjusterPitchMm }),
      ...(load.fork ? { bikeLoadN: load.fork.bikeLoadN, riderLoadN: load.fork.frontLoadN } : {}),
    };
  }
  const leverageRatio = bike.rearLeverageCurve?.length ? bike.rearLeverageCurve : (bike.rearLeverageRatio ?? undefined);
  return {
    ...common,
    end: 'rear',
    ...(leverageRatio === undefined ? {} : { leverageRatio }),
    ...(bike.rearAdjusterPitchMm === null ? {} : { adjusterPitchMm: bike.rearAdjusterPitchMm }),
    shockCount: bike.shockCount,
    ...(load.shock ? { bikeLoadN: load.shock.bikeLoadN, riderLoadN: load.shock.rearLoadN } : {}),
  };
}

/**
 * How a bike is named on a card and a setup sheet.
 * @example bikeLabel({ make: 'Demo', model: 'Tourer 700', variant: '', yearFrom: 2019, yearTo: 2023 }) // "Demo Tourer 700 (2019–2023)"
 */
export function bikeLabel(f: { make: string; model: string; variant: string; yearFrom: number; yearTo: number }): string {
  return [f.make, f.model, f.variant].filter(Boolean).join(' ') + ` (${f.yearFrom}–${f.yearTo})`;
}

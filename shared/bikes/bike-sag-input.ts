import type { FitmentDto } from '../catalogue/fitment.dto';
import type { EndTargetsDto } from '../catalogue/recommendation.dto';
import type { SagCheckInput, SagReading } from '../engine/types';

export interface SagReadings {
  end: 'rear' | 'front';
  extendedMm: number;
  staticMm: SagReading;
  riderMm: SagReading;
}

/** What a sag check needs of the bike's load: the targets the finder used and the wheel loads it placed. */
export interface SagLoadContext {
  targets: { fork: EndTargetsDto; shock: EndTargetsDto };
  fork: { bikeLoadN: number; frontLoadN: number };
  shock: { bikeLoadN: number; rearLoadN: number };
}

type BikeFigures = Pick<
  FitmentDto,
  'rearLeverageRatio' | 'rearLeverageCurve' | 'rearAdjusterPitchMm' | 'shockCount' | 'forkAngleDeg' | 'forkAdjusterPitchMm' | 'forkSpringCount'
>;

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
    toleranceMm: t.staticSagToleranceMm,
  };
  if (r.end === 'front') {
    return {
      ...common,
      end: 'front',
      forkAngleDeg: bike.forkAngleDeg,
      springCount: bike.forkSpringCount,
      ...(bike.forkAdjusterPitchMm === null ? {} : { adjusterPitchMm: bike.forkAdjusterPitchMm }),
      bikeLoadN: load.fork.bikeLoadN,
      riderLoadN: load.fork.frontLoadN,
    };
  }
  const leverageRatio = bike.rearLeverageCurve?.length ? bike.rearLeverageCurve : (bike.rearLeverageRatio ?? undefined);
  return {
    ...common,
    end: 'rear',
    ...(leverageRatio === undefined ? {} : { leverageRatio }),
    adjusterPitchMm: bike.rearAdjusterPitchMm,
    shockCount: bike.shockCount,
    bikeLoadN: load.shock.bikeLoadN,
    riderLoadN: load.shock.rearLoadN,
  };
}

/**
 * How a bike is named on a card and a setup sheet.
 * @example bikeLabel({ make: 'Demo', model: 'Tourer 700', variant: '', yearFrom: 2019, yearTo: 2023 }) // "Demo Tourer 700 (2019–2023)"
 */
export function bikeLabel(f: { make: string; model: string; variant: string; yearFrom: number; yearTo: number }): string {
  return [f.make, f.model, f.variant].filter(Boolean).join(' ') + ` (${f.yearFrom}–${f.yearTo})`;
}

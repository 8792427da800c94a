import { sagCheckInputForBike, type BikeFigures, type SagLoadContext } from '@shared/bikes/bike-sag-input';
import type { SagCheckInput } from '@shared/engine';

/** The sag-check page's fields as typed (null: empty); the bike's figures start from the chosen bike and may be changed. */
export interface SagCheckForm {
  end: 'rear' | 'front';
  /** Each reading given as two (pushed down, let up) rather than one. */
  pairs: boolean;
  extended: number | null;
  own: number | null;
  ownDown: number | null;
  ownUp: number | null;
  rider: number | null;
  riderDown: number | null;
  riderUp: number | null;
  staticTarget: number | null;
  riderTarget: number | null;
  tolerance: number | null;
  leverage: number | null;
  pitch: number | null;
  forkAngle: number | null;
}

type BikeOnPage = BikeFigures | null;

const num = (v: number | null) => (v === null || Number.isNaN(v) ? undefined : v);

/** The figures the page fills in from the chosen bike and the finder's targets for one end. */
export function formFiguresFromBike(end: SagCheckForm['end'], bike: BikeOnPage, load: Pick<SagLoadContext, 'targets'> | null): Partial<SagCheckForm> {
  const t = load ? (end === 'rear' ? load.targets.shock : load.targets.fork) : undefined;
  const out: Partial<SagCheckForm> = t ? { staticTarget: t.staticSagMm, riderTarget: t.riderSagMm, tolerance: t.staticSagToleranceMm ?? null } : {};
  if (!bike) return out;
  return end === 'rear' ? { ...out, leverage: bike.rearLeverageRatio, pitch: bike.rearAdjusterPitchMm } : { ...out, forkAngle: bike.forkAngleDeg, pitch: bike.forkAdjusterPitchMm };
}

/**
 * The sag-check input from the page's fields through the one rule a saved bike's check uses (`sagCheckInputForBike`):
 * the bike's figures as the rider left them, the finder's wheel loads when a load was entered. Null until enough is typed.
 */
export function sagInputFromForm(f: SagCheckForm, bike: BikeOnPage, load: SagLoadContext | null): SagCheckInput | null {
  const reading = (single: number | null, down: number | null, up: number | null) => {
    if (!f.pairs) return num(single);
    const d = num(down);
    const u = num(up);
    return d === undefined || u === undefined ? undefined : { down: d, up: u };
  };
  const extendedMm = num(f.extended);
  const staticMm = reading(f.own, f.ownDown, f.ownUp);
  const riderMm = reading(f.rider, f.riderDown, f.riderUp);
  const staticSagMm = num(f.staticTarget);
  const riderSagMm = num(f.riderTarget);
  if (extendedMm === undefined || staticMm === undefined || riderMm === undefined || staticSagMm === undefined || riderSagMm === undefined) return null;
  const curve = f.end === 'rear' && bike?.rearLeverageCurve?.length ? bike.rearLeverageCurve : null;
  const leverage = num(f.leverage);
  if (f.end === 'rear' && !curve && leverage === undefined) return null;
  const tolerance = num(f.tolerance);
  const targets = { staticSagMm, riderSagMm, ...(tolerance ? { staticSagToleranceMm: tolerance } : {}) };
  const figures: BikeFigures = {
    rearLeverageRatio: leverage ?? null,
    rearLeverageCurve: curve,
    rearAdjusterPitchMm: f.end === 'rear' ? (num(f.pitch) ?? null) : null,
    shockCount: bike?.shockCount ?? 1,
    forkAngleDeg: num(f.forkAngle) ?? 0,
    forkAdjusterPitchMm: f.end === 'front' ? (num(f.pitch) ?? null) : null,
    forkSpringCount: bike?.forkSpringCount ?? 2,
  };
  return sagCheckInputForBike(figures, { ...load, targets: { fork: targets, shock: targets } }, { end: f.end, extendedMm, staticMm, riderMm });
}

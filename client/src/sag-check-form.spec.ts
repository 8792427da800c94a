import { describe, expect, it } from 'vitest';
import { sagCheckInputForBike, type SagLoadContext, type SagReadings } from '@shared/bikes/bike-sag-input';
import { checkSag } from '@shared/engine';
import { formFiguresFromBike, sagInputFromForm, type SagCheckForm } from './sag-check-form';

// Invented demo figures (typical of a mid-size bike, from memory), as in the saved bike's own sag-input test.
const bike = { rearLeverageRatio: 2.5, rearLeverageCurve: null, rearAdjusterPitchMm: 1.5, shockCount: 1, forkAngleDeg: 26, forkAdjusterPitchMm: 1, forkSpringCount: 2 };
const curved = { ...bike, rearLeverageRatio: null, rearLeverageCurve: [{ wheelTravelMm: 0, ratio: 2.8 }, { wheelTravelMm: 130, ratio: 2.2 }] };
const load: SagLoadContext = {
  targets: { fork: { staticSagMm: 25, riderSagMm: 60, staticSagToleranceMm: 3 }, shock: { staticSagMm: 20, riderSagMm: 55, staticSagToleranceMm: 4 } },
  fork: { bikeLoadN: 1100, frontLoadN: 1500 },
  shock: { bikeLoadN: 1000, rearLoadN: 1700 },
};

const empty: Omit<SagCheckForm, 'end'> = {
  pairs: false, extended: null, own: null, ownDown: null, ownUp: null, rider: null, riderDown: null, riderUp: null,
  staticTarget: null, riderTarget: null, tolerance: null, leverage: null, pitch: null, forkAngle: null,
};

/** The page's fields as a rider fills them for a chosen bike: the bike's figures as filled in, the readings typed. */
function typed(r: SagReadings, b: typeof bike | typeof curved): SagCheckForm {
  const pairs = typeof r.staticMm !== 'number';
  const split = (v: SagReadings['staticMm']) => (typeof v === 'number' ? { one: v, down: null, up: null } : { one: null, down: v.down, up: v.up });
  const own = split(r.staticMm);
  const rider = split(r.riderMm);
  return {
    ...empty,
    ...formFiguresFromBike(r.end, b, load),
    end: r.end,
    pairs,
    extended: r.extendedMm,
    own: own.one, ownDown: own.down, ownUp: own.up,
    rider: rider.one, riderDown: rider.down, riderUp: rider.up,
  };
}

describe('the sag-check page and a saved bike’s check build one input', () => {
  const cases: [string, SagReadings, typeof bike | typeof curved][] = [
    ['rear, one reading each', { end: 'rear', extendedMm: 600, staticMm: 580, riderMm: 545 }, bike],
    ['rear on a falling curve', { end: 'rear', extendedMm: 600, staticMm: 578, riderMm: 540 }, curved],
    ['front, pushed down and let up', { end: 'front', extendedMm: 800, staticMm: { down: 772, up: 778 }, riderMm: { down: 738, up: 744 } }, bike],
  ];
  it.each(cases)('%s: the page’s input is the server’s, and so is the verdict', (_what, readings, b) => {
    const server = sagCheckInputForBike(b, load, readings);
    const page = sagInputFromForm(typed(readings, b), b, load);
    expect(page).toEqual(server);
    expect(checkSag(page!)).toEqual(checkSag(server));
  });

  it('waits for every reading and target before it checks anything', () => {
    const form = typed({ end: 'rear', extendedMm: 600, staticMm: 580, riderMm: 545 }, bike);
    expect(sagInputFromForm({ ...form, rider: null }, bike, load)).toBeNull();
    expect(sagInputFromForm({ ...form, leverage: null }, bike, load)).toBeNull();
    expect(sagInputFromForm({ ...form, pairs: true, riderDown: 540 }, bike, load)).toBeNull();
  });

  it('without a bike or a load, checks the figures the rider typed and the engine’s own tolerance', () => {
    const input = sagInputFromForm({ ...empty, end: 'rear', extended: 600, own: 580, rider: 545, staticTarget: 20, riderTarget: 55, leverage: 2.5, pitch: 1 }, null, null);
    expect(input).toEqual({ end: 'rear', extendedMm: 600, staticMm: 580, riderMm: 545, targets: { staticSagMm: 20, riderSagMm: 55 }, leverageRatio: 2.5, adjusterPitchMm: 1, shockCount: 1 });
  });
});

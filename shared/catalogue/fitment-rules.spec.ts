import { describe, expect, it } from 'vitest';
import { fitmentProblems, fitmentWarnings, sprungFromWet, sprungFromWetOrNull, strokeUse, type FitmentRuleFields } from './fitment-rules';

const complete = (over: Partial<FitmentRuleFields> = {}): FitmentRuleFields => ({
  yearFrom: 2019,
  yearTo: 2023,
  massInput: 'sprung',
  loadStations: [{ station: 'rider' }, { station: 'passenger' }],
  rearLeverageRatio: 2.6,
  rearLeverageCurve: null,
  rearWheelTravelMm: 200,
  shockStrokeMm: 77,
  rearPreloadMinMm: 2,
  rearPreloadMaxMm: 22,
  forkPreloadMinMm: 0,
  forkPreloadMaxMm: 20,
  shockSpringFreeLengthMinMm: 180,
  shockSpringFreeLengthMaxMm: 200,
  forkSpringFreeLengthMinMm: 440,
  forkSpringFreeLengthMaxMm: 480,
  forkTravelMm: 210,
  sag: {
    front: { unit: 'mm', road: { static: 30, rider: 50 } },
    rear: { unit: 'pct', road: { static: 10, rider: 30 } },
  },
  ...over,
});

describe('fitment rules across fields', () => {
  describe('a leverage curve no spring can meet', () => {
    // The rider seat at 760 mm of a 1520 mm wheelbase, 90 kg sprung on the rear, rear sag 20 → 55 mm on 200 mm of travel.
    const withCurve = (curve: { wheelTravelMm: number; ratio: number }[], over: Partial<FitmentRuleFields> = {}) =>
      complete({
        rearLeverageRatio: null,
        rearLeverageCurve: curve,
        rearSprungMassKg: 90,
        wheelbaseMm: 1520,
        loadStations: [{ station: 'rider', positionMm: 760 }],
        sag: { rear: { unit: 'mm', road: { static: 20, rider: 55 } } },
        // The stroke is left blank so only the curve's own rule speaks.
        shockStrokeMm: null,
        ...over,
      });

    it('is named on the curve when it falls so steeply that the shock must push less at rider sag than at static sag', () => {
      // LR(20) = 2.79, LR(55) = 1.54: 1.54 × (883 N + a 20 kg rider's 98 N) < 2.79 × 883 N.
      const p = fitmentProblems(withCurve([{ wheelTravelMm: 0, ratio: 3.5 }, { wheelTravelMm: 70, ratio: 1 }, { wheelTravelMm: 200, ratio: 1 }]));
      expect(p.rearLeverageCurve).toMatch(/road sag targets.*falls too steeply/);
    });

    it('lets a usual falling (progressive) curve through, and waits while the form lacks what it needs', () => {
      expect(fitmentProblems(withCurve([{ wheelTravelMm: 0, ratio: 2.8 }, { wheelTravelMm: 200, ratio: 2.2 }])).rearLeverageCurve).toBeUndefined();
      const steep = [{ wheelTravelMm: 0, ratio: 3.5 }, { wheelTravelMm: 70, ratio: 1 }];
      expect(fitmentProblems(withCurve(steep, { rearSprungMassKg: null })).rearLeverageCurve).toBeUndefined();
      expect(fitmentProblems(withCurve(steep, { loadStations: [{ station: 'rider', positionMm: null }] })).rearLeverageCurve).toBeUndefined();
    });

    it('in wet-mass mode reads the derived rear sprung mass', () => {
      const wet = { massInput: 'wet' as const, rearSprungMassKg: null, wetMassKg: 200, frontStaticSharePct: 50, frontUnsprungMassKg: 15, rearUnsprungMassKg: 10 };
      expect(fitmentProblems(withCurve([{ wheelTravelMm: 0, ratio: 3.5 }, { wheelTravelMm: 70, ratio: 1 }], wet)).rearLeverageCurve).toMatch(/falls too steeply/);
    });
  });

  it('a consistent fitment has no problems', () => {
    expect(fitmentProblems(complete())).toEqual({});
  });

  it('years, preload and free-length windows out of order are each named on their upper field', () => {
    expect(fitmentProblems(complete({ yearTo: 2018, rearPreloadMaxMm: 1, forkSpringFreeLengthMaxMm: 400 }))).toEqual({
      yearTo: 'The last year is not before the first.',
      rearPreloadMaxMm: 'The maximum is not below the minimum.',
      forkSpringFreeLengthMaxMm: 'The longest is not below the shortest.',
    });
  });

  it('a blank number skips only the rules that need it, so a half-filled form is not told off for what it has not typed', () => {
    const p = fitmentProblems(complete({ yearFrom: null, shockStrokeMm: null, forkPreloadMaxMm: null, rearPreloadMaxMm: 1 }));
    expect(p).toEqual({ rearPreloadMaxMm: 'The maximum is not below the minimum.' });
  });

  it('a rider sag in percent counts against that end’s travel: 60 % of the rear travel is too deep', () => {
    const p = fitmentProblems(complete({ sag: { rear: { unit: 'pct', road: { static: 20, rider: 60 } } } }));
    expect(p['sag.rear.road.rider']).toBe('Rider sag is less than 60 % of the travel.');
  });

  describe('wheel travel, leverage and stroke agree', () => {
    it('a ratio that asks more than the stroke at full travel is refused on the ratio: 210 mm ÷ 2.6 = 80.8 mm of a 76 mm stroke', () => {
      const p = fitmentProblems(complete({ rearWheelTravelMm: 210, rearLeverageRatio: 2.6, shockStrokeMm: 76 }));
      expect(p.rearLeverageRatio).toMatch(/moves the shock 80\.8 mm, more than its 76 mm stroke/);
      // 210 ÷ 2.76 = 76.1 mm: within the 1 % allowed for rounding in makers' figures.
      expect(fitmentProblems(complete({ rearWheelTravelMm: 210, rearLeverageRatio: 2.76, shockStrokeMm: 76 })).rearLeverageRatio).toBeUndefined();
    });

    it('a curve is judged by ∫ ds / LR over the travel, which a midpoint sum of 20,000 steps agrees with to 0.01 mm', () => {
      const curve = [{ wheelTravelMm: 0, ratio: 3.3 }, { wheelTravelMm: 150, ratio: 3.0 }, { wheelTravelMm: 290, ratio: 2.6 }];
      const lr = (s: number) => (s <= 150 ? 3.3 - (0.3 * s) / 150 : 3.0 - (0.4 * (s - 150)) / 140);
      let sum = 0;
      for (let i = 0; i < 20_000; i++) sum += 290 / 20_000 / lr(((i + 0.5) * 290) / 20_000);
      const use = strokeUse({ rearLeverageRatio: null, rearLeverageCurve: curve, rearWheelTravelMm: 290, shockStrokeMm: 100 })!;
      expect(Math.abs(use.shockTravelMm - sum)).toBeLessThan(0.01);
      expect(fitmentProblems(complete({ rearLeverageRatio: null, rearLeverageCurve: curve, rearWheelTravelMm: 290, shockStrokeMm: 100 })).rearLeverageCurve).toBeUndefined();
      expect(fitmentProblems(complete({ rearLeverageRatio: null, rearLeverageCurve: curve, rearWheelTravelMm: 290, shockStrokeMm: 95 })).rearLeverageCurve).toMatch(/more than its 95 mm stroke/);
    });

    it('more than 15 % of the stroke unused is a warning, not a refusal', () => {
      const loose = complete({ rearWheelTravelMm: 200, rearLeverageRatio: 2.6, shockStrokeMm: 95 });
      expect(fitmentProblems(loose).shockStrokeMm).toBeUndefined();
      expect(fitmentWarnings(loose).shockStrokeMm).toMatch(/uses 76\.9 of its 95 mm stroke \(81 %\)/);
      expect(fitmentWarnings(complete({ rearWheelTravelMm: 200, rearLeverageRatio: 2.6, shockStrokeMm: 80 })).shockStrokeMm).toBeUndefined();
    });

    it('waits while a figure is blank', () => {
      expect(fitmentProblems(complete({ shockStrokeMm: 30, rearLeverageRatio: null }))).toEqual({});
    });
  });

  describe('load stations against the wheelbase', () => {
    const stations = (rider: number, passenger: number) => complete({ wheelbaseMm: 1500, loadStations: [{ station: 'rider', positionMm: rider }, { station: 'passenger', positionMm: passenger }] });

    it('a rider seat at or behind the rear axle, or at the front axle, is refused', () => {
      expect(fitmentProblems(stations(1500, 1600))['loadStations.0.positionMm']).toMatch(/between the axles/);
      expect(fitmentProblems(stations(0, 1200))['loadStations.0.positionMm']).toMatch(/between the axles/);
      expect(fitmentProblems(stations(870, 1200))).toEqual({});
    });

    it('a passenger at or ahead of the rider is refused on the passenger seat', () => {
      expect(fitmentProblems(stations(870, 870))).toEqual({ 'loadStations.1.positionMm': "The passenger sits behind the rider, further back than the rider's 870 mm." });
    });
  });

  it('the stock fork preload lies within the fork preload range', () => {
    expect(fitmentProblems(complete({ forkStockPreloadMm: 25 })).forkStockPreloadMm).toBe('The stock preload lies within the fork preload range.');
    expect(fitmentProblems(complete({ forkStockPreloadMm: 12 })).forkStockPreloadMm).toBeUndefined();
  });

  it('a fork without an adjuster and no stock spacer is a warning', () => {
    expect(fitmentWarnings({ ...complete(), forkAdjusterPitchMm: null, forkStockSpacerMm: null }).forkStockSpacerMm).toMatch(/spacer/);
    expect(fitmentWarnings({ ...complete(), forkAdjusterPitchMm: null, forkStockSpacerMm: 110 }).forkStockSpacerMm).toBeUndefined();
  });

  it('a leverage curve must rise in wheel travel, and blank points wait', () => {
    const curve = [{ wheelTravelMm: 0 }, { wheelTravelMm: 60 }, { wheelTravelMm: 60 }, { wheelTravelMm: null }];
    expect(fitmentProblems(complete({ rearLeverageRatio: null, rearLeverageCurve: curve }))).toEqual({ 'rearLeverageCurve.2.wheelTravelMm': 'Points go in increasing wheel travel.' });
  });

  it('a bike without a rider seat, or with a station twice, is refused', () => {
    expect(fitmentProblems(complete({ loadStations: [{ station: 'passenger' }, { station: 'passenger' }] }))).toEqual({
      'loadStations.1.station': 'Each station appears once.',
      loadStations: 'The rider seat is needed.',
    });
  });

  it('wet mass that leaves under 20 kg sprung at an end names that end’s unsprung mass', () => {
    const wet = complete({ massInput: 'wet', wetMassKg: 100, frontStaticSharePct: 30, frontUnsprungMassKg: 15, rearUnsprungMassKg: 20 });
    // 100 kg × 30 % − 15 kg = 15 kg front; 100 × 70 % − 20 = 50 kg rear.
    expect(fitmentProblems(wet)).toEqual({ frontUnsprungMassKg: 'This leaves less than 20 kg sprung on the front.' });
  });
});

describe('sprung mass from wet mass', () => {
  it('splits the wet mass by the static front share and takes off each end’s unsprung mass', () => {
    expect(sprungFromWet(200, 50, 15, 20)).toEqual({ frontSprungMassKg: 85, rearSprungMassKg: 80 });
  });

  it('waits for all four numbers on a form', () => {
    expect(sprungFromWetOrNull({ wetMassKg: 200, frontStaticSharePct: null, frontUnsprungMassKg: 15, rearUnsprungMassKg: 20 })).toBeNull();
    expect(sprungFromWetOrNull({ wetMassKg: 200, frontStaticSharePct: 50, frontUnsprungMassKg: 15, rearUnsprungMassKg: 20 })).toEqual({ frontSprungMassKg: 85, rearSprungMassKg: 80 });
  });
});

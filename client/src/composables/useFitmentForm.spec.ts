import { describe, expect, it } from 'vitest';
import type { FitmentDto } from '@shared/catalogue/fitment.dto';
import { fitmentProblems, fitmentWarnings } from '@shared/catalogue/fitment-rules';
import { checkFitmentDraft, draftFromFitment, fitmentDraftWarnings, fitmentInputFromDraft } from './useFitmentForm';

// An invented mid-size adventure bike as the API answers it.
const saved = {
  id: '00000000-0000-4000-8000-000000000001', make: 'Corvane', model: 'Ridgeline 800', variant: '', yearFrom: 2019, yearTo: 2022, updatedAt: '2026-01-01T00:00:00.000Z',
  massInput: 'sprung', frontSprungMassKg: 92, rearSprungMassKg: 89, wetMassKg: null, frontStaticSharePct: null, frontUnsprungMassKg: null, rearUnsprungMassKg: null,
  ratedLoadKg: 215, wheelbaseMm: 1540,
  loadStations: [{ station: 'rider', positionMm: 924, maxLoadKg: 150 }, { station: 'passenger', positionMm: 1263, maxLoadKg: 110 }],
  rearLeverageRatio: 2.52, rearLeverageCurve: null, rearWheelTravelMm: 210, shockStrokeMm: 86, shockCount: 1,
  rearPreloadMinMm: 4, rearPreloadMaxMm: 26, rearAdjusterPitchMm: 1.5, shockSpringInnerDiameterMm: 61, shockSpringFreeLengthMinMm: 280, shockSpringFreeLengthMaxMm: 300,
  forkAngleDeg: 27, forkTravelMm: 210, forkSpringCount: 2, forkPreloadMinMm: 12, forkPreloadMaxMm: 30, forkAdjusterPitchMm: 1, forkStockSpacerMm: null, forkStockPreloadMm: 18,
  forkSpringInnerDiameterMm: 29, forkSpringFreeLengthMinMm: 510, forkSpringFreeLengthMaxMm: 530,
  sag: {
    front: { unit: 'mm', road: { static: 33, rider: 57 }, adventure: { static: 36, rider: 61 }, offRoad: { static: 39, rider: 65 } },
    rear: { unit: 'mm', road: { static: 16, rider: 61 }, adventure: { static: 19, rider: 65 }, offRoad: { static: 22, rider: 69 } },
  },
  frontStaticSagToleranceMm: 6, rearStaticSagToleranceMm: 6,
  stockForkRateNPerMm: 6.8, stockForkFreeLengthMm: 520, stockShockRateNPerMm: 70, stockShockFreeLengthMm: 290,
  stockForkRate: { nPerMm: 6.8, kgfPerMm: 0.69, lbfPerIn: 38.8 }, stockShockRate: { nPerMm: 70, kgfPerMm: 7.14, lbfPerIn: 399.7 },
  torques: [], tools: [], notes: '',
} as unknown as FitmentDto;

describe('the staff fitment form runs the server’s own consistency rule', () => {
  it('a saved fitment comes back into the form with its tolerances, shock count and stock fork preload, and has nothing to flag', () => {
    const d = draftFromFitment(saved);
    expect({ t: d.rearStaticSagToleranceMm, n: d.shockCount, p: d.forkStockPreloadMm }).toEqual({ t: 6, n: 1, p: 18 });
    expect(checkFitmentDraft(d)).toEqual({});
    expect(fitmentDraftWarnings(d)).toEqual({});
  });

  it('the form’s messages for a stroke too short, a passenger ahead of the rider and an unused stroke are the API’s, word for word', () => {
    const short = draftFromFitment(saved);
    short.shockStrokeMm = 70;
    short.stations.passenger.positionMm = 900;
    const server = fitmentProblems(fitmentInputFromDraft(short));
    expect(server.rearLeverageRatio).toMatch(/83\.3 mm, more than its 70 mm stroke/);
    expect(checkFitmentDraft(short)).toMatchObject({ rearLeverageRatio: server.rearLeverageRatio, 'loadStations.1.positionMm': server['loadStations.1.positionMm'] });

    const loose = draftFromFitment(saved);
    loose.shockStrokeMm = 110;
    expect(fitmentDraftWarnings(loose)).toEqual(fitmentWarnings(fitmentInputFromDraft(loose)));
    expect(fitmentDraftWarnings(loose).shockStrokeMm).toMatch(/76 %/);
  });
});

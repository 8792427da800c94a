import { describe, expect, it } from 'vitest';
import type { BikeDto } from '@shared/bikes';
import { planFromBike, saveBodyFrom } from './bike-plan';

const bike = {
  fitmentId: '5b0e4c62-2f6c-4f3e-9a55-1d3f0f1b2c3d',
  ridingStyle: 'adventure',
  load: { rider: { massKg: 95, gearKg: 8 }, luggage: [{ station: 'panniers', massKg: 20 }] },
  cases: [{ name: 'two-up touring', rider: { massKg: 95, gearKg: 8 }, passengerKg: 70, luggage: [] }],
  forkSpring: { id: 'f-1', name: 'Fork 9', sku: 'F9', rateNPerMm: 9 },
  shockSpring: null,
} as unknown as BikeDto;

describe('a saved bike and the finder’s plan', () => {
  it('reopens the finder with the saved bike, load, cases and springs', () => {
    expect(planFromBike(bike)).toEqual({
      fitmentId: bike.fitmentId,
      ridingStyle: 'adventure',
      riderKg: 95,
      gearKg: 8,
      passengerKg: null,
      luggageKg: { panniers: 20 },
      chosenForkId: 'f-1',
      chosenShockId: null,
      cases: [{ name: 'two-up touring', riderKg: 95, gearKg: 8, passengerKg: 70, luggageKg: {} }],
    });
  });

  it('a bike whose fitment the shop removed cannot reopen the finder', () => {
    expect(planFromBike({ ...bike, fitmentId: null })).toBeNull();
  });

  it('saves what the finder would send, so the saved load and the recommendation agree', () => {
    const request = { fitmentId: bike.fitmentId!, ridingStyle: 'adventure' as const, rider: { massKg: 95, gearKg: 8 }, luggage: [{ station: 'panniers' as const, massKg: 20 }] };
    const body = saveBodyFrom('Big trips', request, [], { fork: 'f-1', shock: null });
    expect(body).toEqual({ nickname: 'Big trips', fitmentId: bike.fitmentId, ridingStyle: 'adventure', load: { rider: { massKg: 95, gearKg: 8 }, luggage: [{ station: 'panniers', massKg: 20 }] }, forkSpringId: 'f-1' });
    // And back again: the plan rebuilt from what was saved has the same load.
    const again = planFromBike({ ...bike, load: body.load as BikeDto['load'], cases: [], shockSpring: null });
    expect([again?.riderKg, again?.gearKg, again?.luggageKg]).toEqual([95, 8, { panniers: 20 }]);
  });
});

import { describe, expect, it } from 'vitest';
import type { SpringBikeFitDto } from '../../shared/catalogue';
import { fitmentInput } from '../test/catalogue-factories';
import { shopWithSprings } from '../test/commerce-factories';
import { testApp } from '../test/factories';

describe('the bikes a spring fits', () => {
  it('lists each bike a spring fits with the adapters it needs there, and follows the staff override', async () => {
    const t = testApp();
    const { staff, fitment, shocks, adapter, needsAdapter } = await shopWithSprings(t);
    // A second bike whose shock spring window the test springs miss (a narrower seat).
    const other = (await t.http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput({ model: 'Other 500', shockSpringInnerDiameterMm: 50 })).expect(201)).body;
    await needsAdapter(shocks[1]!.id);
    const bikes = async (id: string) => ((await t.http.get(`/api/products/${id}/bikes`).expect(200)).body.items as SpringBikeFitDto[]);

    const fits = await bikes(shocks[1]!.id);
    expect(fits.map((b) => b.fitmentId)).toEqual([fitment.id]);
    expect(fits[0]).toMatchObject({ make: fitment.make, model: fitment.model, yearFrom: fitment.yearFrom });
    expect(fits[0]!.adapters).toMatchObject([{ id: adapter.id, quantity: 1, priceCents: 1_200 }]);
    expect((await bikes(shocks[0]!.id))[0]!.adapters).toEqual([]);

    // Staff say it fits the other bike after all: it is listed there too.
    await t.http.put(`/api/staff/fitments/${other.id}/springs/${shocks[0]!.id}/override`).set(staff.auth).send({ fits: true, note: 'checked on the bench' }).expect(200);
    expect((await bikes(shocks[0]!.id)).map((b) => b.model).sort()).toEqual([fitment.model, 'Other 500'].sort());
    // Parts that are not springs fit no bike by this measure; an unknown id is a 404.
    expect(await bikes(adapter.id)).toEqual([]);
    expect((await t.http.get('/api/products/00000000-0000-4000-8000-000000000000/bikes')).status).toBe(404);
  });
});
